import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { chooseGeometry, glossImprovement, hazeIndex } from './gloss';

describe('gloss geometry (ISO 2813:2014 / ASTM D523)', () => {
  it.each([
    [95, 20],
    [70.1, 20],
    [70, 60],
    [40, 60],
    [10, 60],
    [9.9, 85],
    [0, 85],
  ])('60° reading of %d GU → measure at %i°', (g60, geometry) => {
    expect(chooseGeometry(g60).geometryDeg).toBe(geometry);
  });

  it('refuses negative and NaN readings', () => {
    expect(() => chooseGeometry(-1)).toThrow(
      expect.objectContaining({ field: 'g60Gu', rule: 'non-negative' }),
    );
    expect(() => chooseGeometry(Number.NaN)).toThrow(
      expect.objectContaining({ field: 'g60Gu', rule: 'finite' }),
    );
  });
});

describe('haze index (ASTM D4039: H = G60 − G20, valid only when G60 > 70)', () => {
  it('is G60 − G20 on a high-gloss finish', () => {
    expect(hazeIndex(92, 81)).toMatchObject({ valid: true, hazeIndex: 11 });
  });

  it('is not valid at or under 70 GU at 60°', () => {
    expect(hazeIndex(70, 50)).toMatchObject({ valid: false, hazeIndex: null });
    expect(hazeIndex(70, 50).reasons[0]?.basis).toBe('ASTM D4039');
  });
});

describe('gloss improvement before/after', () => {
  it('compares at 20° when the finish is high gloss and both readings have 20°', () => {
    const result = glossImprovement({ g20Gu: 55, g60Gu: 78 }, { g20Gu: 82, g60Gu: 91 });
    expect(result).toMatchObject({ geometryDeg: 20, beforeGu: 55, afterGu: 82, absoluteGu: 27 });
    expect(result.percent).toBeCloseTo(49.09, 2);
    expect(result.haze).toEqual({ before: 23, after: 9, change: -14 });
  });

  it('falls back to 60° when a 20° reading is missing, and says so', () => {
    const result = glossImprovement({ g60Gu: 64 }, { g60Gu: 88 });
    expect(result).toMatchObject({ geometryDeg: 60, absoluteGu: 24, percent: 37.5 });
    expect(result.reasons[0]?.code).toBe('compared-at-60');
  });

  it('gives no percentage from zero, and warns when gloss dropped', () => {
    expect(glossImprovement({ g60Gu: 0, g85Gu: 0 }, { g60Gu: 4, g85Gu: 12 }).percent).toBeNull();
    const worse = glossImprovement({ g60Gu: 40 }, { g60Gu: 35 });
    expect(worse.reasons.map((r) => r.code)).toEqual(['gloss-lower-after']);
  });

  it('absolute change equals after − before, and percent matches it (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 200, noNaN: true }),
        fc.double({ min: 0, max: 200, noNaN: true }),
        (b, a) => {
          const r = glossImprovement({ g60Gu: b }, { g60Gu: a });
          expect(r.absoluteGu).toBeCloseTo(r.afterGu - r.beforeGu, 9);
          expect(r.percent).toBeCloseTo(((r.afterGu - r.beforeGu) / r.beforeGu) * 100, 6);
        },
      ),
    );
  });

  it('refuses bad readings, naming which one', () => {
    expect(() => glossImprovement({ g60Gu: 40 }, { g60Gu: -2 })).toThrow(
      expect.objectContaining({ field: 'after.g60Gu' }),
    );
  });
});
