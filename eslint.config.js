// ESLint (flat config): Expo's rules for the app and typescript-eslint's recommended rules for all TypeScript;
// formatting is Prettier's alone (eslint-config-prettier turns off the rules that would disagree with it).
const { defineConfig } = require('eslint/config');
const expoConfig = require('eslint-config-expo/flat');
const tseslint = require('typescript-eslint');
const prettier = require('eslint-config-prettier/flat');
const globals = require('globals');

module.exports = defineConfig([
  {
    ignores: [
      'dist/',
      'public/',
      '.expo/',
      'expo-env.d.ts',
      'node_modules/',
      'test-output/',
      '.tactus/',
      'fixtures/corpus/',
    ],
  },
  expoConfig,
  tseslint.configs.recommended,
  prettier,
  {
    files: ['**/*.js'],
    // The few plain-JavaScript files are CommonJS configs and test set-up run by Node itself.
    languageOptions: { sourceType: 'commonjs', globals: globals.node },
    rules: { '@typescript-eslint/no-require-imports': 'off' },
  },
]);
