/** Checks made on the phone before asking the server, each said as what to do. */

export function emailProblem(email: string): string | null {
  const value = email.trim();
  if (value === '') return 'Type your e-mail address.';
  if (!/^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(value))
    return 'That does not look like an e-mail address.';
  return null;
}

export function passwordProblem(password: string): string | null {
  return password === '' ? 'Type your password.' : null;
}

/** The server's rule for new passwords (sign-up, invites): at least 10 characters. */
export const newPasswordMinLength = 10;

export function newPasswordProblem(password: string): string | null {
  if (password === '') return 'Choose a password.';
  if (password.length < newPasswordMinLength) {
    return `Use at least ${newPasswordMinLength} characters (${password.length} so far).`;
  }
  return null;
}

export function requiredProblem(value: string, what: string): string | null {
  return value.trim() === '' ? `Type ${what}.` : null;
}
