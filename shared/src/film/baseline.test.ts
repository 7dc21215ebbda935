import { describe, expect, it } from 'vitest';
import { PanelFilmInput, flagPanels } from './baseline';

// Invented readings (demo data, not measurements). Thresholds are the defaults: common
// practice, no published source.
const steel = (panelId: string, ...spotMeansUm: number[]): PanelFilmInput => ({
  panelId,
  substrate: 'steel',
  gauge: 'magnetic',
  spotMeansUm,
});

describe('panel flags against the vehicle baseline', () => {
  const car = [
    steel('roof', 110, 114, 112),
    steel('hood', 118, 120, 116),
    steel('left-front-door', 108, 112, 110),
    steel('right-front-door', 230, 240, 236),
    steel('left-rear-quarter', 70, 74, 72),
    steel('right-rear-quarter', 115, 520, 118),
    {
      panelId: 'front-bumper',
      substrate: 'plastic',
      gauge: 'magnetic',
      spotMeansUm: [45, 50, 44],
    } as PanelFilmInput,
  ];

  it('takes the median of the metal panels as the baseline', () => {
    // Metal panel means: 112, 118, 110, 235.33, 72, 251 → median (112 + 118)/2 = 115.
    expect(flagPanels({ panels: car }).baselineUm).toBeCloseTo(115, 9);
  });

  it('flags thin, probably repainted and probably filled panels', () => {
    const result = flagPanels({ panels: car });
    const flags = Object.fromEntries(result.panels.map((p) => [p.panelId, p.flags]));
    expect(flags).toEqual({
      roof: [],
      hood: [],
      'left-front-door': [],
      'right-front-door': ['probably-repainted'],
      'left-rear-quarter': ['thin'],
      'right-rear-quarter': ['probably-filled'],
      'front-bumper': [],
    });
  });

  it('does not use a metal-gauge reading on a plastic bumper (ASTM D7091 / D6132)', () => {
    const bumper = flagPanels({ panels: car }).panels.find((p) => p.panelId === 'front-bumper');
    expect(bumper).toMatchObject({ meanUm: null, ratio: null });
    expect(bumper?.reasons[0]?.code).toBe('reading-not-valid');
  });

  it('uses the user-edited thresholds', () => {
    const result = flagPanels({
      panels: car,
      thresholds: { repaintedRatio: 2.5, filledAboveUm: 600 },
    });
    const door = result.panels.find((p) => p.panelId === 'right-front-door');
    const quarter = result.panels.find((p) => p.panelId === 'right-rear-quarter');
    expect(door?.flags).toEqual([]);
    expect(quarter?.flags).toEqual([]);
  });

  it('needs three metal panels for a baseline, and still checks the absolute thin limit', () => {
    const result = flagPanels({ panels: [steel('hood', 118), steel('roof', 72)] });
    expect(result.baselineUm).toBeNull();
    expect(result.reasons[0]?.code).toBe('too-few-panels-for-baseline');
    expect(result.panels[1]?.flags).toEqual(['thin']);
  });

  it('refuses duplicate ids, empty readings and negative readings', () => {
    expect(() => flagPanels({ panels: [steel('hood', 100), steel('hood', 110)] })).toThrow(
      expect.objectContaining({ field: 'panels[1].panelId', rule: 'unique' }),
    );
    expect(() => flagPanels({ panels: [steel('hood')] })).toThrow(
      expect.objectContaining({ field: 'panels[0].spotMeansUm', rule: 'non-empty' }),
    );
    expect(() => flagPanels({ panels: [steel('hood', -3)] })).toThrow(
      expect.objectContaining({ field: 'panels[0].spotMeansUm[0]', rule: 'non-negative' }),
    );
    expect(() => flagPanels({ panels: [] })).toThrow(expect.objectContaining({ field: 'panels' }));
  });
});
