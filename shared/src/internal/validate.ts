// Input checks shared by every area. Each throws an InputError naming the field, so bad
// input never turns into a wrong number. They check at run time what the types already
// say, because the server and stored records hand us JSON.
import { InputError } from '../errors';

function describe(value: unknown): string {
  if (typeof value === 'number') return String(value);
  if (typeof value === 'string') return JSON.stringify(value);
  if (value === null) return 'null';
  return typeof value;
}

export function finite(field: string, value: unknown): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new InputError(
      field,
      'finite',
      `${field} must be a finite number, got ${describe(value)}`,
    );
  }
  return value;
}

export function nonNegative(field: string, value: unknown): number {
  const n = finite(field, value);
  if (n < 0) throw new InputError(field, 'non-negative', `${field} must not be negative, got ${n}`);
  return n;
}

export function positive(field: string, value: unknown): number {
  const n = finite(field, value);
  if (n <= 0) throw new InputError(field, 'positive', `${field} must be above zero, got ${n}`);
  return n;
}

/** A number inside [min, max] (both included unless said otherwise). */
export function inRange(
  field: string,
  value: unknown,
  min: number,
  max: number,
  options: { minExclusive?: boolean; maxExclusive?: boolean; unit?: string } = {},
): number {
  const n = finite(field, value);
  const belowMin = options.minExclusive ? n <= min : n < min;
  const aboveMax = options.maxExclusive ? n >= max : n > max;
  if (belowMin || aboveMax) {
    const unit = options.unit ? ` ${options.unit}` : '';
    const lo = options.minExclusive ? `above ${min}` : `from ${min}`;
    const hi = options.maxExclusive ? `below ${max}` : `to ${max}`;
    throw new InputError(field, 'range', `${field} must be ${lo} ${hi}${unit}, got ${n}${unit}`);
  }
  return n;
}

/** A safe integer (no silent precision loss). */
export function integer(field: string, value: unknown): number {
  const n = finite(field, value);
  if (!Number.isSafeInteger(n)) {
    throw new InputError(field, 'integer', `${field} must be a whole number, got ${n}`);
  }
  return n;
}

export function nonNegativeInteger(field: string, value: unknown): number {
  const n = integer(field, value);
  if (n < 0) throw new InputError(field, 'non-negative', `${field} must not be negative, got ${n}`);
  return n;
}

export function positiveInteger(field: string, value: unknown): number {
  const n = integer(field, value);
  if (n <= 0) throw new InputError(field, 'positive', `${field} must be above zero, got ${n}`);
  return n;
}

export function nonEmpty<T>(field: string, list: readonly T[] | undefined | null): readonly T[] {
  if (!Array.isArray(list)) {
    throw new InputError(field, 'non-empty', `${field} must be a list`);
  }
  const checked: readonly T[] = list;
  if (checked.length === 0) throw new InputError(field, 'non-empty', `${field} must not be empty`);
  return checked;
}

export function oneOf<T extends string>(field: string, value: unknown, options: readonly T[]): T {
  if (typeof value !== 'string' || !(options as readonly string[]).includes(value)) {
    throw new InputError(
      field,
      'one-of',
      `${field} must be one of ${options.join(', ')}, got ${describe(value)}`,
    );
  }
  return value as T;
}

export function bool(field: string, value: unknown): boolean {
  if (typeof value !== 'boolean') {
    throw new InputError(field, 'one-of', `${field} must be true or false, got ${describe(value)}`);
  }
  return value;
}

/** An instant as epoch milliseconds. */
export function epochMs(field: string, value: unknown): number {
  return finite(field, value);
}

// Array.isArray narrows to any[]; this keeps the caller's element type.
function isArray(value: unknown): boolean {
  return Array.isArray(value);
}

/** A list, possibly empty. */
export function list<T>(field: string, value: readonly T[] | undefined | null): readonly T[] {
  if (value === undefined || value === null || !isArray(value)) {
    throw new InputError(field, 'non-empty', `${field} must be a list`);
  }
  return value;
}
