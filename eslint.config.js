import tanstackQuery from '@tanstack/eslint-plugin-query';
import importPlugin from 'eslint-plugin-import';
import reactHooks from 'eslint-plugin-react-hooks';
import tseslint from 'typescript-eslint';

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', '.data/**', 'tests/artifacts/**', 'bench/tmp/**', 'coverage/**'] },
  ...tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx}'],
    plugins: { import: importPlugin },
    settings: { 'import/resolver': { node: true } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/no-non-null-assertion': 'off',
      '@typescript-eslint/no-unsafe-function-type': 'off',
      // The layering of STYLE.md: shared imports neither side; client and server never import each other.
      'import/no-restricted-paths': [
        'error',
        {
          zones: [
            { target: './shared', from: './src', message: 'shared/ must not import the client.' },
            { target: './shared', from: './server', message: 'shared/ must not import the server.' },
            { target: './src', from: './server', message: 'The client must not import the server.' },
            { target: './server', from: './src', message: 'The server must not import the client.' },
          ],
        },
      ],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks, '@tanstack/query': tanstackQuery },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'warn',
      '@tanstack/query/exhaustive-deps': 'error',
      '@tanstack/query/prefer-query-options': 'error',
    },
  },
  {
    files: ['shared/**/*.ts'],
    rules: {
      // Pure computation: no I/O modules.
      'no-restricted-imports': ['error', { patterns: ['node:*', 'fs', 'pg', 'typeorm', 'express', 'react', 'react-dom'] }],
    },
  },
);
