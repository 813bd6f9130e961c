// The house rules, enforced: `npm run lint` (and so `npm test`) fails on any of them.
// Layers and why: docs/decisions/0005-layers-and-boundaries.md. Change a rule here, in the open;
// never silence one in a file.
import { readdirSync } from 'node:fs';
import js from '@eslint/js';
import checkFile from 'eslint-plugin-check-file';
import { createTypeScriptImportResolver } from 'eslint-import-resolver-typescript';
import importX from 'eslint-plugin-import-x';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

const features = readdirSync(new URL('./src/features', import.meta.url));

/** Knex calls: a table query (`db('users')`, `trx<Row>('burns')`), `ctx.db(…)`, a transaction or raw SQL. */
const knexCalls = [
  {
    selector: "CallExpression[callee.type='Identifier'][callee.name=/^(db|trx|knex)$/]",
    message: 'Queries live in *.repository.ts (or server/db/): call a repository function.',
  },
  {
    selector: "CallExpression[callee.type='MemberExpression'][callee.property.name='db']",
    message: 'Queries live in *.repository.ts (or server/db/): call a repository function.',
  },
  {
    selector: "CallExpression[callee.property.name='transaction'][callee.object.name=/^(db|trx)$/]",
    message: 'Open transactions with inTransaction(db, fn) from server/db/transaction.ts.',
  },
  {
    selector: "CallExpression[callee.property.name='transaction'][callee.object.property.name='db']",
    message: 'Open transactions with inTransaction(db, fn) from server/db/transaction.ts.',
  },
  {
    selector: 'MemberExpression[object.name=/^(db|trx)$/][property.name=/^(raw|schema|fn)$/]',
    message: 'SQL lives in *.repository.ts (or server/db/).',
  },
];

export default tseslint.config(
  {
    ignores: ['dist/', 'dist-agent/', 'coverage/', 'node_modules/', 'data/', 'src/api/schema.d.ts', 'test-results/'],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  importX.flatConfigs.typescript,
  {
    languageOptions: { globals: { ...globals.node } },
    plugins: { 'check-file': checkFile },
    settings: {
      'import-x/resolver-next': [
        createTypeScriptImportResolver({ project: ['tsconfig.server.json', 'tsconfig.client.json'], noWarnOnMultipleProjects: true }),
      ],
    },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
      '@typescript-eslint/consistent-type-imports': ['error', { fixStyle: 'inline-type-imports' }],
      'import-x/no-cycle': ['error', { ignoreExternal: true }],
      'import-x/no-duplicates': 'error',
      'import-x/first': 'error',
      'check-file/filename-naming-convention': ['error', { '**/*.{ts,tsx,js}': 'KEBAB_CASE' }, { ignoreMiddleExtensions: true }],
      'check-file/folder-naming-convention': ['error', { '{server,src,tests,bench,examples,agent}/**/': 'KEBAB_CASE' }],
      'import-x/no-restricted-paths': [
        'error',
        {
          zones: [
            // Server: routes → domain → db / lib. The domain knows nothing of HTTP.
            {
              target: './server/domain',
              from: ['./server/http', './server/routes', './server/app.ts', './server/start.ts', './server/index.ts'],
              message: 'The domain never imports HTTP code: problems live in server/lib/problems.ts, the caller in domain/auth.',
            },
            {
              target: ['./server/lib', './server/db'],
              from: ['./server/domain', './server/http', './server/routes', './server/openapi'],
              message: 'server/lib and server/db are the bottom layer: they import nothing above them.',
            },
            {
              target: './server/routes',
              from: './server/domain/**/*.repository.ts',
              message: 'Routes call services; repositories are reached only through them.',
            },
            // Console: app → features → shared (api, components, lib, config).
            ...features.map((feature) => ({
              target: `./src/features/${feature}`,
              from: './src/features',
              except: [`./${feature}`],
              message: 'A feature never imports another feature: move what both need into src/api, src/lib or src/components.',
            })),
            {
              target: './src/features',
              from: './src/app',
              message: 'Features never import the app shell; the app composes features.',
            },
            {
              target: ['./src/api', './src/components', './src/lib', './src/config'],
              from: ['./src/features', './src/app'],
              message: 'Shared console code never imports features or the app.',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['server/**/*.ts'],
    ignores: ['server/**/*.repository.ts', 'server/db/**'],
    rules: {
      '@typescript-eslint/no-restricted-imports': [
        'error',
        {
          paths: [
            {
              name: 'knex',
              allowTypeImports: true,
              message: 'The knex runtime is used only in *.repository.ts and server/db/.',
            },
          ],
        },
      ],
      'no-restricted-syntax': ['error', ...knexCalls],
    },
  },
  {
    files: ['server/routes/**/*.ts'],
    rules: {
      'no-restricted-syntax': [
        'error',
        ...knexCalls,
        {
          selector: "CallExpression[callee.property.name='json']",
          message: 'Answer with reply(status, body): it is checked against the declared response schema at compile time.',
        },
      ],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'error',
      'no-restricted-syntax': [
        'error',
        {
          selector: "Property[key.name='queryKey'] > ArrayExpression",
          message: 'Take query keys from the factories in src/api/query-keys.ts, so queries and invalidations agree.',
        },
        {
          selector: "JSXAttribute[name.name='to'] > Literal, JSXAttribute[name.name='to'] > JSXExpressionContainer > TemplateLiteral",
          message: 'Link to an address from src/config/paths.ts.',
        },
      ],
    },
  },
  {
    // Merged migrations are never edited, not even renamed: their timestamp names predate this rule.
    files: ['migrations/2*.ts'],
    rules: { 'check-file/filename-naming-convention': 'off' },
  },
);
