// ESLint flat config. typescript-eslint's recommended rules without type information (a type-aware
// lint would run the compiler a second time; `tsc --noEmit` already checks types), React hooks and
// accessibility for the client, and the import boundaries of the layers:
//   shared/  imports nothing of ours and no framework (it runs in the browser, the worker and Node);
//   src/ and server/ never import each other (both may import shared/);
//   a client feature reaches another feature only through its public surface (`api/` or `index.ts`).
// Server module cycles are checked by scripts/check-cycles.mjs (module level, with its allow-list).
import fs from 'node:fs';
import path from 'node:path';
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import jsxA11y from 'eslint-plugin-jsx-a11y';
import { importX, createNodeResolver } from 'eslint-plugin-import-x';
import globals from 'globals';

const featuresDir = path.join(import.meta.dirname, 'src', 'features');
const features = fs
  .readdirSync(featuresDir, { withFileTypes: true })
  .filter((e) => e.isDirectory())
  .map((e) => e.name);

// One zone per ordered pair of features: files of `target` may import from `from` only its api/ or index.
const featureZones = features.flatMap((target) =>
  features
    .filter((from) => from !== target)
    .map((from) => ({
      target: `./src/features/${target}`,
      from: `./src/features/${from}`,
      except: ['./api', './index.ts'],
      message: `reach the "${from}" feature through its api/ or index.ts, not its internals`,
    })),
);

export default tseslint.config(
  {
    ignores: ['node_modules/', 'dist/', 'dist-server/', 'coverage/', 'test-output/', '.pgdata/', '.pgsock/', 'uploads/'],
  },
  js.configs.recommended,
  tseslint.configs.recommended,
  {
    languageOptions: {
      ecmaVersion: 2023,
      sourceType: 'module',
      globals: { ...globals.node, ...globals.browser },
    },
    linterOptions: { reportUnusedDisableDirectives: 'error' },
    rules: {
      // `_name` marks a parameter or binding kept on purpose (callbacks with a fixed signature).
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none', ignoreRestSiblings: true }],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}', 'tests/**/*.tsx'],
    ...reactHooks.configs.flat.recommended,
  },
  {
    files: ['src/**/*.tsx'],
    ...jsxA11y.flatConfigs.recommended,
    rules: {
      ...jsxA11y.flatConfigs.recommended.rules,
      // Focus goes to the one field of a form the user has just opened (sign-in, invite, rename),
      // as the WAI-ARIA Authoring Practices' dialog pattern does; nothing steals focus on its own.
      'jsx-a11y/no-autofocus': 'off',
      // The plan canvas is an application region that takes the editor's keyboard shortcuts; a wide
      // table's scroll box is a labelled region a keyboard can focus to scroll (WCAG 2.1.1).
      'jsx-a11y/no-noninteractive-tabindex': ['error', { tags: [], roles: ['tabpanel', 'application', 'region'], allowExpressionValues: true }],
      // Our <Input> and <Select> render the native control.
      'jsx-a11y/label-has-associated-control': ['error', { controlComponents: ['Input', 'Select'], depth: 3 }],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}', 'server/**/*.ts', 'shared/**/*.ts'],
    plugins: { 'import-x': importX },
    settings: {
      'import-x/resolver-next': [createNodeResolver({ extensions: ['.ts', '.tsx', '.js', '.mjs', '.json'] })],
    },
    rules: {
      'import-x/no-restricted-paths': [
        'error',
        {
          zones: [
            { target: './shared', from: './src', message: 'shared/ must not import the client' },
            { target: './shared', from: './server', message: 'shared/ must not import the server' },
            { target: './src', from: './server', message: 'the client must not import the server (share through shared/)' },
            { target: './server', from: './src', message: 'the server must not import the client (share through shared/)' },
            ...featureZones,
          ],
        },
      ],
    },
  },
  {
    files: ['shared/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['react', 'react-*', 'react/*', 'konva', 'konva/*', 'express', 'express-*', 'sequelize', 'pg', 'pdfkit', 'node:*'],
              message: 'shared/ is plain TypeScript for the browser, the worker and Node: no framework, database or Node built-in',
            },
          ],
        },
      ],
    },
  },
);
