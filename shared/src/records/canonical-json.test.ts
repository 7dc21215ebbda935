import { describe, expect, it } from 'vitest';
import { isInputError } from '../errors';
import { canonicalJson } from './canonical-json';

describe('canonicalJson', () => {
  // RFC 8785 §3.2.2 (the example of the whole scheme): input text and its canonical form.
  it('matches the RFC 8785 §3.2.2 example', () => {
    const input = JSON.parse(
      String.raw`{
        "numbers": [333333333.33333329, 1E30, 4.50, 2e-3, 0.000000000000000000000000001],
        "string": "\u20ac$\u000F\u000aA'\u0042\u0022\u005c\\\"\/",
        "literals": [null, true, false]
      }`,
    ) as unknown;
    expect(canonicalJson(input)).toBe(
      String.raw`{"literals":[null,true,false],"numbers":[333333333.3333333,1e+30,4.5,0.002,1e-27],"string":"€$\u000f\nA'B\"\\\\\"/"}`,
    );
  });

  // RFC 8785 §3.2.3: members sorted by UTF-16 code units, not by code point or locale.
  it('sorts member names by UTF-16 code units (RFC 8785 §3.2.3 example)', () => {
    const input = {
      '\u20ac': 'Euro Sign',
      '\r': 'Carriage Return',
      '\ufb33': 'Hebrew Letter Dalet With Dagesh',
      '1': 'One',
      '\ud83d\ude00': 'Emoji: Grinning Face',
      '\u0080': 'Control',
      '\u00f6': 'Latin Small Letter O With Diaeresis',
    };
    // (Read back as text: a parsed object would list the integer-like name "1" first.)
    const order = ['\r', '1', '\u0080', '\u00f6', '\u20ac', '\ud83d\ude00', '\ufb33'] as const;
    expect(canonicalJson(input)).toBe(
      `{${order.map((k) => `${JSON.stringify(k)}:${JSON.stringify(input[k])}`).join(',')}}`,
    );
    expect(canonicalJson(input).startsWith('{"\\r":"Carriage Return","1":"One",')).toBe(true);
  });

  // RFC 8785 Appendix B: IEEE 754 values and their canonical text.
  it.each([
    [0, '0'],
    [-0, '0'],
    [5e-324, '5e-324'],
    [-5e-324, '-5e-324'],
    [1.7976931348623157e308, '1.7976931348623157e+308'],
    [9007199254740992, '9007199254740992'],
    [295147905179352830000, '295147905179352830000'],
    [9.999999999999997e22, '9.999999999999997e+22'],
    [1e23, '1e+23'],
    [0.000001, '0.000001'],
    [9.999999999999997e-7, '9.999999999999997e-7'],
  ])('writes %s as %s (RFC 8785 Appendix B)', (n, expected) => {
    expect(canonicalJson(n)).toBe(expected);
  });

  it('gives the same text whatever the member order, nested objects included', () => {
    const a = { panel: 'hood', readings: [{ um: 112, at: 1 }], signer: { name: 'Ivo Brandt' } };
    const b = { signer: { name: 'Ivo Brandt' }, readings: [{ at: 1, um: 112 }], panel: 'hood' };
    expect(canonicalJson(a)).toBe(canonicalJson(b));
    expect(canonicalJson(a)).toBe(
      '{"panel":"hood","readings":[{"at":1,"um":112}],"signer":{"name":"Ivo Brandt"}}',
    );
  });

  it('keeps array order (it carries meaning)', () => {
    expect(canonicalJson([3, 1, 2])).toBe('[3,1,2]');
  });

  it('leaves out members whose value is undefined, as JSON transport does', () => {
    expect(canonicalJson({ a: 1, b: undefined })).toBe(canonicalJson(JSON.parse('{"a":1}')));
  });

  const refused = (value: unknown) => {
    try {
      canonicalJson(value);
    } catch (e) {
      return isInputError(e) ? e.field : 'other error';
    }
    return 'accepted';
  };

  it('refuses what has no single JSON text, naming where it is', () => {
    expect(refused({ a: [1, Number.NaN] })).toBe('value.a[1]');
    expect(refused({ a: Number.POSITIVE_INFINITY })).toBe('value.a');
    expect(refused({ when: new Date(0) })).toBe('value.when');
    expect(refused({ n: 1n })).toBe('value.n');
    expect(refused([undefined])).toBe('value[0]');
    expect(refused({ s: 'broken \ud800 pair' })).toBe('value.s');
    expect(refused(undefined)).toBe('value');
    const loop: Record<string, unknown> = {};
    loop.self = loop;
    expect(refused(loop)).toBe('value.self');
  });

  it('accepts a repeated (not circular) reference', () => {
    const shared = { x: 1 };
    expect(canonicalJson({ a: shared, b: shared })).toBe('{"a":{"x":1},"b":{"x":1}}');
  });
});
