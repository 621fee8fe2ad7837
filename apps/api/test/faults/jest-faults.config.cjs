/**
 * Fault tests: each file starts its own PostgreSQL cluster, mail sink and API processes (see
 * faults/support/stack.ts), then stops, restarts or kills them. Run one file at a time (the machine
 * is small and the files time what they break).
 */
module.exports = {
  rootDir: '../..',
  testEnvironment: 'node',
  testMatch: ['<rootDir>/test/faults/**/*.fault-spec.ts'],
  extensionsToTreatAsEsm: ['.ts'],
  moduleNameMapper: {
    '^@skyhours/calc$': '<rootDir>/../../libs/calc/src/index.ts',
    '^(\\.{1,2}/.*)\\.js$': '$1',
  },
  transform: {
    '^.+\\.ts$': ['ts-jest', { useESM: true, tsconfig: '<rootDir>/tsconfig.json' }],
  },
  testTimeout: 180000,
};
