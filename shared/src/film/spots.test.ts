import { describe, expect, it } from 'vitest';
import { acceptIso19840, acceptSpotsSspcPa2, spotMean, sspcPa2Sampling } from './spots';
import { micrometresToMil, milToMicrometres } from './units';

const mil = (m: number) => milToMicrometres(m);
const spotAt = (m: number) => [mil(m), mil(m), mil(m)];

describe('spots and SSPC-PA 2 acceptance', () => {
  it('a spot is the mean of its readings, and SSPC-PA 2 asks for at least 3', () => {
    expect(spotMean([100, 110, 120])).toMatchObject({
      meanUm: 110,
      count: 3,
      enoughReadings: true,
    });
    const two = spotMean([100, 110]);
    expect(two.enoughReadings).toBe(false);
    expect(two.reasons[0]?.code).toBe('fewer-than-three-readings');
  });

  it('spec 8–12 mil allows spots of 6.4–14.4 mil (SSPC-PA 2 example, check-values.md)', () => {
    const result = acceptSpotsSspcPa2({
      spots: [spotAt(10)],
      specMinUm: mil(8),
      specMaxUm: mil(12),
    });
    expect(micrometresToMil(result.allowedMinUm)).toBeCloseTo(6.4, 9);
    expect(micrometresToMil(result.allowedMaxUm)).toBeCloseTo(14.4, 9);
  });

  it('accepts spots exactly at 80 % of the minimum and 120 % of the maximum, rejects just outside (SSPC-PA 2)', () => {
    const edges = acceptSpotsSspcPa2({
      spots: [spotAt(6.4), spotAt(14.4)],
      specMinUm: mil(8),
      specMaxUm: mil(12),
    });
    expect(edges.spots.map((s) => s.verdict)).toEqual(['within', 'within']);
    expect(edges.ok).toBe(true);
    const outside = acceptSpotsSspcPa2({
      spots: [spotAt(6.39), spotAt(14.41), spotAt(10)],
      specMinUm: mil(8),
      specMaxUm: mil(12),
      displayUnit: 'mil',
    });
    expect(outside.ok).toBe(false);
    expect(outside.spots.map((s) => s.verdict)).toEqual(['below', 'above', 'within']);
    expect(outside.reasons.map((r) => r.message)).toEqual([
      'Spot 1 is 6.39 mil, under the 6.4 mil allowed.',
      'Spot 2 is 14.41 mil, over the 14.4 mil allowed.',
    ]);
  });

  it('judges spots, not single readings (SSPC-PA 2): one low reading in a good spot passes', () => {
    const result = acceptSpotsSspcPa2({
      spots: [[mil(5), mil(11), mil(11)]],
      specMinUm: mil(8),
      specMaxUm: mil(12),
    });
    expect(result.spots[0]?.verdict).toBe('within');
  });

  it('does not judge a spot with fewer than 3 readings', () => {
    const result = acceptSpotsSspcPa2({ spots: [[mil(2)]], specMinUm: mil(8), specMaxUm: mil(12) });
    expect(result.spots[0]?.verdict).toBe('not-judged');
    expect(result.reasons.map((r) => r.code)).toEqual(['spot-not-judged', 'no-spot-judged']);
    expect(result.ok).toBe(false);
  });

  it('refuses a minimum above the maximum and an empty spot list', () => {
    expect(() =>
      acceptSpotsSspcPa2({ spots: [spotAt(10)], specMinUm: 300, specMaxUm: 200 }),
    ).toThrow(expect.objectContaining({ field: 'specMinUm', rule: 'order' }));
    expect(() => acceptSpotsSspcPa2({ spots: [], specMinUm: 200, specMaxUm: 300 })).toThrow(
      expect.objectContaining({ field: 'spots', rule: 'non-empty' }),
    );
    expect(() =>
      acceptSpotsSspcPa2({ spots: [[100, -1, 100]], specMinUm: 200, specMaxUm: 300 }),
    ).toThrow(expect.objectContaining({ field: 'spots[0][1]' }));
  });
});

describe('ISO 19840 acceptance (NDFT ≥ 40 µm)', () => {
  it('accepts: mean ≥ NDFT, all ≥ 80 %, under 20 % in [80, 100) %, none over 3 × NDFT', () => {
    const readings = [100, 110, 120, 95, 105, 130, 115, 100, 108, 112];
    expect(acceptIso19840({ readingsUm: readings, ndftUm: 100 })).toMatchObject({
      ok: true,
      maxUm: 300,
    });
  });

  it('rejects a reading under 80 % of NDFT even when the mean is fine', () => {
    const result = acceptIso19840({ readingsUm: [79, 150, 150, 150, 150], ndftUm: 100 });
    expect(result.reasons.map((r) => r.code)).toEqual(['reading-below-80-percent']);
  });

  it('rejects when 20 % or more of readings sit in [80, 100) % of NDFT', () => {
    const result = acceptIso19840({
      readingsUm: [80, 99, 130, 130, 130, 130, 130, 130, 130, 130],
      ndftUm: 100,
    });
    expect(result.shareBetween80And100).toBe(0.2);
    expect(result.reasons.map((r) => r.code)).toEqual(['too-many-between-80-and-100-percent']);
  });

  it('rejects a mean under NDFT and a reading over the maximum', () => {
    expect(
      acceptIso19840({ readingsUm: [100, 100, 90, 95, 90], ndftUm: 100 }).reasons.map(
        (r) => r.code,
      ),
    ).toContain('mean-below-ndft');
    expect(
      acceptIso19840({ readingsUm: [100, 120, 301], ndftUm: 100 }).reasons.map((r) => r.code),
    ).toEqual(['reading-above-maximum']);
  });

  it('warns under its 40 µm scope', () => {
    expect(
      acceptIso19840({ readingsUm: [30, 35], ndftUm: 30 }).reasons.map((r) => r.code),
    ).toContain('outside-iso-19840-scope');
  });
});

describe('SSPC-PA 2 sampling counts', () => {
  it.each([
    [2_800, 5, 25, 75],
    [12_500, 15, 75, 225],
    [28_000, 30, 150, 450],
  ])(
    '%i ft² → %i areas, %i spots, %i readings (SSPC-PA 2, check-values.md)',
    (ft2, areas, spots, readings) => {
      expect(sspcPa2Sampling(ft2)).toEqual({ areas, spots, readings });
    },
  );

  it('small areas: each 100 ft² up to 300 ft², 3 areas up to 1,000 ft² (from memory)', () => {
    expect(sspcPa2Sampling(150).areas).toBe(2);
    expect(sspcPa2Sampling(700).areas).toBe(3);
  });
});
