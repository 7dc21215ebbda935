// Canonical JSON: one exact text for one JSON value, so a hash of what a customer signed
// can be recomputed anywhere (the device that showed it, the server that stores it).
//
// The rules are those of RFC 8785 (JSON Canonicalization Scheme) for the values a record
// holds: object members sorted by their names compared as UTF-16 code units, no
// whitespace, strings escaped as ECMAScript's JSON.stringify escapes them (only `"`, `\`
// and control characters; `\b \t \n \f \r` short, the rest as lower-case `\u00XX`),
// numbers written as ECMAScript writes them (shortest round-trip form, `-0` as `0`).
// Hash the UTF-8 bytes of the result.
//
// Refused (InputError) rather than guessed: NaN and ±Infinity, lone surrogates, bigint,
// functions, symbols, `undefined` in an array or at the top, and objects that are not
// plain (Date, Map…) — send such values as strings. An object member whose value is
// `undefined` is left out, as JSON.stringify leaves it out, so a record hashes the same
// before and after it travels as JSON.
import { InputError } from '../errors';

/** A value that has exactly one canonical JSON text. */
export type CanonicalValue =
  | null
  | boolean
  | number
  | string
  | readonly CanonicalValue[]
  | { readonly [key: string]: CanonicalValue | undefined };

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

function isPlainObject(value: object): boolean {
  const proto: unknown = Object.getPrototypeOf(value);
  return proto === Object.prototype || proto === null;
}

function text(field: string, value: string): string {
  if (LONE_SURROGATE.test(value)) {
    throw new InputError(field, 'format', `${field} holds a lone UTF-16 surrogate`);
  }
  return JSON.stringify(value);
}

function write(field: string, value: unknown, seen: Set<object>): string {
  if (value === null) return 'null';
  switch (typeof value) {
    case 'boolean':
      return value ? 'true' : 'false';
    case 'number':
      if (!Number.isFinite(value)) {
        throw new InputError(field, 'finite', `${field} must be a finite number, got ${value}`);
      }
      // ECMAScript Number::toString is the number form RFC 8785 §3.2.2.3 prescribes.
      return Object.is(value, -0) ? '0' : String(value);
    case 'string':
      return text(field, value);
    case 'object':
      break;
    default:
      throw new InputError(
        field,
        'format',
        `${field} is a ${typeof value}, which JSON cannot hold`,
      );
  }
  const obj = value;
  if (seen.has(obj)) throw new InputError(field, 'format', `${field} refers to itself`);
  seen.add(obj);
  try {
    if (Array.isArray(obj)) {
      const items = (obj as unknown[]).map((item, i) => {
        if (item === undefined) {
          throw new InputError(`${field}[${i}]`, 'format', `${field}[${i}] is undefined`);
        }
        return write(`${field}[${i}]`, item, seen);
      });
      return `[${items.join(',')}]`;
    }
    if (!isPlainObject(obj)) {
      throw new InputError(
        field,
        'format',
        `${field} must be a plain object, array, string, number, boolean or null`,
      );
    }
    const record = obj as Record<string, unknown>;
    // Default sort compares UTF-16 code units, as RFC 8785 §3.2.3 requires.
    const members = Object.keys(record)
      .sort()
      .filter((key) => record[key] !== undefined)
      .map(
        (key) => `${text(`${field}.${key}`, key)}:${write(`${field}.${key}`, record[key], seen)}`,
      );
    return `{${members.join(',')}}`;
  } finally {
    seen.delete(obj);
  }
}

/**
 * The canonical JSON text of a value (RFC 8785 rules; see the top of this file). Two
 * values that are equal as JSON data give the same text, whatever their member order.
 */
export function canonicalJson(value: unknown, field = 'value'): string {
  if (value === undefined) throw new InputError(field, 'format', `${field} is undefined`);
  return write(field, value, new Set());
}
