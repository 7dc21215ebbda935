/** Unit tests: specs beside the code. */
module.exports = {
  rootDir: 'src',
  testRegex: '.*\\.spec\\.ts$',
  moduleFileExtensions: ['js', 'json', 'ts'],
  transform: { '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/../tsconfig.spec.json' }] },
  moduleNameMapper: { '^@panelpass/shared$': '<rootDir>/../../shared/src/index.ts' },
  testEnvironment: 'node',
};
