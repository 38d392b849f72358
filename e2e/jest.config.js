// End-to-end specs: the production build served by the real server, driven in
// Debian's Chromium through playwright-core. scripts/test.sh builds the app first.
/** @type {import('jest').Config} */
module.exports = {
  rootDir: __dirname,
  displayName: 'e2e',
  testEnvironment: 'node',
  testMatch: ['<rootDir>/**/*.e2e.ts'],
  transform: { '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.json' }] },
  globalSetup: '<rootDir>/support/global-setup.ts',
  globalTeardown: '<rootDir>/support/global-teardown.ts',
  maxWorkers: 1,
  testTimeout: 60000,
};
