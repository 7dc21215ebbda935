/** e2e tests: a real PostgreSQL with every migration applied first (see global-setup.ts). */
// eslint-disable-next-line @typescript-eslint/no-require-imports -- a CommonJS config file
const esm = require('./esm-packages');

module.exports = {
  rootDir: '..',
  testRegex: 'test/.*\\.e2e-spec\\.ts$',
  moduleFileExtensions: ['js', 'json', 'ts'],
  transform: {
    '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.spec.json' }],
    ...esm.transform,
  },
  transformIgnorePatterns: esm.transformIgnorePatterns,
  moduleNameMapper: {
    '^@panelpass/shared$': '<rootDir>/../shared/src/index.ts',
    ...esm.moduleNameMapper,
  },
  testEnvironment: 'node',
  globalSetup: '<rootDir>/test/global-setup.ts',
  testTimeout: 30000,
};
