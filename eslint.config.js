// Lint rules, including the layer boundaries of ../shared/design.md:
// core/ imports neither Node, the DOM world, Electron, React nor main/ or renderer/;
// main/ and renderer/ meet only through core/ and use each core folder's public face (index).
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import globals from 'globals';

const nodeBuiltins = ['node:*', 'fs', 'fs/*', 'path', 'os', 'child_process', 'worker_threads', 'crypto', 'stream', 'url', 'util', 'buffer', 'process'];
const uiPackages = ['react', 'react-dom', 'react-dom/*', 'react/*', 'konva', 'konva/*', 'react-konva'];

export default tseslint.config(
  { ignores: ['node_modules/**', 'dist/**', 'dist-web/**', 'out/**', 'coverage/**', 'test-output/**', '.tmp/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  {
    files: ['core/**/*.ts'],
    languageOptions: { globals: {} },
    rules: {
      'no-restricted-imports': ['error', {
        paths: ['electron'],
        patterns: [
          { group: [...nodeBuiltins, ...uiPackages], message: 'core/ is pure TypeScript: no Node, DOM, Electron or UI packages (design.md, Layers).' },
          { group: ['**/main/**', '**/renderer/**', '../../*'], message: 'core/ depends on neither main/ nor renderer/.' },
          { group: ['../*/*'], message: 'Import another core folder through its index (e.g. "../dsp"), not a deep path.' },
        ],
      }],
    },
  },
  {
    files: ['renderer/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    rules: {
      'no-restricted-imports': ['error', {
        paths: ['electron'],
        patterns: [
          { group: nodeBuiltins, message: 'renderer/ runs in a browser: no Node modules.' },
          { group: ['**/main/**'], message: 'renderer/ and main/ meet only through core/contract.' },
          { group: ['**/core/*/*'], message: 'Import a core folder through its index (e.g. "../core/dsp").' },
        ],
      }],
    },
  },
  {
    files: ['main/**/*.ts'],
    languageOptions: { globals: { ...globals.node } },
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [
          { group: uiPackages, message: 'main/ has no UI: React and Konva live in renderer/.' },
          { group: ['**/renderer/**'], message: 'main/ and renderer/ meet only through core/contract.' },
          { group: ['**/core/*/*'], message: 'Import a core folder through its index (e.g. "../core/audio").' },
        ],
      }],
    },
  },
  {
    // Math.max(...list) passes every element as an argument and overflows the call stack on long lists.
    files: ['core/**/*.ts', 'main/**/*.ts', 'renderer/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-syntax': ['error', {
        selector: "CallExpression[callee.object.name='Math'][callee.property.name=/^(max|min)$/] > SpreadElement",
        message: 'Math.max/Math.min(...list) overflows the call stack on long lists; use maxOf/minOf from core/units.',
      }],
    },
  },
  {
    files: ['test/**/*.{ts,tsx}', 'bench/**/*.ts', 'scripts/**/*.{js,mjs}', 'assets/**/*.{mjs,ts}', '*.{js,ts,mjs}'],
    languageOptions: { globals: { ...globals.node } },
  },
);
