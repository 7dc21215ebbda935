import type {
  ChipLayerRow,
  ChipRow,
  CorrectionPassRow,
  PhotoRow,
  TimerRow,
} from '@panelpass/shared';
import { describe, expect, it } from 'vitest';
import { recordHash } from '../../../db/images';
import { JOB, panelsFor } from '../../walkaround/model/testRows';
import { amountDue, buildAcceptanceRecord } from './handoverSummary';

const panels = panelsFor('sedan');
const [bonnet, roof] = [panels[0]!, panels[panels.length - 1]!];

const pass = (id: string, panelId: string, step: string, passes: number, at: string) =>
  ({ id, jobId: JOB, panelId, step, passes, result: '', loggedAt: at }) as CorrectionPassRow;

const input = {
  job: { id: JOB, address: '1 Test Lane' },
  vehicle: {
    year: 2019,
    make: 'Make',
    model: 'Model',
    colour: 'Blue',
    plate: 'AB1',
    bodyStyle: 'sedan',
  },
  panels,
  passes: [
    pass('p2', roof.id, 'polish', 1, '2025-05-01T10:00:00Z'),
    pass('p1', bonnet.id, 'cut', 2, '2025-05-01T09:00:00Z'),
    pass('p3', bonnet.id, 'polish', 1, '2025-05-01T09:30:00Z'),
  ],
  chips: [{ id: 'c1', jobId: JOB, panelId: bonnet.id, number: 1, layersPlanned: 3 } as ChipRow],
  chipLayers: [
    { id: 'l1', chipId: 'c1' },
    { id: 'l2', chipId: 'c1' },
  ] as ChipLayerRow[],
  timers: [
    {
      id: 't1',
      kind: 'keep-dry',
      label: 'Coating',
      endsAt: '2025-05-02T09:00:00Z',
      cancelledAt: null,
    },
    { id: 't2', kind: 'keep-dry', label: 'Old', endsAt: '2025-05-02T08:00:00Z', cancelledAt: 'x' },
    { id: 't3', kind: 'flash', label: 'Flash', endsAt: '2025-05-01T09:00:00Z', cancelledAt: null },
  ] as TimerRow[],
  photos: [{ id: 'a' }, { id: 'b' }] as PhotoRow[],
} as Parameters<typeof buildAcceptanceRecord>[0];

describe('buildAcceptanceRecord', () => {
  it('lists panels in order with their passes, chips with layers, protection and photos', () => {
    const r = buildAcceptanceRecord(input);
    expect(r.kind).toBe('acceptance');
    expect(r.panels).toEqual([
      { panel: bonnet.label, passes: ['Cut, 2 passes', 'Polish, 1 pass'] },
      { panel: roof.label, passes: ['Polish, 1 pass'] },
    ]);
    expect(r.chips).toEqual([{ number: 1, panel: bonnet.label, layers: '2 of 3 layers' }]);
    expect(r.protection).toEqual([{ label: 'Coating', keepDryUntil: '2025-05-02T09:00:00Z' }]);
    expect(r.photos).toBe(2);
  });

  it('gives the same hash whatever order the rows come in', async () => {
    const a = await recordHash(buildAcceptanceRecord(input));
    const b = await recordHash(
      buildAcceptanceRecord({ ...input, passes: [...input.passes].reverse() }),
    );
    expect(a).toBe(b);
    const c = await recordHash(buildAcceptanceRecord({ ...input, photos: [] }));
    expect(c).not.toBe(a);
  });
});

describe('amountDue', () => {
  const paid = (kind: string, amountMinor: number, status = 'succeeded') => ({
    kind,
    status,
    amountMinor,
  });

  it('takes off what went through and says what is left', () => {
    const due = amountDue(
      45_000,
      [paid('deposit', 10_000), paid('balance', 5_000, 'pending')],
      'USD',
    );
    expect(due).toEqual({ dueMinor: 35_000, words: '$350.00 due of $450.00.', settled: false });
  });

  it('says when nothing is due, and nothing without a price', () => {
    expect(amountDue(100, [paid('balance', 100)], 'USD')?.words).toBe(
      'Paid in full. Nothing is due.',
    );
    expect(amountDue(100, [], 'USD')?.words).toBe('$1.00 due.');
    expect(amountDue(undefined, [], 'USD')).toBeNull();
  });
});
