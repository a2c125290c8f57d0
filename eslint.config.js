// Lint: TypeScript basics plus the import directions between layers (see DEVELOPERS.md).
import tseslint from 'typescript-eslint';
import globals from 'globals';
import { builtinModules } from 'node:module';

const nodeBuiltins = [...builtinModules, ...builtinModules.map((m) => `node:${m}`)];
const layer = (message, names, patterns = []) => ({
  'no-restricted-imports': ['error', {
    paths: names.map((name) => ({ name, message })),
    patterns: patterns.map((group) => ({ group: [group], message })),
  }],
});

// Directions between core folders (the data flow of DEVELOPERS.md, lower layers first): each folder lists the core folders
// it may import. A folder missing here is not yet checked; add it when you add the folder.
const coreMayImport = {
  model: [],
  csv: [],
  settings: ['model'],
  stats: ['model'],
  contract: ['model', 'settings'],
  tiff: ['model'],
  zarr: ['model'],
  io: ['model', 'tiff', 'zarr'],
  image: ['model', 'settings', 'stats'],
  fit: ['model', 'settings', 'stats'],
  geometry: ['model', 'settings', 'stats', 'image'],
  profile: ['model', 'settings', 'stats', 'image', 'geometry', 'fit'],
  pipeline: ['model', 'settings', 'stats', 'image', 'geometry', 'fit', 'profile'],
  synth: ['model', 'settings', 'stats', 'image', 'tiff', 'fit', 'timelapse'],
  batch: ['model', 'settings', 'stats', 'csv', 'contract'],
  shard: ['model', 'settings', 'stats', 'csv', 'batch'],
  cohort: ['model', 'settings', 'stats', 'csv', 'geometry', 'fit', 'profile'],
  timelapse: ['model', 'settings', 'stats', 'fit'],
  figures: ['model', 'settings', 'stats', 'cohort'],
};
const coreDirection = (folder) => {
  const banned = Object.keys(coreMayImport).filter((f) => f !== folder && !coreMayImport[folder].includes(f));
  return layer(`core/${folder} may import only these core folders: ${coreMayImport[folder].join(', ') || 'none'} (see coreMayImport in eslint.config.js).`,
    ['electron', 'react', 'react-dom', 'sharp', ...(folder === 'io' ? [] : nodeBuiltins)],
    ['**/app/**', '**/renderer/**', ...banned.flatMap((f) => [`../${f}`, `../${f}/**`])]);
};

export default tseslint.config(
  { ignores: ['node_modules/**', 'dist/**', 'release/**', 'coverage/**', 'test/fixtures/generated/**', 'test/artifacts/**'] },
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/consistent-type-imports': 'error',
      // One spelling in names: "analyse" (analyseStack, analyseCohort), as in the documentation.
      'id-match': ['error', '^(?![\\s\\S]*[Aa]nalyz)', { properties: true, classFields: true, onlyDeclarations: false }],
    },
  },
  {
    files: ['core/**/*.ts'],
    ignores: ['core/io/**'],
    rules: layer('core/ is pure TypeScript: no electron, react, sharp, DOM-only or node built-ins (only core/io may use node:fs).',
      ['electron', 'react', 'react-dom', 'sharp', ...nodeBuiltins], ['**/app/**', '**/renderer/**']),
  },
  {
    files: ['core/io/**/*.ts'],
    rules: layer('core/io may use node built-ins but not electron, react, sharp, app/ or renderer/.',
      ['electron', 'react', 'react-dom', 'sharp'], ['**/app/**', '**/renderer/**']),
  },
  ...Object.keys(coreMayImport).map((folder) => ({
    files: [`core/${folder}/**/*.ts`],
    // Tests may use lower or higher folders (synthetic embryos, the pipeline) to check a step.
    ignores: ['core/**/*.test.ts', 'core/**/*.test-helper.ts'],
    rules: coreDirection(folder),
  })),
  {
    files: ['renderer/**/*.{ts,tsx}', 'test/e2e/**/*.ts'],
    languageOptions: { globals: { ...globals.browser } },
  },
  {
    files: ['renderer/**/*.{ts,tsx}'],
    ignores: ['renderer/vite.config.ts'],
    rules: layer('renderer/ draws state: it may import core/ and the API contract, never node, electron, sharp or app/.',
      ['electron', 'sharp', ...nodeBuiltins], ['**/app/**', 'core/io', '**/core/io', '**/core/io/**']),
  },
  {
    // Hooks, state, live measurement, overlays and the rest sit below the panels: only App.tsx and the panels themselves
    // import renderer/components (one rule object, as a later no-restricted-imports replaces an earlier one).
    files: ['renderer/**/*.{ts,tsx}'],
    ignores: ['renderer/vite.config.ts', 'renderer/components/**', 'renderer/App.tsx', 'renderer/main.tsx'],
    rules: layer('renderer/ draws state: it may import core/ and the API contract, never node, electron, sharp or app/; only App.tsx and renderer/components import renderer/components.',
      ['electron', 'sharp', ...nodeBuiltins], ['**/app/**', 'core/io', '**/core/io', '**/core/io/**', '../components', '../components/**', '**/renderer/components/**']),
  },
  {
    files: ['app/preload/**/*.ts'],
    rules: layer('The preload may import only electron and the API contract.',
      ['sharp', 'react', 'react-dom', ...nodeBuiltins], ['**/renderer/**', '**/core/!(contract)/**', '**/core/!(contract)']),
  },
  {
    files: ['app/**/*.ts'],
    ignores: ['app/preload/**', 'app/main/**'],
    // Only the Electron main process (app/main) wires the engine, the workers and the window together; the engine,
    // the workers, the batch, the command line and the rest never reach back into it.
    rules: layer('app/ may import core/ but never react or renderer/; only app/main imports app/main (shared code lives in app/engine).',
      ['react', 'react-dom'], ['**/renderer/**', '../main', '../main/**', '**/app/main/**']),
  },
  {
    files: ['app/main/**/*.ts'],
    rules: layer('app/ may import core/ but never react or renderer/.', ['react', 'react-dom'], ['**/renderer/**']),
  },
);
