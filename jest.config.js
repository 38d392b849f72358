// Jest runs two projects: the pure domain maths in shared/ and the server
// against a real PostgreSQL (scripts/test.sh starts it and sets DATABASE_URL).
const moduleNameMapper = {
  '^@keepstitch/shared$': '<rootDir>/shared/src/index.ts',
};

/** @type {import('jest').Config} */
module.exports = {
  projects: [
    {
      displayName: 'shared',
      rootDir: __dirname,
      testEnvironment: 'node',
      testMatch: ['<rootDir>/shared/src/**/*.spec.ts'],
      transform: { '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/shared/tsconfig.json' }] },
      moduleNameMapper,
    },
    {
      displayName: 'server',
      rootDir: __dirname,
      testEnvironment: 'node',
      testMatch: ['<rootDir>/server/**/*.spec.ts'],
      transform: { '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/server/tsconfig.json' }] },
      moduleNameMapper,
      globalSetup: '<rootDir>/server/testing/global-setup.ts',
    },
  ],
};
