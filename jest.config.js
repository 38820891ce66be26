// Four projects, one jest: unit (audio/ and shared/ in Node), api (supertest against the real server and
// MariaDB), browser (headless Chromium against the exported web build), components (jest-expo on web).
// The @/ import alias of tsconfig.json (the Expo template's), for jest's resolver.
const alias = { '^@/(.*)$': '<rootDir>/$1' };

const node = {
  testEnvironment: 'node',
  transform: {
    // The engine's FFT loader (an Emscripten ES module): see the transform's own comment.
    '/@echogarden/pffft-wasm/.+\\.js$': '<rootDir>/tests/setup/emscripten-esm-transform.js',
    // import() (the engine loads its FFT when first needed) becomes a require for jest's CommonJS runtime.
    '^.+\\.[jt]sx?$': ['babel-jest', { plugins: ['@babel/plugin-transform-dynamic-import'] }],
  },
  // soundtouchjs and @echogarden/pffft-wasm are published as ES modules only: babel turns them into CommonJS.
  transformIgnorePatterns: ['/node_modules/(?!(soundtouchjs|@echogarden/pffft-wasm)/)'],
  moduleNameMapper: alias,
};

module.exports = {
  globalSetup: '<rootDir>/tests/setup/global-setup.js',
  globalTeardown: '<rootDir>/tests/setup/global-teardown.js',
  maxWorkers: 2,
  testTimeout: 60_000,
  projects: [
    { ...node, displayName: 'unit', testMatch: ['<rootDir>/tests/unit/**/*.test.ts'] },
    { ...node, displayName: 'api', testMatch: ['<rootDir>/tests/api/**/*.test.ts'] },
    { ...node, displayName: 'browser', testMatch: ['<rootDir>/tests/browser/**/*.test.ts'] },
    {
      displayName: 'components',
      preset: 'jest-expo/web',
      moduleNameMapper: alias,
      // d3-array (under d3-scale) points its entry at an .mjs file, which jest-expo's transform (.js/.ts only) skips.
      transform: { '\\.mjs$': 'babel-jest' },
      // jest-expo's own list (its web preset) plus d3's packages, which are published as ES modules only.
      transformIgnorePatterns: [
        '/node_modules/(?!(.pnpm|react-native|@react-native|@react-native-community|expo|@expo|@expo-google-fonts|react-navigation|@react-navigation|@sentry/react-native|native-base|standard-navigation|d3-|internmap))',
        '/node_modules/react-native-reanimated/plugin/',
        '/node_modules/@react-native/babel-preset/',
      ],
      testMatch: ['<rootDir>/tests/components/**/*.test.tsx'],
    },
  ],
};
