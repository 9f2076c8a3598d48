// ESLint flat config: Expo's rules for the app, plus the project's own boundaries.
const { defineConfig } = require('eslint/config');
const expoConfig = require('eslint-config-expo/flat');

module.exports = defineConfig([
  expoConfig,
  {
    ignores: ['dist/**', 'data/**', 'node_modules/**', 'tests/artifacts/**', '.expo/**', 'db/migrations/**'],
  },
  {
    // shared/ is pure code for client and server alike: it may not reach into either side.
    files: ['shared/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        { patterns: ['@/features/*', '@/server/*', '@/db/*', '../features/*', '../server/*', '../db/*', 'react', 'react-native'] },
      ],
    },
  },
  {
    // The solver runs in the client, the server and the CLI: no React, no I/O.
    files: ['features/solver/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        { patterns: ['react', 'react-native', 'node:*', 'fs', 'path', '@/server/*', '@/db/*'] },
      ],
    },
  },
]);
