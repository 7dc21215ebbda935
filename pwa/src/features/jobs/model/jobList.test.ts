import type { CustomerRow, JobRow, VehicleRow } from '@panelpass/shared';
import { describe, expect, it } from 'vitest';
import { jobsOfDay, summarise } from './jobSummary';
import { listJobs, stageCounts } from './jobList';

const base = { businessId: 'b', version: 1, createdAt: '', updatedAt: '', deletedAt: null };
const day = (d: number, h: number) => new Date(2026, 4, 4 + d, h, 0, 0).getTime();
const NOW = day(0, 12);

const customers = new Map<string, CustomerRow>(
  [
    { id: 'c1', name: 'Ada Fernhill', address: '4 Gull Lane' },
    { id: 'c2', name: 'Corin Waylock', address: '17 Harbour Row' },
    { id: 'c3', name: 'Inès Marlowe', address: '88 Dune Road' },
  ].map((c) => [
    c.id,
    { ...base, email: null, phone: null, lat: null, lng: null, notes: '', ...c },
  ]),
);
const vehicles = new Map<string, VehicleRow>(
  [
    {
      id: 'v1',
      customerId: 'c1',
      make: 'Harrow',
      model: 'Ridgeback',
      colour: 'white',
      plate: 'LKB 4471',
    },
    {
      id: 'v2',
      customerId: 'c2',
      make: 'Tessaly',
      model: 'Longroof',
      colour: 'dark green',
      plate: 'LKB 2093',
    },
    { id: 'v3', customerId: 'c3', make: 'Calder', model: 'Sable', colour: 'silver', plate: null },
  ].map((v) => [v.id, { ...base, year: 2019, bodyStyle: 'sedan', paintNotes: '', ...v }]),
);
const job = (id: string, c: string, v: string, stage: string, d: number, h: number): JobRow => ({
  ...base,
  id,
  customerId: c,
  vehicleId: v,
  quoteId: null,
  address: customers.get(c)!.address,
  lat: null,
  lng: null,
  windowStart: new Date(day(d, h)).toISOString(),
  windowEnd: new Date(day(d, h + 3)).toISOString(),
  assignedTechId: null,
  stage,
  conditionNotes: '',
  notes: '',
  services: [],
});
const all = summarise(
  [
    job('pickup', 'c1', 'v1', 'correction', 0, 8),
    job('wagon', 'c2', 'v2', 'prep', 0, 14),
    job('sedan', 'c3', 'v3', 'booked', 1, 9),
    job('old', 'c1', 'v1', 'closed', -5, 9),
  ],
  customers,
  vehicles,
);

describe('the jobs list', () => {
  it('groups by day, newest day first, by start time within a day', () => {
    const groups = listJobs(all, 'all', '', NOW, 'en-GB');
    expect(groups.map((g) => [g.title, g.jobs.map((j) => j.job.id)])).toEqual([
      ['Tomorrow', ['sedan']],
      ['Today', ['pickup', 'wagon']],
      [expect.stringMatching(/29|30|Apr/), ['old']],
    ]);
  });

  it('filters by stage and counts each stage', () => {
    expect(listJobs(all, 'prep', '', NOW).flatMap((g) => g.jobs.map((j) => j.job.id))).toEqual([
      'wagon',
    ]);
    expect(stageCounts(all)).toMatchObject({ all: 4, booked: 1, prep: 1, closed: 1, finish: 0 });
  });

  it('searches customer, car, plate (spaces or not) and address; every word must match', () => {
    const ids = (q: string) =>
      listJobs(all, 'all', q, NOW).flatMap((g) => g.jobs.map((j) => j.job.id));
    expect(ids('corin')).toEqual(['wagon']);
    expect(ids('LKB4471')).toEqual(['pickup', 'old']);
    expect(ids('lkb 2093')).toEqual(['wagon']);
    expect(ids('dune')).toEqual(['sedan']);
    expect(ids('ines')).toEqual(['sedan']); // accents ignored
    expect(ids('harrow gull')).toEqual(['pickup', 'old']);
    expect(ids('harrow dune')).toEqual([]);
  });

  it("today's visits: windows starting on the phone's day, in order", () => {
    expect(jobsOfDay(all, NOW).map((j) => j.job.id)).toEqual(['pickup', 'wagon']);
  });
});
