import { Temporal } from '@js-temporal/polyfill';
import { describe, expect, it } from 'vitest';
import { maskRemoveBy, maskStatus } from './masking';

const HOUR = 3_600_000;

describe('masking remove-by', () => {
  it("adds the tape's clean-removal days as elapsed time (checked with @js-temporal/polyfill)", () => {
    const applied = Date.UTC(2026, 2, 4, 15, 30, 0);
    const result = maskRemoveBy({ appliedAtMs: applied, tape: { cleanRemovalDays: 7 } });
    const reference = Temporal.Instant.fromEpochMilliseconds(applied).add({ hours: 7 * 24 });
    expect(result.removeByMs).toBe(reference.epochMilliseconds);
  });

  it('keeps elapsed days across a summer-time change: the wall-clock time moves by an hour', () => {
    // 2026-03-08 is the US spring-forward date (America/New_York).
    const applied = Temporal.ZonedDateTime.from('2026-03-05T10:00[America/New_York]');
    const result = maskRemoveBy({
      appliedAtMs: applied.epochMilliseconds,
      tape: { cleanRemovalDays: 7 },
    });
    const local = Temporal.Instant.fromEpochMilliseconds(result.removeByMs).toZonedDateTimeISO(
      'America/New_York',
    );
    expect(local.toPlainDate().toString()).toBe('2026-03-12');
    expect(local.hour).toBe(11);
  });

  it('uses the shorter sun window when the tape states one; warns when it does not', () => {
    const applied = Date.UTC(2026, 6, 1);
    const tape = { cleanRemovalDays: 7, cleanRemovalDaysInSun: 3 };
    expect(maskRemoveBy({ appliedAtMs: applied, tape, inSun: true }).days).toBe(3);
    const unknown = maskRemoveBy({
      appliedAtMs: applied,
      tape: { cleanRemovalDays: 7 },
      inSun: true,
    });
    expect(unknown.days).toBe(7);
    expect(unknown.reasons[0]).toMatchObject({ code: 'sun-window-unknown', severity: 'warn' });
  });

  it('is due soon in its last day and overdue after', () => {
    const removeByMs = Date.UTC(2026, 6, 8, 12);
    expect(maskStatus({ removeByMs, nowMs: removeByMs - 48 * HOUR }).state).toBe('running');
    expect(maskStatus({ removeByMs, nowMs: removeByMs - 2 * HOUR }).state).toBe('due-soon');
    const overdue = maskStatus({ removeByMs, nowMs: removeByMs + 26 * HOUR });
    expect(overdue.state).toBe('overdue');
    expect(overdue.reasons[0]?.message).toBe('Masking removal overdue by 1 d 2 h.');
  });

  it('refuses a zero or negative window', () => {
    expect(() => maskRemoveBy({ appliedAtMs: 0, tape: { cleanRemovalDays: 0 } })).toThrow(
      expect.objectContaining({ field: 'tape.cleanRemovalDays' }),
    );
  });
});
