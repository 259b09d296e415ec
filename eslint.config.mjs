// ESLint for every workspace (`npm run lint`, and the `lint` suite that `npm test` runs first).
// typescript-eslint's recommended rules without type information, so the lint takes seconds;
// `npm run typecheck` is what checks types. The import rules below write down the layering
// DEVELOPERS.md describes ("Boundaries"), so that the build refuses a change that breaks it.
import { readdirSync } from 'node:fs';
import { builtinModules } from 'node:module';
import { fileURLToPath } from 'node:url';
import js from '@eslint/js';
import { defineConfig, globalIgnores } from 'eslint/config';
import tseslint from 'typescript-eslint';

const SOURCES = '**/*.{ts,tsx,mts,cts,js,mjs,cjs}';
const FEATURES_DIR = 'web/src/features';
// Read beside this file, whichever folder ESLint was started in.
const featuresPath = fileURLToPath(new URL(FEATURES_DIR, import.meta.url));

/** One no-restricted-imports pattern: a regular expression on the import source, and why it is refused. */
const refuse = (regex, message) => ({ regex, message });

/** Web: a feature reaches another feature only through the routes that compose them. */
function featureBlocks() {
  const features = readdirSync(featuresPath, { withFileTypes: true }).filter((d) => d.isDirectory()).map((d) => d.name);
  // Folders between a feature's root and its deepest file (features/scans/components/plane/x.tsx: 2), read
  // from the tree each time the config loads, so every file has a block that knows its depth.
  const deepest = Math.max(...readdirSync(featuresPath, { recursive: true }).map((file) => String(file).split('/').length - 2));
  return features.flatMap((feature) =>
    Array.from({ length: deepest + 1 }, (_, depth) => ({
      name: `boundaries/web-feature-${feature}-depth-${depth}`,
      files: [`${FEATURES_DIR}/${feature}/${'*/'.repeat(depth)}*.{ts,tsx}`],
      rules: {
        'no-restricted-imports': ['error', {
          patterns: [
            refuse(
              `^@/features/(?!${feature}(/|$))`,
              `Features do not import each other: move what both need to @/lib or @/components, or let the route (web/src/app) pass it in.`,
            ),
            // A file `depth` folders below its feature's root leaves the feature with depth + 1 `../`;
            // everything outside the feature is reached by its `@/` path, so no relative path can reach another feature.
            refuse(
              `^(\\.\\./){${depth + 1}}`,
              `This relative import leaves the '${feature}' feature: use the '@/…' path (@/lib, @/components, …); another feature is not importable at all.`,
            ),
          ],
        }],
      },
    })),
  );
}

export default defineConfig([
  globalIgnores([
    '**/dist/',
    '**/node_modules/',
    '**/.data/',
    '**/coverage/',
    'web/test-results/',
  ]),
  {
    files: [SOURCES],
    extends: [js.configs.recommended, tseslint.configs.recommended],
    linterOptions: { reportUnusedDisableDirectives: 'error' },
    rules: {
      // Names starting with _ are kept on purpose (a parameter an interface requires, a skipped tuple element).
      '@typescript-eslint/no-unused-vars': ['error', {
        argsIgnorePattern: '^_',
        varsIgnorePattern: '^_',
        caughtErrorsIgnorePattern: '^_',
        destructuredArrayIgnorePattern: '^_',
        ignoreRestSiblings: true,
      }],
    },
  },
  {
    // Plain Node scripts (deploy/, shared/cli, shared/bench, jest configs): the globals of the Node that runs the lint.
    files: ['**/*.{js,mjs,cjs}'],
    languageOptions: {
      globals: Object.fromEntries(Object.getOwnPropertyNames(globalThis).map((name) => [name, 'readonly'])),
    },
  },
  {
    files: ['**/*.cjs'],
    languageOptions: { sourceType: 'commonjs' },
    // CommonJS config files load with require(); the rule is meant for TypeScript sources.
    rules: { '@typescript-eslint/no-require-imports': 'off' },
  },

  ...featureBlocks(),
  {
    name: 'boundaries/web-shared-places',
    // Code every feature may use stays free of any one feature, or features would depend on each other through it.
    files: ['web/src/{lib,components,hooks,config,theme,testing}/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [
          refuse('^@/features(/|$)', 'Shared web code (lib, components, hooks, …) does not import a feature; only routes (web/src/app) compose features.'),
          refuse('^(\\.\\./)+features(/|$)', 'Shared web code (lib, components, hooks, …) does not import a feature; only routes (web/src/app) compose features.'),
        ],
      }],
    },
  },
  {
    name: 'boundaries/worker',
    // The worker runs without the HTTP app: it may use the API's database layer (and queue registration), nothing else of it.
    files: ['worker/src/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', {
        paths: [{ name: '@sixtyfold/api', message: 'The worker imports only @sixtyfold/api/database (or /queue), never the HTTP app.' }],
        patterns: [
          refuse('^@sixtyfold/api/(?!(database|queue)$)', 'The worker imports only @sixtyfold/api/database (or /queue), never the HTTP app or a deep path.'),
          refuse('^(\\.\\./)+api(/|$)', 'The worker reaches the API only through @sixtyfold/api/database (or /queue).'),
        ],
      }],
    },
  },
  {
    name: 'boundaries/shared',
    // shared runs in the browser, the API and the worker alike: no Node-only module, no framework.
    files: ['shared/src/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', {
        paths: builtinModules.map((name) => ({ name, message: 'shared runs in the browser too: no Node-only modules.' })),
        patterns: [
          refuse('^node:', 'shared runs in the browser too: no Node-only modules.'),
          refuse(
            '^(@nestjs/|typeorm(/|$)|react(-|/|$)|bull(/|$)|express(-|/|$)|mysql2(/|$)|redis(/|$)|ioredis(/|$)|@sixtyfold/(api|worker|web)(/|$))',
            'shared imports no framework (Nest, TypeORM, React, bull, Express, database or Redis clients) and no other workspace.',
          ),
          refuse('^(\\.\\./)+(api|worker|web)(/|$)', 'shared imports no other workspace.'),
        ],
      }],
    },
  },
]);
