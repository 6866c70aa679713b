// @ts-check
// Lint for the whole repository. Errors are for real problems (broken boundaries, hooks misuse,
// unsafe code); matters of taste stay warnings so they never block another part of the project.
const { defineConfig } = require('eslint/config');
const expoConfig = require('eslint-config-expo/flat');
const tseslint = require('typescript-eslint');
const reactHooks = require('eslint-plugin-react-hooks');
const globals = require('globals');

/** Packages and folders the pure calculation code must never reach. */
const impureForCalc = [
  'react',
  'react-*',
  'react/*',
  'react-native',
  'react-native-*',
  'expo',
  'expo-*',
  '@expo/*',
  'express',
  'express-*',
  'knex',
  'mysql2',
  'node:*',
  'fs',
  'path',
  'os',
  'crypto',
  'child_process',
  'http',
  'https',
  'net',
  'worker_threads',
  'piscina',
];

module.exports = defineConfig([
  {
    ignores: [
      'dist/**',
      'node_modules/**',
      '.expo/**',
      '.db*/**',
      '.uploads/**',
      '.run/**',
      'test-output/**',
      'coverage/**',
      'expo-env.d.ts',
      'jest-results.json',
    ],
  },
  ...expoConfig,
  ...tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx,js,jsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'warn',
      // React Compiler advice: worth reading, not worth blocking a build.
      'react-hooks/set-state-in-effect': 'warn',
      'react-hooks/refs': 'warn',
      'react-hooks/purity': 'warn',
      'react-hooks/immutability': 'warn',
      'react-hooks/preserve-manual-memoization': 'warn',
      'react-hooks/static-components': 'warn',
      'react-hooks/use-memo': 'warn',
      'react-hooks/globals': 'warn',
      'react-hooks/incompatible-library': 'warn',
      'react-hooks/unsupported-syntax': 'warn',
      '@typescript-eslint/no-unused-vars': ['warn', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
      '@typescript-eslint/no-explicit-any': 'warn',
      '@typescript-eslint/no-require-imports': 'off',
      '@typescript-eslint/no-empty-object-type': 'warn',
      '@typescript-eslint/no-non-null-assertion': 'off',
      'import/no-unresolved': 'off',
      'import/namespace': 'off',
      'import/no-named-as-default': 'off',
      'import/no-named-as-default-member': 'off',
      'react/display-name': 'off',
      'react/no-unescaped-entities': 'off',
    },
  },
  {
    // Node-side code and configuration files.
    files: ['server/**', 'scripts/**', 'tests/**', 'migrations/**', 'seeds/**', '*.config.{js,ts}', 'knexfile.js', '.ci/**'],
    languageOptions: { globals: { ...globals.node, ...globals.jest } },
  },
  {
    files: ['**/*.test.{ts,tsx}'],
    languageOptions: { globals: { ...globals.jest } },
  },
  // The physics is pure: it imports nothing outside itself. One block per folder depth, so a
  // relative import may move within shared/calc but never climb out of it.
  // Its own tests may read reference tables kept in tests/.
  ...[1, 2, 3, 4].map((depth) => ({
    files: [`shared/calc/${'*/'.repeat(depth - 1)}*.{ts,tsx,js}`],
    ignores: ['**/*.test.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: impureForCalc, message: 'shared/calc is pure TypeScript: no UI, server, database or Node I/O.' },
            { regex: `^(\\.\\./){${depth},}`, message: 'shared/calc imports nothing outside itself.' },
          ],
        },
      ],
    },
  })),
  {
    // The app talks to the server only over HTTP through src/api.
    files: ['app/**/*.{ts,tsx}', 'src/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          paths: [
            { name: 'knex', message: 'The app never talks to the database; use src/api.' },
            { name: 'mysql2', message: 'The app never talks to the database; use src/api.' },
          ],
          patterns: [{ regex: '^(\\.\\./)+server(/|$)', message: 'The app never imports server code; use src/api.' }],
        },
      ],
    },
  },
  {
    // Screens use our own Text and TextField wrappers (tabular figures, labelled units).
    files: ['app/**/*.{ts,tsx}', 'src/components/**/*.{ts,tsx}'],
    ignores: ['src/components/ui/**'],
    rules: {
      'no-restricted-syntax': [
        'warn',
        {
          selector: "ImportDeclaration[source.value='react-native'] > ImportSpecifier[imported.name=/^(Text|TextInput)$/]",
          message: 'Use Text / TextField from src/components/ui instead of the raw React Native component.',
        },
      ],
    },
  },
  // The server never reaches into the client. Per folder depth, so `../app` from server/http/
  // (which is server/app.ts) stays allowed while the root app/ folder does not.
  ...[1, 2, 3, 4].map((depth) => ({
    files: [`server/${'*/'.repeat(depth - 1)}*.{ts,tsx,js}`],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { regex: `^(\\.\\./){${depth}}app(/|$)`, message: 'The server never imports routes of the app.' },
            { regex: `^(\\.\\./){${depth}}src/components(/|$)`, message: 'The server never imports UI components.' },
            { group: ['react', 'react-native', 'react-native-*', 'expo-router'], message: 'The server never imports UI code.' },
          ],
        },
      ],
    },
  })),
]);
