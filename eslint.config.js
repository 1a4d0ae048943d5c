import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import pluginQuery from '@tanstack/eslint-plugin-query';
import globals from 'globals';

export default tseslint.config(
  { ignores: ['dist', 'node_modules', '.data', 'coverage', 'tests/.screenshots', 'tests/.artifacts'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/consistent-type-imports': 'error',
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks, '@tanstack/query': pluginQuery },
    rules: {
      ...reactHooks.configs.recommended.rules,
      ...pluginQuery.configs.recommended.rules,
    },
  },
  {
    // The shared core is pure: no React, DOM, Node built-ins, database or HTTP.
    files: ['src/shared/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [
          { group: ['react', 'react-*', 'react/*', '@tanstack/*'], message: 'src/shared is pure: no React.' },
          { group: ['node:*', 'fs', 'path', 'http', 'crypto'], message: 'src/shared is pure: no Node built-ins.' },
          { group: ['knex', 'pg', 'express', 'stripe', 'nodemailer'], message: 'src/shared is pure: no I/O.' },
          { group: ['**/server/**', '**/features/**', '**/components/**'], message: 'src/shared imports nothing outside itself.' },
        ],
      }],
      'no-restricted-globals': ['error', 'window', 'document', 'fetch', 'localStorage', 'process'],
    },
  },
  {
    // Features do not import each other; routes in src/app assemble them.
    files: ['src/features/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [{ group: ['**/features/*/**', '!./**', '!../**'], message: 'Import across features through src/app, not directly.' }],
      }],
    },
  },
);
