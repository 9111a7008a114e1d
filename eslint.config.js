// ESLint flat config for the whole repository (`npm run lint`; `npm test` runs it before vitest).
// typescript-eslint's recommended rules everywhere, the type-aware promise rules for the API,
// the React hooks rules for both apps, and import boundaries between layers and features.
const fs = require('node:fs');
const path = require('node:path');
const js = require('@eslint/js');
const tseslint = require('typescript-eslint');
const reactHooks = require('eslint-plugin-react-hooks');
const importX = require('eslint-plugin-import-x');
const { createTypeScriptImportResolver } = require('eslint-import-resolver-typescript');
const globals = require('globals');

const apps = ['storefront', 'backoffice'];

/**
 * Each feature folder keeps its components, hooks and lib to itself. What another feature may use
 * is its api/ folder: the query-key factory, query options and data hooks of that feature.
 */
function featureZones(app) {
  const featuresDir = path.join(__dirname, app, 'src', 'features');
  const features = fs.existsSync(featuresDir)
    ? fs.readdirSync(featuresDir, { withFileTypes: true }).filter((entry) => entry.isDirectory())
    : [];
  return features.map((feature) => ({
    target: `./${app}/src/features/${feature.name}`,
    from: `${featuresDir}/**`,
    except: [`${featuresDir}/${feature.name}/**`, `${featuresDir}/*/api/**`],
    message:
      "A feature uses only another feature's api/ folder: compose components in app/routes, or move what both need to src/components or src/lib.",
  }));
}

module.exports = tseslint.config(
  {
    ignores: [
      '**/dist/**',
      '**/dist-prerender/**',
      '**/node_modules/**',
      '**/.data/**',
      'e2e/test-results/**',
      'e2e/playwright-report/**',
      'docs/**',
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node } },
    linterOptions: { reportUnusedDisableDirectives: 'error' },
    rules: {
      // Unused names are errors, except deliberate placeholders spelled with a leading underscore.
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none', ignoreRestSiblings: true },
      ],
    },
  },
  {
    files: ['eslint.config.js'],
    rules: { '@typescript-eslint/no-require-imports': 'off' },
  },
  // Kysely's own migration guide types migrations as Kysely<any>: a migration is frozen in time and
  // must not depend on the application's current table types.
  {
    files: ['api/src/database/migrations/**/*.ts', 'api/src/database/migrate.ts'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
  // Type-aware promise rules for the server: an un-awaited query or send loses its error.
  {
    files: ['api/src/**/*.ts'],
    languageOptions: { parserOptions: { projectService: true, tsconfigRootDir: __dirname } },
    rules: {
      '@typescript-eslint/no-floating-promises': 'error',
      '@typescript-eslint/no-misused-promises': ['error', { checksVoidReturn: { arguments: false } }],
    },
  },
  // Both apps: browser globals and the React hooks rules.
  {
    files: apps.map((app) => `${app}/src/**/*.{ts,tsx}`),
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'error',
    },
  },
  // TanStack Query keys come from each feature's key factory (`features/<name>/api/query-keys.ts`),
  // so a query and every invalidation of it name the same key: a literal array is refused elsewhere.
  {
    files: [...apps.map((app) => `${app}/src/**/*.{ts,tsx}`), 'shared/src/ui/**/*.{ts,tsx}'],
    ignores: ['**/query-keys.ts'],
    rules: {
      'no-restricted-syntax': [
        'error',
        {
          selector: 'Property[key.name="queryKey"] > ArrayExpression.value',
          message:
            "Build query keys with the feature's key factory in api/query-keys.ts (for example bookingKeys.detail(id)), not a literal array.",
        },
      ],
    },
  },
  // Import boundaries between the layers and between the features of each app.
  {
    files: ['{shared,api,storefront,backoffice}/**/*.{ts,tsx}'],
    plugins: { 'import-x': importX },
    settings: {
      'import-x/resolver-next': [
        createTypeScriptImportResolver({
          noWarnOnMultipleProjects: true,
          project: ['shared/tsconfig.json', 'api/tsconfig.json', 'storefront/tsconfig.json', 'backoffice/tsconfig.json'],
        }),
      ],
    },
    rules: {
      'import-x/no-restricted-paths': [
        'error',
        {
          zones: [
            {
              target: './shared',
              from: ['./api', './storefront', './backoffice', './e2e'],
              message: 'shared/ is used by the API and both apps, so it imports nothing from them.',
            },
            {
              target: ['./storefront', './backoffice'],
              from: './api',
              message: 'The apps talk to the API over HTTP; types they share live in shared/.',
            },
            { target: './storefront', from: './backoffice', message: 'The two apps share code only through shared/.' },
            { target: './backoffice', from: './storefront', message: 'The two apps share code only through shared/.' },
            {
              target: './api',
              from: ['./storefront', './backoffice'],
              message: 'The API does not import the apps; it serves their built files.',
            },
            ...apps.flatMap(featureZones),
          ],
        },
      ],
    },
  },
);
