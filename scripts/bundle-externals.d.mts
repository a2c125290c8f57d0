import type { Plugin } from 'esbuild';
/** Packages that ship only ES modules: bundled into the CommonJS Electron bundles. */
export declare const ESM_ONLY: RegExp;
/** esbuild plugin: bare imports stay external except the ESM-only packages. */
export declare const externalExceptEsmOnly: Plugin;
