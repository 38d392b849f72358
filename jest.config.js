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
      transform: {
        '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/server/tsconfig.json' }],
        // file-type and its helpers, and p-limit, ship only as ES modules: compile them for jest.
        '^.+\\.js$': ['ts-jest', { tsconfig: { allowJs: true, module: 'commonjs', target: 'ES2022' } }],
      },
      transformIgnorePatterns: ['/node_modules/(?!(file-type|strtok3|token-types|@tokenizer|uint8array-extras|@borewit|p-limit|yocto-queue)/)'],
      moduleNameMapper: { ...moduleNameMapper, '^file-type$': '<rootDir>/node_modules/file-type/index.js' },
      globalSetup: '<rootDir>/server/testing/global-setup.ts',
    },
  ],
};
