// @vitest-environment node
import Decimal from 'decimal.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { NetworkError, ApiError } from '../../../api/errors';
import type { LedgerEntry, LedgerMonth } from '../api/ledgerApi';
import { connectionOf } from './connection';
import {
  axisMoney,
  chartRange,
  daysIn,
  entryAmount,
  entryParty,
  entryTitle,
  isMonth,
  loadedWords,
  majorUnits,
  money,
  monthOf,
  monthRange,
  monthWords,
  profitSeries,
  profitWords,
  shiftMonth,
  workedTime,
} from './ledgerModel';

const anyMonth = fc
  .record({ y: fc.integer({ min: 1900, max: 2400 }), m: fc.integer({ min: 1, max: 12 }) })
  .map(({ y, m }) => `${y}-${String(m).padStart(2, '0')}`);

const aMonth = (month: string, profitMinor: number): LedgerMonth => ({
  month,
  jobs: 1,
  revenueMinor: profitMinor,
  materialsMinor: 0,
  labourMinutes: 0,
  labourMinor: 0,
  profitMinor,
});

const anEntry = (over: Partial<LedgerEntry>): LedgerEntry => ({
  id: 'e1',
  kind: 'payment',
  at: '2026-03-03T14:05:00.000Z',
  amountMinor: 12_345,
  currency: 'USD',
  status: 'succeeded',
  method: 'cash',
  jobId: 'j1',
  invoiceNumber: null,
  customerName: 'Ada Fernhill',
  vehicleLabel: '2019 Generic Estate',
  ...over,
});

describe('months of the Ledger', () => {
  it('a month runs from its first day to its last, as the calendar has it', () => {
    fc.assert(
      fc.property(anyMonth, (month) => {
        const [y, m] = month.split('-').map(Number) as [number, number];
        // The day before the 1st of the next month, from the platform's own calendar.
        const last = new Date(Date.UTC(y, m, 1) - 86_400_000).getUTCDate();
        expect(daysIn(month)).toBe(last);
        expect(monthRange(month)).toEqual({
          from: `${month}-01`,
          to: `${month}-${String(last).padStart(2, '0')}`,
        });
      }),
    );
    expect(monthRange('2028-02').to).toBe('2028-02-29');
    expect(monthRange('2100-02').to).toBe('2100-02-28');
  });

  it('moving by n months and back lands on the same month; 12 months is a year', () => {
    fc.assert(
      fc.property(anyMonth, fc.integer({ min: -600, max: 600 }), (month, n) => {
        const moved = shiftMonth(month, n);
        expect(isMonth(moved)).toBe(true);
        expect(shiftMonth(moved, -n)).toBe(month);
        const [y, m] = month.split('-').map(Number) as [number, number];
        expect(shiftMonth(month, 12)).toBe(`${y + 1}-${String(m).padStart(2, '0')}`);
      }),
    );
    expect(shiftMonth('2026-01', -1)).toBe('2025-12');
    expect(shiftMonth('2025-12', 1)).toBe('2026-01');
  });

  it('the chart covers six months ending with the chosen one, whole months', () => {
    expect(chartRange('2026-03')).toEqual({ from: '2025-10-01', to: '2026-03-31' });
  });

  it('a month is named in words; only YYYY-MM counts as a month', () => {
    expect(monthWords('2026-03')).toBe('March 2026');
    expect(monthOf(new Date(2026, 0, 31, 23, 59))).toBe('2026-01');
    expect(isMonth('2026-13')).toBe(false);
    expect(isMonth('2026-3')).toBe(false);
    expect(isMonth(null)).toBe(false);
  });
});

describe('figures in words', () => {
  it('money is the currency’s own digits, exactly (checked against decimal.js)', () => {
    fc.assert(
      fc.property(fc.integer({ min: -1e12, max: 1e12 }), (minor) => {
        const abs = new Decimal(Math.abs(minor)).div(100).toFixed(2);
        const [whole, cents] = abs.split('.') as [string, string];
        const grouped = whole.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
        expect(money(minor, 'USD')).toBe(`${minor < 0 ? '-' : ''}$${grouped}.${cents}`);
      }),
    );
    expect(money(1_200, 'JPY')).toBe('¥1,200');
  });

  it('a chart value in whole units is the amount over 10^digits', () => {
    fc.assert(
      fc.property(fc.integer({ min: -1e12, max: 1e12 }), (minor) => {
        expect(majorUnits(minor, 'USD')).toBeCloseTo(new Decimal(minor).div(100).toNumber(), 9);
      }),
    );
    expect(axisMoney(1200, 'USD')).toBe('$1,200');
  });

  it('worked time reads in hours and minutes', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 100_000 }), (minutes) => {
        const words = workedTime(minutes);
        const m = /^(?:(\d+) h)?(?: ?(\d+) min)?$/.exec(words);
        expect(m).not.toBeNull();
        expect(Number(m![1] ?? 0) * 60 + Number(m![2] ?? 0)).toBe(minutes);
      }),
    );
    expect(workedTime(45)).toBe('45 min');
    expect(workedTime(120)).toBe('2 h');
    expect(workedTime(125)).toBe('2 h 05 min');
  });

  it('a loss says so in words, not only with a sign', () => {
    expect(profitWords(-1_230, 'USD')).toBe('Loss of $12.30');
    expect(profitWords(0, 'USD')).toBe('Profit $0.00');
  });

  it('entries read as what they are, money out marked', () => {
    expect(entryTitle(anEntry({ kind: 'deposit', method: 'cheque' }))).toBe('Deposit · Cheque');
    expect(entryTitle(anEntry({ kind: 'invoice', invoiceNumber: 12, method: null }))).toBe(
      'Invoice 12',
    );
    expect(entryTitle(anEntry({ kind: 'quote', status: 'draft', method: null }))).toBe(
      'Quote · not sent',
    );
    expect(entryAmount(anEntry({ kind: 'refund', amountMinor: -1_234 }))).toBe('-$12.34 out');
    expect(entryParty(anEntry({ vehicleLabel: null }))).toBe('Ada Fernhill');
  });

  it('when figures were loaded: the time today, the day before', () => {
    const now = new Date(2026, 2, 3, 22, 0).getTime();
    expect(loadedWords(new Date(2026, 2, 3, 21, 14).getTime(), now)).toBe('at 21:14');
    expect(loadedWords(new Date(2026, 2, 1, 9, 5).getTime(), now)).toBe('on 1 Mar at 09:05');
  });
});

describe('the profit chart', () => {
  it('has one bar per month in order, each the month’s profit in whole units', () => {
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: -1e9, max: 1e9 }), { minLength: 1, maxLength: 12 }),
        (profits) => {
          const months = profits.map((p, i) => aMonth(shiftMonth('2026-01', i), p));
          const s = profitSeries(months, 'USD');
          expect(s.x).toEqual(profits.map((_, i) => i));
          expect(s.profit).toHaveLength(profits.length);
          s.profit.forEach((v, i) =>
            expect(v).toBeCloseTo(new Decimal(profits[i]!).div(100).toNumber(), 9),
          );
          expect(s.summary.split('; ')).toHaveLength(profits.length);
        },
      ),
    );
  });

  it('labels the months short, with the year when the months cross one; the summary in words', () => {
    const s = profitSeries([aMonth('2025-12', 5_000), aMonth('2026-01', -2_500)], 'USD');
    expect(s.labels).toEqual(['Dec 25', 'Jan 26']);
    expect(s.summary).toBe('December 2025: Profit $50.00; January 2026: Loss of $25.00');
    expect(profitSeries([aMonth('2026-02', 0)], 'USD').labels).toEqual(['Feb']);
  });
});

describe('needing a connection', () => {
  const loaded = (at: number) => ({
    data: {},
    error: null,
    fetchStatus: 'idle',
    dataUpdatedAt: at,
  });
  const missing = { data: undefined, error: null, fetchStatus: 'paused', dataUpdatedAt: 0 };

  it('online with answers: nothing to say', () => {
    expect(connectionOf(true, [loaded(1), loaded(2)])).toEqual({
      needsConnection: false,
      deviceOffline: false,
      shownFromMs: null,
      somethingMissing: false,
    });
  });

  it('offline: says so, and shows figures from the oldest answer on screen', () => {
    expect(connectionOf(false, [loaded(500), loaded(200), missing])).toEqual({
      needsConnection: true,
      deviceOffline: true,
      shownFromMs: 200,
      somethingMissing: true,
    });
    expect(connectionOf(false, [missing]).shownFromMs).toBeNull();
  });

  it('a request that found no server counts as no connection; a refusal does not', () => {
    const failed = { ...loaded(9), error: new NetworkError() };
    expect(connectionOf(true, [failed]).needsConnection).toBe(true);
    const refused = { ...loaded(9), error: new ApiError(500, 'boom', 'Down') };
    expect(connectionOf(true, [refused]).needsConnection).toBe(false);
  });
});
