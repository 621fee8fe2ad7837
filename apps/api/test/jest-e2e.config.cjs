/** API e2e tests: the real AppModule on the real PostgreSQL with the real migrations. */
module.exports = {
  rootDir: '..',
  testEnvironment: 'node',
  testMatch: ['<rootDir>/test/**/*.e2e-spec.ts'],
  globalSetup: '<rootDir>/test/global-setup.cjs',
  extensionsToTreatAsEsm: ['.ts'],
  moduleNameMapper: {
    '^@skyhours/calc$': '<rootDir>/../../libs/calc/src/index.ts',
    '^(\\.{1,2}/.*)\\.js$': '$1',
  },
  transform: {
    '^.+\\.ts$': ['ts-jest', { useESM: true, tsconfig: '<rootDir>/tsconfig.json' }],
  },
  testTimeout: 30000,
};
