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
});
