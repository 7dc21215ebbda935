import type { TimerRow } from '@panelpass/shared';
import { describe, expect, it } from 'vitest';
import { FALLBACK_KEEP_DRY_HOURS, hoursProblem, keepDryDefault, keepDryView } from './keepDry';

/** The demo's glass-coat protection: 720 min (12 h) cure at 20 °C, 10–32 °C. */
const coating = {
  refC: 20,
  flashMinAtRef: 5,
  cureMinAtRef: 720,
  minC: 10,
  maxC: 32,
  maxRhPercent: 80,
};

describe('keepDryDefault — the keep-dry window a protection product gets', () => {
  it('at the data sheet’s temperature it is the sheet’s cure time', () => {
    const d = keepDryDefault({
      properties: coating,
      productName: 'Glass-coat protection',
      tempC: 20,
      settingsHours: 24,
      unit: 'C',
    });
    expect(d).toMatchObject({ hours: 12, source: 'product' });
    expect(d.words).toBe(
      '12 h: the data sheet’s 12 h cure at 20.0 °C, scaled to the panel’s 20.0 °C.',
    );
  });

  it('a colder panel makes it longer (shared scaleCureTimes, Q10 = 2), rounded up to the half hour', () => {
    // 12 h × 2^((20 − 15)/10) = 16.97 h → 17 h.
    expect(
      keepDryDefault({
        properties: coating,
        productName: 'x',
        tempC: 15,
        settingsHours: 24,
        unit: 'C',
      }).hours,
    ).toBe(17);
    // 12 h × 2^(−0.2) = 10.45 h → 10.5 h.
    expect(
      keepDryDefault({
        properties: coating,
        productName: 'x',
        tempC: 22,
        settingsHours: 24,
        unit: 'C',
      }).hours,
    ).toBe(10.5);
  });

  it('too cold for the product: the settings’ hours, with the reason why not the sheet’s', () => {
    const d = keepDryDefault({
      properties: coating,
      productName: 'Glass-coat protection',
      tempC: 6,
      settingsHours: 24,
      unit: 'C',
    });
    expect(d).toMatchObject({ hours: 24, source: 'settings' });
    expect(d.words).toBe(
      'The cure time could not be scaled (see below), so the business’s default keep-dry window: 24 h.',
    );
    expect(d.reasons.map((r) => r.code)).toEqual(['below-product-minimum']);
  });

  it('no cure time on the Shelf, or no temperature: the settings’ hours', () => {
    expect(
      keepDryDefault({
        properties: {},
        productName: 'Spray sealant',
        tempC: 20,
        settingsHours: 8,
        unit: 'C',
      }),
    ).toMatchObject({
      hours: 8,
      source: 'settings',
      words:
        'No cure time on the Shelf for Spray sealant, so the business’s default keep-dry window: 8 h.',
    });
    expect(
      keepDryDefault({
        properties: coating,
        productName: 'x',
        tempC: null,
        settingsHours: 8,
        unit: 'C',
      }).words,
    ).toMatch(/^No temperature reading/);
  });

  it('neither the product nor the settings: our own 12 h', () => {
    const d = keepDryDefault({
      properties: null,
      productName: null,
      tempC: null,
      settingsHours: null,
      unit: 'C',
    });
    expect(d).toEqual({
      hours: FALLBACK_KEEP_DRY_HOURS,
      source: 'fallback',
      words: 'Our own default: 12 h.',
      reasons: [],
    });
  });

  it('checks the typed hours', () => {
    expect(hoursProblem(null)).toMatch(/Type the hours/);
    expect(hoursProblem(0)).toMatch(/above zero/);
    expect(hoursProblem(721)).toMatch(/at most 30 days/);
    expect(hoursProblem(12)).toBeNull();
  });
});

describe('keepDryView — a running keep-dry timer in words', () => {
  const T = Date.parse('2026-05-15T12:00:00.000Z');
  const timer = (over: Partial<TimerRow> = {}) => ({
    endsAt: new Date(T + 3 * 3_600_000).toISOString(),
    pausedMs: 0,
    pausedAt: null,
    acknowledgedAt: null,
    cancelledAt: null,
    ...over,
  });

  it('while it runs: until when, and the time left', () => {
    const v = keepDryView(timer(), T);
    expect(v.tag).toBe('Keep dry');
    expect(v.headline).toMatch(/^Keep dry until /);
    expect(v.words).toBe('3 h left. No water, washing or rain on it until then.');
  });

  it('after its end: the window ended', () => {
    expect(keepDryView(timer(), T + 4 * 3_600_000)).toMatchObject({ tag: 'Cured', tone: 'done' });
  });

  it('paused: frozen time left', () => {
    const paused = timer({ pausedAt: new Date(T + 3_600_000).toISOString() });
    expect(keepDryView(paused, T + 2 * 3_600_000).headline).toBe('Keep dry: paused with 2 h left');
  });
});
