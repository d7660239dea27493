// ESLint: typescript-eslint, React hooks and TanStack Query rules; Prettier owns formatting.
// The tier rules at the end are the layout of DEVELOPERS.md ("Rules the lint step enforces").
import js from '@eslint/js';
import pluginQuery from '@tanstack/eslint-plugin-query';
import prettier from 'eslint-config-prettier';
import checkFile from 'eslint-plugin-check-file';
import { createTypeScriptImportResolver } from 'eslint-import-resolver-typescript';
import importX from 'eslint-plugin-import-x';
import reactHooks from 'eslint-plugin-react-hooks';
import fs from 'node:fs';
import globals from 'globals';
import tseslint from 'typescript-eslint';

const FEATURES = fs.readdirSync('src/features', { withFileTypes: true }).filter((d) => d.isDirectory());

export default tseslint.config(
  { ignores: ['dist', 'node_modules', '.data', '.test-data', 'test-output', 'coverage'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/no-namespace': 'off',
      'no-console': 'error',
    },
  },
  {
    files: ['src/**/*.{ts,tsx}', 'tests/client/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: { ...reactHooks.configs.recommended.rules },
  },
  ...pluginQuery.configs['flat/recommended'],
  {
    files: ['scripts/**/*.ts', 'tests/**/*.ts'],
    rules: { 'no-console': 'off' },
  },

  // Tiers. Paths are resolved (relative, `@/`, `@shared/`, `@server/` alike) before they are compared.
  {
    files: ['**/*.{ts,tsx}'],
    plugins: { 'import-x': importX },
    settings: {
      'import-x/extensions': importX.flatConfigs.typescript.settings['import-x/extensions'],
      'import-x/parsers': importX.flatConfigs.typescript.settings['import-x/parsers'],
      'import-x/resolver-next': [createTypeScriptImportResolver({ project: 'tsconfig.json' })],
    },
    rules: {
      // Type-only imports count: a cycle of types is still two modules that must change together.
      'import-x/no-cycle': ['error', { ignoreExternal: true }],
      'import-x/no-restricted-paths': [
        'error',
        {
          zones: [
            {
              target: './src',
              from: ['./server', './worker', './scripts'],
              message: 'The client never imports the server or the worker: share it through shared/.',
            },
            {
              target: './shared',
              from: ['./src', './server', './worker', './scripts', './tests'],
              message:
                'shared/ imports nothing outside itself (it runs in the browser, the API and the worker).',
            },
            {
              target: './worker',
              from: [
                './src/**',
                './server/modules/*/{routes,openapi}.ts',
                './server/{app,openapi-routes}.ts',
                './server/middleware/**',
              ],
              message: 'The worker does not import HTTP code (routes, middleware, the Express app).',
            },
            ...FEATURES.map((f) => ({
              target: `./src/features/${f.name}`,
              from: './src/features',
              except: [`./${f.name}`],
              message:
                'Features do not import each other: move the piece to src/components or src/lib, or compose them in a page.',
            })),
          ],
        },
      ],
    },
  },
  {
    // The worker and its tasks: no Express in any form.
    files: ['worker/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          paths: [{ name: 'express', message: 'The worker does not import HTTP code.' }],
          patterns: ['express-*', 'passport*', 'helmet', 'multer'],
        },
      ],
    },
  },
  {
    // Environment is read in server/config.ts only. scripts/ are the launchers that set it up for
    // the processes they start, and tests set it for the stack they start; both may read it.
    files: ['src/**/*.{ts,tsx}', 'server/**/*.ts', 'worker/**/*.ts', 'shared/**/*.ts'],
    ignores: ['server/config.ts'],
    rules: {
      'no-restricted-syntax': [
        'error',
        {
          selector: "MemberExpression[object.name='process'][property.name='env']",
          message: 'Read the environment through server/config.ts.',
        },
      ],
    },
  },
  {
    files: ['**/*.{ts,tsx,js}'],
    plugins: { 'check-file': checkFile },
    rules: {
      'check-file/filename-naming-convention': [
        'error',
        // Migrations start with their timestamp: 1764670000000-job-intents.ts.
        {
          'server/db/migrations/[0-9]*.ts': '+([0-9])-+([a-z0-9-])',
          '**/!([0-9])*.{ts,tsx,js}': 'KEBAB_CASE',
        },
        { ignoreMiddleExtensions: true },
      ],
      'check-file/folder-naming-convention': [
        'error',
        { '{src,server,worker,shared,tests,scripts}/**/': 'KEBAB_CASE' },
      ],
    },
  },
  prettier,
);
