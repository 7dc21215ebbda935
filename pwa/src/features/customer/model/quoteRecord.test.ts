import { canonicalJson } from '@panelpass/shared';
import { createHash } from 'node:crypto';
import { recordHash } from '../../../db/hashing';
import { describe, expect, it } from 'vitest';
import {
  buildQuoteRecord,
  dayInput,
  visitProblem,
  visitWindow,
  type CustomerQuote,
} from './quoteRecord';

const quote: CustomerQuote = {
  id: '2b0c8c1e-5a0e-4f57-9a57-0d7f3f0c1a11',
  status: 'sent',
  vehicleId: 'v1',
  currency: 'EUR',
  subtotalMinor: 100_000,
  discountMinor: 0,
  taxMinor: 23_450,
  totalMinor: 123_450,
  depositMinor: 30_000,
  labourHours: 4.2,
  validUntil: null,
  sentAt: null,
  acceptedAt: null,
  jobId: null,
  lines: [
    {
      id: 'b',
      position: 1,
      kind: 'chip',
      description: 'Chip touch-up × 3',
      quantity: 3,
      unitPriceMinor: 1_500,
      amountMinor: 4_500,
    },
    {
      id: 'a',
      position: 0,
      kind: 'service',
      description: 'Two-step correction',
      quantity: 1,
      unitPriceMinor: 95_500,
      amountMinor: 95_500,
    },
  ],
};

describe('visitWindow', () => {
  it("lasts the quote's labour rounded up to the half hour, and at least an hour", () => {
    const w = visitWindow('2031-03-04', 9, 4.2)!;
    expect(w.start).toEqual(new Date(2031, 2, 4, 9, 0));
    expect(w.end).toEqual(new Date(2031, 2, 4, 13, 30));
    const short = visitWindow('2031-03-04', 14, 0.2)!;
    expect(short.end.getTime() - short.start.getTime()).toBe(3_600_000);
  });

  it('refuses a day that is not on the calendar', () => {
    expect(visitWindow('2031-02-30', 9, 2)).toBeNull();
    expect(visitWindow('', 9, 2)).toBeNull();
  });
});

describe('visitProblem', () => {
  const now = new Date(2031, 2, 4, 15, 0);
  it('books from tomorrow on, within a year', () => {
    expect(visitProblem(visitWindow(dayInput(now), 16, 1), now)).toMatch(/from tomorrow/);
    expect(visitProblem(visitWindow('2031-03-05', 8, 1), now)).toBeNull();
    expect(visitProblem(visitWindow('2032-06-01', 8, 1), now)).toMatch(/next year/);
    expect(visitProblem(null, now)).toMatch(/Choose the day/);
  });
});

describe('buildQuoteRecord', () => {
  const visit = visitWindow('2031-03-05', 9, 4.2)!;
  const record = buildQuoteRecord({
    quote,
    business: 'Heronwake Mobile Finish',
    vehicle: 'dark green Tessaly Longroof',
    visit,
    locale: 'en-GB',
  });

  it("shows every amount in the business's currency, lines in the quote's order", () => {
    expect(record.lines.map((l) => l.description)).toEqual([
      'Two-step correction',
      'Chip touch-up × 3',
    ]);
    expect(record.words.total).toBe('€1,234.50');
    expect(record.words.deposit).toBe('€300.00');
    expect(record.lines[1]!.amount).toBe('€45.00');
    expect(record.visit.windowStart).toBe(visit.start.toISOString());
  });

  it('hashes as the server does (SHA-256 of canonical JSON), and any change changes it', async () => {
    const expected = createHash('sha256').update(canonicalJson(record), 'utf8').digest('hex');
    expect(await recordHash(record)).toBe(expected);
    const other = buildQuoteRecord({
      quote: { ...quote, totalMinor: quote.totalMinor + 1 },
      business: 'Heronwake Mobile Finish',
      vehicle: 'dark green Tessaly Longroof',
      visit,
      locale: 'en-GB',
    });
    expect(await recordHash(other)).not.toBe(expected);
  });
});
