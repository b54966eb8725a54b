import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import svelte from 'eslint-plugin-svelte';
import globals from 'globals';
import { layeringRule } from './eslint.layering.js';

const layering = { rules: { layering: layeringRule } };

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', 'e2e-output/**', 'test-results/**', 'playwright-report/**', 'bench-output/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  ...svelte.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node } },
    plugins: { meridian: layering },
    rules: {
      'meridian/layering': 'error',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/consistent-type-imports': 'error',
    },
  },
  {
    files: ['**/*.svelte', '**/*.svelte.ts'],
    languageOptions: { parserOptions: { parser: tseslint.parser, extraFileExtensions: ['.svelte'] } },
  },
  {
    files: ['renderer/**'],
    languageOptions: { globals: { ...globals.browser, ...globals.worker } },
    rules: {
      'no-restricted-properties': ['error',
        { object: 'window', property: 'require', message: 'The renderer never reaches Node; use the shell bridge.' },
        { object: 'globalThis', property: 'require', message: 'The renderer never reaches Node; use the shell bridge.' },
      ],
    },
  },
  {
    files: ['core/**', 'unit/**'],
    rules: {
      // Published constants and reference values are written with every digit their source
      // prints, so a reader can compare them with the source; the double rounding them is intended.
      'no-loss-of-precision': 'off',
      '@typescript-eslint/no-loss-of-precision': 'off',
    },
  },
  {
    files: ['core/**'],
    languageOptions: { globals: {} },
    rules: {
      'no-restricted-globals': ['error',
        ...['window', 'document', 'navigator', 'process', 'Buffer', 'require', '__dirname', 'Date', 'localStorage', 'indexedDB', 'fetch']
          .map((name) => ({ name, message: `core/ is platform-free: "${name}" belongs to a platform layer (time in core is a two-part Julian date).` })),
      ],
    },
  },
);
