/** e2e tests: a real PostgreSQL with every migration applied first (see global-setup.ts). */
module.exports = {
  rootDir: '..',
  testRegex: 'test/.*\\.e2e-spec\\.ts$',
  moduleFileExtensions: ['js', 'json', 'ts'],
  transform: { '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.spec.json' }] },
  moduleNameMapper: { '^@panelpass/shared$': '<rootDir>/../shared/src/index.ts' },
  testEnvironment: 'node',
  globalSetup: '<rootDir>/test/global-setup.ts',
  testTimeout: 30000,
};
