import type { ClimateReadingRow } from '@panelpass/shared';
import { describe, expect, it } from 'vitest';
import {
  chipGate,
  chipPlanFor,
  chipWords,
  cureProductOf,
  earlyLayerWords,
  layerBlockers,
  reminderAfterLayer,
  temperatureReadings,
} from './chipPlan';

const MIN = 60_000;
const T = Date.parse('2026-05-15T13:00:00.000Z');
const clock = (ms: number) =>
  new Date(ms).toLocaleTimeString(undefined, { hour: 'numeric', minute: '2-digit' });

/** The demo's dark-green touch-up paint, as on the Shelf. */
const paint = {
  refC: 20,
  flashMinAtRef: 10,
  cureMinAtRef: 240,
  minC: 10,
  maxC: 35,
  maxRhPercent: 85,
};

function climate(over: Partial<ClimateReadingRow> = {}): ClimateReadingRow {
  return {
    id: 'c1',
    businessId: 'b',
    version: 1,
    createdAt: '',
    updatedAt: '',
    deletedAt: null,
    jobId: 'j',
    airC: 20,
    rhPct: 50,
    surfaceC: 20,
    takenAt: new Date(T).toISOString(),
    takenBy: 'u',
    ...over,
  };
}

function plan(layers: number[], nowMs: number, tempC = 20) {
  const outcome = chipPlanFor({
    layersAppliedAtMs: layers,
    layersPlanned: 3,
    paint,
    paintName: 'Touch-up paint, dark green',
    readings: [{ atMs: T, tempC }],
    nowMs,
    unit: 'C',
  });
  if (outcome.kind !== 'plan') throw new Error(outcome.message);
  return outcome.plan;
}

describe('chip status words (shared planChip)', () => {
  it('a chip with no layer is ready for layer 1 now', () => {
    expect(chipWords(plan([], T), T)).toMatchObject({
      tag: 'Ready',
      tone: 'go',
      headline: 'Ready for layer 1 now',
    });
  });

  it('while a layer flashes: "Ready for layer 2 at <time>", the wait, and the level-ready time', () => {
    const p = plan([T], T + 2 * MIN);
    const words = chipWords(p, T + 2 * MIN);
    expect(words).toMatchObject({ tag: 'Flashing', tone: 'wait' });
    expect(words.headline).toBe(`Ready for layer 2 at ${clock(T + 10 * MIN)}`);
    // Layers 2 and 3 each 10 min apart at 20 °C, then 240 min of cure after layer 3.
    expect(words.detail).toBe(
      `8 min to wait. Ready to level at ${clock(T + 260 * MIN)} if each layer goes on when ready.`,
    );
  });

  it('after the last layer: "Ready to level at <time>", then ready to level', () => {
    const layers = [T, T + 10 * MIN, T + 20 * MIN];
    expect(chipWords(plan(layers, T + 30 * MIN), T + 30 * MIN).headline).toBe(
      `Ready to level at ${clock(T + 260 * MIN)}`,
    );
    expect(chipWords(plan(layers, T + 261 * MIN), T + 261 * MIN)).toMatchObject({
      tag: 'Ready to level',
      tone: 'done',
    });
  });

  it('a colder panel makes every wait longer (Q10 = 2: 10 °C below the sheet doubles it)', () => {
    const words = chipWords(plan([T], T + MIN, 10), T + MIN);
    expect(words.headline).toBe(`Ready for layer 2 at ${clock(T + 20 * MIN)}`);
  });

  it('below the paint’s minimum it is not curing, and says so', () => {
    expect(chipWords(plan([T], T + MIN, 6), T + MIN)).toMatchObject({
      tag: 'Not curing',
      tone: 'stop',
    });
  });

  it('says why there is no plan: no cure times on the Shelf, or no temperature yet', () => {
    const noTimes = chipPlanFor({
      layersAppliedAtMs: [],
      layersPlanned: 3,
      paint: { minC: 10 },
      paintName: 'Grey touch-up',
      readings: [{ atMs: T, tempC: 20 }],
      nowMs: T,
      unit: 'C',
    });
    expect(noTimes).toEqual({
      kind: 'cannot-plan',
      message:
        'No flash and cure times on the Shelf for Grey touch-up: add them from its data sheet to plan the layers.',
    });
    expect(cureProductOf({ refC: 20, flashMinAtRef: 10 })).toBeNull();
    const noTemp = chipPlanFor({
      layersAppliedAtMs: [],
      layersPlanned: 3,
      paint,
      paintName: 'x',
      readings: [],
      nowMs: T,
      unit: 'C',
    });
    expect(noTemp.kind).toBe('cannot-plan');
  });

  it('takes each climate entry’s panel temperature (else the air’s) and the one typed', () => {
    const readings = temperatureReadings(
      [climate({ surfaceC: null, airC: 17, takenAt: new Date(T).toISOString() })],
      { tempC: 24, atMs: T + MIN },
    );
    expect(readings).toEqual([
      { atMs: T, tempC: 17, rhPercent: 50 },
      { atMs: T + MIN, tempC: 24 },
    ]);
  });
});

describe('the climate gate blocks the Layer button with every failing reason', () => {
  const window = { minC: 10, maxC: 35, maxRhPercent: 85 };

  it('surface too close to the dew point AND too humid: both reasons listed', () => {
    const gate = chipGate({
      latest: climate({ airC: 17, rhPct: 90, surfaceC: 17 }),
      entered: null,
      window,
      nowMs: T,
      unit: 'C',
    });
    expect(gate.ok).toBe(false);
    const blockers = layerBlockers(gate, null);
    expect(blockers).toHaveLength(2);
    expect(blockers[0]).toMatch(/^Surface is 1\.\d °C above dew point; needs at least 3 °C\.$/);
    expect(blockers[1]).toBe('Humidity is 90 %; the product allows at most 85 %.');
  });

  it('a good day lets the layer go on', () => {
    const gate = chipGate({ latest: climate(), entered: null, window, nowMs: T, unit: 'C' });
    expect(gate.ok).toBe(true);
    expect(layerBlockers(gate, null)).toEqual([]);
  });

  it('no climate reading: blocked, because the dew point cannot be checked', () => {
    const gate = chipGate({ latest: null, entered: null, window, nowMs: T, unit: 'C' });
    expect(gate.ok).toBe(false);
    expect(layerBlockers(gate, null)[0]).toMatch(/^No climate reading on this job/);
  });

  it('without a panel temperature it uses the typed one, else the air’s with a warning', () => {
    const noSurface = climate({ surfaceC: null });
    const typed = chipGate({
      latest: noSurface,
      entered: { tempC: 12, atMs: T },
      window,
      nowMs: T,
      unit: 'C',
    });
    expect(typed.reasons.map((r) => r.code)).toContain('typed-panel-temperature');
    const air = chipGate({ latest: noSurface, entered: null, window, nowMs: T, unit: 'C' });
    expect(air.reasons.map((r) => r.code)).toContain('air-used-for-surface');
  });

  it('an old climate reading asks for a new one, without blocking', () => {
    const gate = chipGate({
      latest: climate(),
      entered: null,
      window,
      nowMs: T + 3 * 60 * MIN,
      unit: 'C',
    });
    expect(gate.ok).toBe(true);
    expect(gate.reasons.find((r) => r.code === 'climate-reading-old')?.message).toMatch(
      /^The last climate reading is 3 h old/,
    );
  });

  it('the planner’s "too humid to apply" blocks too, said once', () => {
    const p = chipPlanFor({
      layersAppliedAtMs: [],
      layersPlanned: 2,
      paint,
      paintName: 'x',
      readings: [{ atMs: T, tempC: 20, rhPercent: 95 }],
      nowMs: T,
      unit: 'C',
    });
    if (p.kind !== 'plan') throw new Error('no plan');
    const gate = chipGate({
      latest: climate({ rhPct: 95 }),
      entered: null,
      window,
      nowMs: T,
      unit: 'C',
    });
    expect(
      layerBlockers(gate, p.plan).filter((m) => m.startsWith('Humidity is 95 %')),
    ).toHaveLength(1);
  });
});

describe('early layers and reminders', () => {
  it('a layer before the flash is done asks for a second tap, with the due time', () => {
    const p = plan([T], T + 2 * MIN);
    expect(earlyLayerWords(p, T + 2 * MIN)).toBe(
      `Layer 2 is due at ${clock(T + 10 * MIN)} (8 min to go): tap again to put it on now.`,
    );
    expect(earlyLayerWords(plan([T], T + 11 * MIN), T + 11 * MIN)).toBeNull();
  });

  it('after a layer, the reminder is for the next layer, or for levelling after the last', () => {
    expect(reminderAfterLayer(3, plan([T], T), T)).toEqual({
      label: 'Chip 3 ready for layer 2',
      endsAtMs: T + 10 * MIN,
    });
    const last = plan([T, T + 10 * MIN, T + 20 * MIN], T + 20 * MIN);
    expect(reminderAfterLayer(3, last, T + 20 * MIN)).toEqual({
      label: 'Chip 3 ready to level',
      endsAtMs: T + 260 * MIN,
    });
  });
});
