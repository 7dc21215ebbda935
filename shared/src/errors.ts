/**
 * A typed error for bad input to a computation. It names the field and the rule, so the
 * app can say what to fix instead of showing a wrong number.
 */
export class InputError extends Error {
  override readonly name = 'InputError';
  constructor(
    readonly field: string,
    readonly rule: string,
    message?: string,
  ) {
    super(message ?? `${field}: ${rule}`);
  }
}
