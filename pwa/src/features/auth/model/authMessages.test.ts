// @vitest-environment node
import { describe, expect, it } from 'vitest';
import { ApiError, NetworkError } from '../../../api/errors';
import { authErrorMessage } from './authMessages';

describe('sign-in error messages', () => {
  it('says the e-mail and password do not match on 401, without saying which one', () => {
    const message = authErrorMessage(
      'sign-in',
      new ApiError(401, 'invalid-credentials', 'E-mail or password is not right'),
    );
    expect(message).toMatch(/e-mail and password don't match/);
  });

  it('asks to wait when rate-limited', () => {
    expect(authErrorMessage('sign-in', new ApiError(429, 'too-many-requests', 'x'))).toMatch(
      /Wait a minute/,
    );
  });

  it('explains that signing in needs a signal once', () => {
    expect(authErrorMessage('sign-in', new NetworkError())).toMatch(/needs a connection once/);
  });

  it('tells a helper when an invite link is used up', () => {
    expect(authErrorMessage('accept-invite', new ApiError(404, 'not-found', 'x'))).toMatch(
      /expired or was already used/,
    );
  });

  it('passes the validation rule on from the server', () => {
    const error = new ApiError(400, 'bad-request', 'password must be at least 10 characters');
    expect(authErrorMessage('sign-up', error)).toBe(
      'Check what you typed: password must be at least 10 characters.',
    );
  });
});
