import { describe, expect, it } from 'vitest';
import { flushView, flushWhy, maskView, previewRemoveBy } from './flush';

const T = Date.parse('2026-05-15T14:30:00.000Z');
const MIN = 60_000;
const iso = (ms: number) => new Date(ms).toISOString();
const clock = (ms: number) =>
  new Date(ms).toLocaleTimeString(undefined, { hour: 'numeric', minute: '2-digit' });

describe('flushView — the flush countdown in words', () => {
  it('while it runs: "Flush by <time>", a minutes:seconds clock and the time left in words', () => {
    const v = flushView({ flushBy: iso(T + 2 * MIN + 41_000), flushedAt: null }, T);
    expect(v).toMatchObject({ state: 'running', tag: 'Running', clock: '2:41', tone: 'wait' });
    expect(v.headline).toBe(`Flush by ${clock(T + 2 * MIN + 41_000)}`);
    expect(v.words).toBe('2 min 41 s left');
  });

  it('the clock and the words agree on the seconds (both rounded up)', () => {
    const v = flushView({ flushBy: iso(T + 160_500), flushedAt: null }, T);
    expect(v.clock).toBe('2:41');
    expect(v.words).toBe('2 min 41 s left');
  });

  it('in the last minute it says to flush now, in the stop tone', () => {
    const v = flushView({ flushBy: iso(T + 40_000), flushedAt: null }, T);
    expect(v).toMatchObject({ state: 'due-soon', tag: 'Flush now', clock: '0:40', tone: 'stop' });
  });

  it('past the deadline: no clock, "Overdue" and by how much, in words', () => {
    const v = flushView({ flushBy: iso(T - 3 * MIN - 10_000), flushedAt: null }, T);
    expect(v).toMatchObject({ state: 'overdue', tag: 'Overdue', clock: null, tone: 'stop' });
    expect(v.words).toBe('Overdue by 3 min 10 s: flush it off now');
  });

  it('once flushed: the time it was flushed, and whether it was late', () => {
    const inTime = flushView({ flushBy: iso(T), flushedAt: iso(T - MIN) }, T + 10 * MIN);
    expect(inTime).toMatchObject({ tag: 'Flushed', tone: 'done', clock: null });
    expect(inTime.headline).toBe(`Flushed at ${clock(T - MIN)}`);
    const late = flushView({ flushBy: iso(T), flushedAt: iso(T + 2 * MIN) }, T + 10 * MIN);
    expect(late).toMatchObject({ tag: 'Flushed late', tone: 'wait' });
    expect(late.words).toBe('Flushed 2 min late: check the paint there');
  });

  it('a flush stamped a little ahead of this phone’s clock still shows as flushed', () => {
    const v = flushView({ flushBy: iso(T + MIN), flushedAt: iso(T + 5_000) }, T);
    expect(v.tag).toBe('Flushed');
  });
});

describe('flushWhy — why the flush-by time is what it is (shared flushBy)', () => {
  it('a hot panel in sun cuts the data sheet’s dwell, with the reasons', () => {
    const why = flushWhy({
      properties: { maxDwellMin: 4 },
      surfaceC: 30,
      inSun: true,
      appliedAtMs: T,
    });
    // 4 min × 2^((20−30)/10) × 0.5 = 1 min.
    expect(why.result.flushByMs).toBe(T + MIN);
    expect(why.dwell).toBe('1 min on the paint (data sheet: up to 4 min)');
    expect(why.reasons.map((r) => r.code)).toEqual([
      'shortened-for-hot-panel',
      'shortened-for-sun',
    ]);
  });

  it('a product without a dwell on the Shelf uses the default, and says so', () => {
    const why = flushWhy({ properties: {}, surfaceC: 18, inSun: false, appliedAtMs: T });
    expect(why.result.dwellMs).toBe(3 * MIN);
    expect(why.dwell).toContain('our default of 3 min');
  });
});

describe('maskView — masking remove-by in words (shared maskStatus)', () => {
  it('a day before the remove-by time it asks to remove it soon', () => {
    const v = maskView({ removeBy: iso(T + 5 * 60 * MIN), removedAt: null }, T);
    expect(v).toMatchObject({ state: 'due-soon', tag: 'Remove soon', tone: 'wait' });
    expect(v.words).toBe('5 h left before the adhesive may stay behind');
  });

  it('past it: overdue in words, in the stop tone', () => {
    const v = maskView({ removeBy: iso(T - 2 * 24 * 60 * MIN), removedAt: null }, T);
    expect(v).toMatchObject({ state: 'overdue', tag: 'Overdue', tone: 'stop' });
    expect(v.words).toMatch(/^Overdue by 2 days/);
  });

  it('long before it: "On", with the remove-by day', () => {
    const v = maskView({ removeBy: iso(T + 7 * 24 * 60 * MIN), removedAt: null }, T);
    expect(v).toMatchObject({ state: 'running', tag: 'On', words: null });
    expect(v.headline).toMatch(/^Remove by \w+/);
  });

  it('removed: "Removed at <time>" the same day', () => {
    const v = maskView({ removeBy: iso(T + MIN), removedAt: iso(T) }, T);
    expect(v.headline).toBe(`Removed at ${clock(T)}`);
    expect(v.tag).toBe('Removed');
  });

  it('previews the remove-by from the tape’s window, or the one-day default', () => {
    expect(previewRemoveBy({ cleanRemovalDays: 7 }, T)).toMatchObject({
      removeByMs: T + 7 * 24 * 60 * MIN,
      isDefault: false,
    });
    expect(previewRemoveBy(null, T)).toMatchObject({ days: 1, isDefault: true });
  });
});
