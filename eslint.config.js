// ESLint 9 flat config. Besides the usual recommended sets it writes the house's import
// boundaries down as rules (DEVELOPERS.md, "Boundaries"); scripts/lint-boundaries.test.ts proves
// that a deliberate violation of each one fails `npm run lint`.
import js from '@eslint/js';
import astro from 'eslint-plugin-astro';
import importX from 'eslint-plugin-import-x';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import { defineConfig } from 'eslint/config';
import tseslint from 'typescript-eslint';

/** Packages that tie code to a framework, a database or a server; the pure core imports none. */
const FRAMEWORK_PACKAGES = [
  'astro',
  'astro:*',
  'astro/*',
  '@astrojs/*',
  'auth-astro',
  'auth-astro/*',
  '@auth/*',
  'react',
  'react/*',
  'react-dom',
  'react-dom/*',
  'drizzle-orm',
  'drizzle-orm/*',
  'mysql2',
  'mysql2/*',
  '@aws-sdk/*',
  'nodemailer',
  'pino',
  'prom-client',
];

/** import-x/no-restricted-paths zones: `target` may not import anything under `from`. */
const boundaryZones = [
  {
    target: './src/lib',
    from: ['./src/server', './src/db', './src/pages', './src/components', './src/middleware.ts'],
    message: 'src/lib is the pure core: it imports neither the server, the database nor the UI.',
  },
  {
    target: './src/config.server.ts',
    from: ['./src/server', './src/db', './src/pages', './src/components'],
    message: 'The config module is the bottom of the server stack: it imports nothing of the app.',
  },
  {
    target: './src/lifecycle.server.ts',
    from: ['./src/server', './src/db', './src/pages', './src/components'],
    message:
      'The lifecycle module sits beside the config at the bottom of the server stack: it imports nothing of the app.',
  },
  {
    target: './src/db',
    from: ['./src/server', './src/pages', './src/components'],
    message: 'src/db sits below src/server: move what it needs (config, hashing) below it, or the caller up.',
  },
  {
    target: './src/components/**/*.{ts,tsx}',
    from: ['./src/server', './src/db'],
    message: 'React islands run in the browser: fetch from the API, or take the data as props from the page.',
  },
  {
    target: './src/pages',
    from: ['./src/db/schema', './src/db/migrate.server.ts'],
    message:
      'Pages and endpoints reach the database through src/db/queries or a server service; shared enums live in src/lib/domain.ts.',
  },
];

const restrictedInPages = {
  patterns: [
    {
      group: ['drizzle-orm', 'drizzle-orm/*', 'mysql2', 'mysql2/*'],
      message: 'Pages and endpoints never build SQL: call a function in src/db/queries or a server service.',
    },
    {
      group: ['**/db/client.server'],
      importNames: ['getPool', 'createPool'],
      message: 'Pages and endpoints never query the pool: call a function in src/db/queries or a server service.',
    },
  ],
};

export default defineConfig(
  {
    ignores: [
      'dist/**',
      '.astro/**',
      '.data/**',
      'node_modules/**',
      'bench-out/**',
      'migrations/**',
      'tests/e2e/screenshots/**',
      'scripts/lint-fixtures/**',
    ],
  },
  js.configs.recommended,
  tseslint.configs.recommended,
  astro.configs['flat/recommended'],
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    plugins: { 'import-x': importX },
    settings: {
      'import-x/resolver-next': [
        importX.createNodeResolver({ extensions: ['.ts', '.tsx', '.mjs', '.js', '.astro', '.json'] }),
      ],
    },
    rules: {
      'import-x/no-restricted-paths': ['error', { zones: boundaryZones }],
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' },
      ],
      '@typescript-eslint/consistent-type-imports': ['error', { fixStyle: 'inline-type-imports' }],
      'no-console': 'off',
      eqeqeq: ['error', 'smart'],
    },
  },
  // Type-aware rules where they are cheap and catch real faults (promises, needless assertions).
  {
    files: ['**/*.ts', '**/*.tsx', '**/*.mts'],
    ignores: ['**/*.d.ts', '**/*.d.mts'],
    languageOptions: { parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname } },
    rules: {
      '@typescript-eslint/no-floating-promises': 'error',
      '@typescript-eslint/no-misused-promises': ['error', { checksVoidReturn: { attributes: false } }],
      '@typescript-eslint/await-thenable': 'error',
      '@typescript-eslint/no-unnecessary-type-assertion': 'error',
      '@typescript-eslint/switch-exhaustiveness-check': ['error', { considerDefaultExhaustiveForUnions: true }],
    },
  },
  {
    files: ['src/components/**/*.tsx', 'src/components/**/*.ts'],
    plugins: { 'react-hooks': reactHooks },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'error',
    },
  },
  {
    files: ['src/lib/**'],
    ignores: ['src/lib/**/*.test.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: FRAMEWORK_PACKAGES,
              message: 'src/lib is the pure core: no framework, database or server packages.',
            },
            { group: ['node:*'], message: 'src/lib is the pure core: no Node built-ins (take plain values).' },
          ],
        },
      ],
      'no-restricted-globals': ['error', { name: 'process', message: 'src/lib never reads process or env.' }],
    },
  },
  {
    files: ['src/pages/**'],
    rules: { 'no-restricted-imports': ['error', restrictedInPages] },
  },
  {
    files: ['**/*.d.ts', '**/*.d.mts'],
    rules: { '@typescript-eslint/no-explicit-any': 'off', '@typescript-eslint/consistent-type-imports': 'off' },
  },
);
