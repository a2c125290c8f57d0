import type { Plugin } from 'esbuild';
/** Packages that ship only ES modules: bundled into the CommonJS Electron bundles. */
export declare const ESM_ONLY: RegExp;
/** Packages bundled into every bundle (many tiny CommonJS files that are slow to load one by one). */
export declare const BUNDLED: RegExp;
/** esbuild plugin for the ES-module Node bundles: bare imports stay external except the BUNDLED packages. */
export declare const externalExceptBundled: Plugin;
/** esbuild plugin: bare imports stay external except the ESM-only and the BUNDLED packages. */
export declare const externalExceptEsmOnly: Plugin;
