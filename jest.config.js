// Four projects, one jest: unit (audio/ and shared/ in Node), api (supertest against the real server and
// MariaDB), browser (headless Chromium against the exported web build), components (jest-expo on web).
// The @/ import alias of tsconfig.json (the Expo template's), for jest's resolver.
const alias = { '^@/(.*)$': '<rootDir>/$1' };

const node = {
  testEnvironment: 'node',
  transform: { '^.+\\.[jt]sx?$': 'babel-jest' },
  // soundtouchjs is published as an ES module only: let babel turn it into CommonJS for jest.
  transformIgnorePatterns: ['/node_modules/(?!soundtouchjs/)'],
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
      testMatch: ['<rootDir>/tests/components/**/*.test.tsx'],
    },
  ],
};
