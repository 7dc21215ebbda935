/**
 * A typed error for bad input to a computation. It names the field and the rule, so the
 * app can say what to fix instead of showing a wrong number.
 *
 * `rule` is a stable string (see {@link InputRule}); `field` is the input's path as the
 * caller wrote it, e.g. `readings[3].tempC` or `tax.ratePercent`.
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

/** The rules the computations check their input against (stable strings). */
export type InputRule =
  | 'finite'
  | 'non-negative'
  | 'positive'
  | 'range'
  | 'integer'
  | 'non-empty'
  | 'min-count'
  | 'one-of'
  | 'order'
  | 'format'
  | 'unique'
  | 'consistent';

/**
 * True for an {@link InputError}, also when it crossed a bundle boundary (two copies of
 * this package, e.g. the app's source import and the server's compiled one).
 */
export function isInputError(value: unknown): value is InputError {
  if (value instanceof InputError) return true;
  if (typeof value !== 'object' || value === null) return false;
  const candidate = value as { name?: unknown; field?: unknown; rule?: unknown };
  return (
    candidate.name === 'InputError' &&
    typeof candidate.field === 'string' &&
    typeof candidate.rule === 'string'
  );
}
