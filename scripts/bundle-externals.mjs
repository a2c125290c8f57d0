// How the bundles treat npm packages: shared by scripts/build.mjs and the bundle test.

/** Packages that ship only ES modules (no "require" export): the CommonJS Electron bundles must include them. */
export const ESM_ONLY = /^(zarrita|numcodecs|@zarrita\/[^/]+)(\/|$)/;

/**
 * Packages bundled into every bundle: the @stdlib statistics functions are hundreds of tiny CommonJS files, and
 * resolving and loading them from node_modules cost each batch worker about 0.3 s of CPU at start (measured with
 * node --cpu-prof); bundled, they are one parse.
 */
export const BUNDLED = /^@stdlib\//;

/**
 * Packages a batch worker still loads from node_modules: native addons (sharp, lzma-native) cannot be bundled, and
 * geotiff is imported only when a file needs it. Every other package is bundled into the worker: resolving and
 * loading them from node_modules (fast-xml-parser, ml-levenberg-marquardt, zarrita, …; CommonJS ones lexed for their
 * exports first) was most of a worker's start-up CPU.
 */
export const WORKER_EXTERNAL = /^(sharp|lzma-native|geotiff)(\/|$)/;

/** esbuild plugin for the batch worker's bundle: bare imports are bundled except WORKER_EXTERNAL. */
export const bundledExceptNative = {
  name: 'bundled-except-native',
  setup(b) {
    b.onResolve({ filter: /^[^./]/ }, (args) => (WORKER_EXTERNAL.test(args.path) ? { path: args.path, external: true } : undefined));
  },
};

/** esbuild plugin for the ES-module Node bundles: every bare import stays external except the BUNDLED packages. */
export const externalExceptBundled = {
  name: 'external-except-bundled',
  setup(b) {
    b.onResolve({ filter: /^[^./]/ }, (args) => (BUNDLED.test(args.path) ? undefined : { path: args.path, external: true }));
  },
};

/** esbuild plugin: every bare import stays external (loaded from node_modules at run time) except the ESM-only and
 *  the BUNDLED packages. */
export const externalExceptEsmOnly = {
  name: 'external-except-esm-only',
  setup(b) {
    b.onResolve({ filter: /^[^./]/ }, (args) => (ESM_ONLY.test(args.path) || BUNDLED.test(args.path) ? undefined : { path: args.path, external: true }));
  },
};
