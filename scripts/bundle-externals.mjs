// How the CommonJS Electron bundles treat npm packages: shared by scripts/build.mjs and the bundle test.

/** Packages that ship only ES modules (no "require" export): the CommonJS Electron bundles must include them. */
export const ESM_ONLY = /^(zarrita|numcodecs|@zarrita\/[^/]+)(\/|$)/;

/** esbuild plugin: every bare import stays external (loaded from node_modules at run time) except the ESM-only packages. */
export const externalExceptEsmOnly = {
  name: 'external-except-esm-only',
  setup(b) {
    b.onResolve({ filter: /^[^./]/ }, (args) => (ESM_ONLY.test(args.path) ? undefined : { path: args.path, external: true }));
  },
};
