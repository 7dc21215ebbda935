import { validateEnv } from './env.validation';

describe('validateEnv', () => {
  const good = { DATABASE_URL: 'postgres://x@127.0.0.1:1/y', JWT_SECRET: 'x'.repeat(32) };

  it('fills defaults and converts numbers', () => {
    const env = validateEnv({ ...good, PORT: '9090' });
    expect(env.PORT).toBe(9090);
    expect(env.HOST).toBe('127.0.0.1');
    expect(env.ACCESS_TOKEN_TTL_SECONDS).toBe(900);
  });

  it('fails fast naming every bad setting', () => {
    expect(() => validateEnv({ JWT_SECRET: 'short', PORT: 'eighty' })).toThrow(
      /DATABASE_URL[\s\S]*JWT_SECRET must be at least 32 characters|JWT_SECRET must be at least 32 characters[\s\S]*DATABASE_URL/,
    );
    expect(() => validateEnv({ ...good, PORT: 'eighty' })).toThrow(/PORT/);
  });

  it('reads CORS_ORIGINS as a list of exact origins, none by default (same origin only)', () => {
    expect(validateEnv(good).CORS_ORIGINS).toEqual([]);
    expect(validateEnv({ ...good, CORS_ORIGINS: '' }).CORS_ORIGINS).toEqual([]);
    expect(
      validateEnv({
        ...good,
        CORS_ORIGINS: 'https://office.panelpass.test, http://127.0.0.1:5173,http://[::1]:8080',
      }).CORS_ORIGINS,
    ).toEqual(['https://office.panelpass.test', 'http://127.0.0.1:5173', 'http://[::1]:8080']);
  });

  it('refuses a CORS_ORIGINS entry that is not an exact origin (a path, a slash, *, upper case)', () => {
    for (const bad of [
      '*',
      'https://office.panelpass.test/',
      'https://office.panelpass.test/app',
      'office.panelpass.test',
      'https://*.panelpass.test',
      'HTTPS://Office.Panelpass.Test',
      'ftp://files.panelpass.test',
      'null',
    ]) {
      expect(() =>
        validateEnv({ ...good, CORS_ORIGINS: `https://ok.panelpass.test,${bad}` }),
      ).toThrow(/CORS_ORIGINS must be exact origins/);
    }
  });
});
