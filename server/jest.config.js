/** Unit tests: specs beside the code. */
// eslint-disable-next-line @typescript-eslint/no-require-imports -- a CommonJS config file
const esm = require('./test/esm-packages');

module.exports = {
  rootDir: 'src',
  testRegex: '.*\\.spec\\.ts$',
  moduleFileExtensions: ['js', 'json', 'ts'],
  transform: {
    '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/../tsconfig.spec.json' }],
    ...esm.transform,
  },
  transformIgnorePatterns: esm.transformIgnorePatterns,
  moduleNameMapper: {
    '^@panelpass/shared$': '<rootDir>/../../shared/src/index.ts',
    ...esm.moduleNameMapper,
  },
  testEnvironment: 'node',
};
