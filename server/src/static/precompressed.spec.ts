import { acceptedCodings } from './precompressed';

describe('acceptedCodings (Accept-Encoding, RFC 9110 §12.5.3), brotli preferred over gzip', () => {
  it.each([
    [undefined, []],
    ['', []],
    ['identity', []],
    ['gzip, deflate, br, zstd', ['br', 'gzip']],
    ['gzip', ['gzip']],
    ['br', ['br']],
    ['BR;Q=0.5, GZIP;q=1', ['br', 'gzip']],
    ['br;q=0, gzip', ['gzip']],
    ['br;q=0.0, gzip;q=0', []],
    ['*', ['br', 'gzip']],
    ['*;q=0, gzip', ['gzip']],
    ['*, br;q=0', ['gzip']],
    ['gzip;q=nonsense, br', ['br']],
  ])('%j → %j', (header, expected) => {
    expect(acceptedCodings(header)).toEqual(expected);
  });
});
