/**
 * Jest settings for the ES-module-only packages the server uses (file-type 21 and what it
 * imports). Node 20.19+ loads them with require() when the server runs; Jest's own module
 * loader cannot, so both Jest configs map file-type to its core build (the Node build only
 * adds file and stream readers) and compile these packages to CommonJS with ts-jest.
 */
const esmOnly = [
  'file-type',
  'strtok3',
  'token-types',
  '@tokenizer',
  'uint8array-extras',
  '@borewit',
];

module.exports = {
  moduleNameMapper: { '^file-type$': require.resolve('file-type/core') },
  transformIgnorePatterns: [`/node_modules/(?!(${esmOnly.join('|')})/)`],
  transform: {
    '^.+\\.js$': [
      'ts-jest',
      {
        tsconfig: { allowJs: true, module: 'commonjs', isolatedModules: true },
        diagnostics: false,
      },
    ],
  },
};
