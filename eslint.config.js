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

export default tseslint.config(
  { ignores: ['node_modules/**', 'dist/**', 'release/**', 'coverage/**', 'test/fixtures/generated/**', 'test/artifacts/**'] },
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/consistent-type-imports': 'error',
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
  {
    files: ['renderer/**/*.{ts,tsx}'],
    ignores: ['renderer/vite.config.ts'],
    rules: layer('renderer/ draws state: it may import core/ and the API contract, never node, electron, sharp or app/.',
      ['electron', 'sharp', ...nodeBuiltins], ['**/app/**', 'core/io', '**/core/io', '**/core/io/**']),
  },
  {
    files: ['app/preload/**/*.ts'],
    rules: layer('The preload may import only electron and the API contract.',
      ['sharp', 'react', 'react-dom', ...nodeBuiltins], ['**/renderer/**', '**/core/!(contract)/**', '**/core/!(contract)']),
  },
  {
    files: ['app/**/*.ts'],
    ignores: ['app/preload/**'],
    rules: layer('app/ may import core/ but never react or renderer/.', ['react', 'react-dom'], ['**/renderer/**']),
  },
);
