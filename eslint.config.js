import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import pluginQuery from '@tanstack/eslint-plugin-query';
import globals from 'globals';
import path from 'node:path';

const srcDir = path.resolve(import.meta.dirname, 'src');

/** Which layer a file under src/ belongs to: feature:<name>, app, components, lib, shared, or null. */
function layerOf(file) {
  const rel = path.relative(srcDir, file);
  if (rel.startsWith('..') || path.isAbsolute(rel)) return null;
  const [top, name] = rel.split(path.sep);
  if (top === 'features' && name) return `feature:${name}`;
  return top;
}

/** Resolves relative imports against the importing file and checks the layers they cross. */
const noCrossFeatureImports = {
  meta: { type: 'problem', schema: [], messages: {
    crossFeature: 'src/features/{{from}} must not import from src/features/{{to}}: assemble features in src/app/routes instead.',
    upward: 'src/{{from}} sits below the features and the app: it must not import from src/{{to}}.',
  } },
  create(context) {
    const from = layerOf(context.filename);
    if (!from) return {};
    const check = (node) => {
      const source = node.source && node.source.value;
      if (typeof source !== 'string' || !source.startsWith('.')) return;
      const to = layerOf(path.resolve(path.dirname(context.filename), source));
      if (!to || to === from) return;
      if (from.startsWith('feature:') && to.startsWith('feature:')) {
        context.report({ node: node.source, messageId: 'crossFeature', data: { from: from.slice(8), to: to.slice(8) } });
      } else if ((from === 'components' || from === 'lib') && (to.startsWith('feature:') || to === 'app')) {
        context.report({ node: node.source, messageId: 'upward', data: { from, to: to.startsWith('feature:') ? `features/${to.slice(8)}` : to } });
      }
    };
    return { ImportDeclaration: check, ExportNamedDeclaration: check, ExportAllDeclaration: check, ImportExpression: check };
  },
};

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
    // Features do not import each other; routes in src/app assemble them. UI
    // primitives and lib code sit below features and import neither them nor
    // the app. (A path-aware rule: no-restricted-imports only sees the import
    // string, so a relative "../../other-feature/..." slipped past it.)
    files: ['src/**/*.{ts,tsx}'],
    plugins: { layers: { rules: { 'no-cross-feature-imports': noCrossFeatureImports } } },
    rules: { 'layers/no-cross-feature-imports': 'error' },
  },
);
