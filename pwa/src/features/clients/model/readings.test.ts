import { describe, expect, it } from 'vitest';
import { readingsHistory, readingsSummary } from './readings';

const panel = (jobId: string, panelKey: string, label: string, position: number) => ({
  id: `${jobId}:${panelKey}`,
  jobId,
  panelKey,
  label,
  position,
});
const reading = (
  jobId: string,
  panelKey: string,
  phase: string,
  readingsUm: number[],
  takenAt: string,
) => ({
  jobId,
  panelId: `${jobId}:${panelKey}`,
  phase,
  readingsUm,
  takenAt,
});

const jobs = [{ id: 'j-spring' }, { id: 'j-autumn' }];
const panels = [
  panel('j-spring', 'roof', 'Roof', 0),
  panel('j-spring', 'hood', 'Hood', 1),
  panel('j-autumn', 'roof', 'Roof', 0),
  panel('j-autumn', 'hood', 'Bonnet', 1),
];

describe('readingsHistory', () => {
  const h = readingsHistory(jobs, panels, [
    // Autumn first in the list: the visits still come out in time order.
    reading('j-autumn', 'hood', 'before', [100, 102, 104], '2025-10-02T09:30:00.000Z'),
    reading('j-spring', 'hood', 'before', [120, 122, 118], '2025-04-03T09:10:00.000Z'),
    // Two spots on the spring roof: the panel's value is the mean of the spot means.
    reading('j-spring', 'roof', 'before', [110, 110, 110], '2025-04-03T09:00:00.000Z'),
    reading('j-spring', 'roof', 'before', [115, 116, 117], '2025-04-03T09:05:00.000Z'),
    reading('j-spring', 'hood', 'after', [112, 113, 114], '2025-04-03T15:00:00.000Z'),
    // Another vehicle's job: not this vehicle's history.
    reading('j-other', 'roof', 'before', [300, 300, 300], '2025-05-01T09:00:00.000Z'),
  ]);

  it('has one column per visit and phase, in time order', () => {
    expect(h.visits.map((v) => v.key)).toEqual([
      'j-spring/before',
      'j-spring/after',
      'j-autumn/before',
    ]);
    expect(h.visits[0]!.atMs).toBe(Date.parse('2025-04-03T09:00:00.000Z'));
  });

  it('gives each panel, top down, its mean per visit (null where not measured)', () => {
    expect(h.panels).toEqual([
      { panelKey: 'roof', label: 'Roof', values: [113, null, null] },
      { panelKey: 'hood', label: 'Bonnet', values: [120, 113, 102] },
    ]);
  });

  it('says what the chart shows in words', () => {
    expect(readingsSummary(h, (um) => `${um} µm`)).toBe(
      'Paint film per panel over time: 2 panels, 3 sets of readings. Latest: thinnest Bonnet at 102 µm, thickest Bonnet at 102 µm.',
    );
    expect(readingsSummary(readingsHistory([], [], []), String)).toBe(
      'No paint film readings for this vehicle yet.',
    );
  });
});
