// @vitest-environment node
import { describe, expect, it } from 'vitest';
import { aSession } from '../../../test/sessions';
import { parseSession } from './session';

describe('reading a session', () => {
  it('keeps what we use from the server’s answer and drops the rest', () => {
    const answer = { ...aSession(), expiresIn: 900, user: { ...aSession().user, extra: 1 } };
    expect(parseSession(answer)).toEqual(aSession());
  });

  it('refuses a role it does not know, rather than guessing what it may see', () => {
    const answer = { ...aSession(), user: { ...aSession().user, role: 'admin' } };
    expect(parseSession(answer)).toBeNull();
  });

  it('refuses a session without tokens', () => {
    expect(parseSession({ ...aSession(), refreshToken: '' })).toBeNull();
    expect(parseSession(null)).toBeNull();
  });
});
