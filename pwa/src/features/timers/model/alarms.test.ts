import type { TimerRow } from '@panelpass/shared';
import { describe, expect, it } from 'vitest';
import {
  emptyMemory,
  FRESH_ALARM_MS,
  missedAlarms,
  nextAlarm,
  planAlarms,
  readMemory,
  remember,
  writeMemory,
} from './alarms';
import { MemoryStorage } from '../../../test/memoryStorage';

const T0 = Date.parse('2026-05-04T13:00:00.000Z');
const MIN = 60_000;
const iso = (ms: number) => new Date(ms).toISOString();

function timer(id: string, endsInMin: number, over: Partial<TimerRow> = {}) {
  return {
    id,
    endsAt: iso(T0 + endsInMin * MIN),
    pausedMs: 0,
    pausedAt: null,
    acknowledgedAt: null,
    cancelledAt: null,
    ...over,
  };
}

describe('nextAlarm — one timeout to the nearest end, never a tick', () => {
  it('is the nearest end among running timers, with the delay from now', () => {
    const timers = [timer('a', 12), timer('b', 3), timer('c', 7)];
    expect(nextAlarm(timers, T0)).toEqual({ id: 'b', atMs: T0 + 3 * MIN, inMs: 3 * MIN });
  });

  it('skips paused, acknowledged, cancelled and already ended timers', () => {
    const timers = [
      timer('paused', 1, { pausedAt: iso(T0 - MIN) }),
      timer('acked', 2, { acknowledgedAt: iso(T0) }),
      timer('cancelled', 3, { cancelledAt: iso(T0) }),
      timer('ended', -1),
      timer('next', 9),
    ];
    expect(nextAlarm(timers, T0)?.id).toBe('next');
    expect(nextAlarm([timer('ended', -1)], T0)).toBeNull();
  });

  it('follows a resumed timer to its new end (endsAt moved by the pause)', () => {
    const resumed = timer('a', 5 + 2, { pausedMs: 2 * MIN });
    expect(nextAlarm([resumed], T0)?.inMs).toBe(7 * MIN);
  });
});

describe('planAlarms — what to do when a timer ends', () => {
  it('on screen since before the end: rings once, on time', () => {
    const t = timer('a', -0.1);
    const plan = planAlarms([t], T0, emptyMemory(), T0 - 10 * MIN);
    expect(plan.ring.map((x) => x.id)).toEqual(['a']);
    expect(plan.onTime.map((x) => x.id)).toEqual(['a']);
    const after = remember(emptyMemory(), { sounded: plan.ring, onTime: plan.onTime }, [t]);
    expect(planAlarms([t], T0 + 1000, after, T0 - 10 * MIN).ring).toEqual([]);
  });

  it('hidden: a notification instead of a sound', () => {
    const plan = planAlarms([timer('a', -0.1)], T0, emptyMemory(), null);
    expect(plan).toMatchObject({ ring: [], notify: [expect.objectContaining({ id: 'a' })] });
  });

  it('back on screen a moment after the end: rings, but it was not on time', () => {
    const plan = planAlarms([timer('a', -2)], T0, emptyMemory(), T0);
    expect(plan.ring).toHaveLength(1);
    expect(plan.onTime).toEqual([]);
  });

  it('an end long past stays silent (the missed banner shows it)', () => {
    const long = -(FRESH_ALARM_MS / MIN + 1);
    expect(planAlarms([timer('a', long)], T0, emptyMemory(), T0).ring).toEqual([]);
  });

  it('a timer resumed after its alarm rings again at its new end', () => {
    const before = timer('a', -0.1);
    const memory = remember(emptyMemory(), { sounded: [before], onTime: [before] }, [before]);
    const later = timer('a', -0.1 + 4, { pausedMs: 4 * MIN });
    expect(planAlarms([later], T0 + 4 * MIN, memory, T0).ring).toHaveLength(1);
  });
});

describe('missedAlarms — ended while the app was closed or hidden, not acknowledged', () => {
  it('lists ended timers whose alarm did not sound on time; not acknowledged or running ones', () => {
    const timers = [
      timer('missed', -30),
      timer('acked', -30, { acknowledgedAt: iso(T0 - 20 * MIN) }),
      timer('running', 5),
      timer('rang', -1),
    ];
    const memory = remember(emptyMemory(), { onTime: [timers[3]!] }, timers);
    expect(missedAlarms(timers, T0, memory).map((t) => t.id)).toEqual(['missed']);
  });

  it('a sound when coming back does not make it on time: still missed until acknowledged', () => {
    const t = timer('a', -2);
    const plan = planAlarms([t], T0, emptyMemory(), T0);
    const memory = remember(emptyMemory(), { sounded: plan.ring, onTime: plan.onTime }, [t]);
    expect(missedAlarms([t], T0, memory)).toHaveLength(1);
    const acked = { ...t, acknowledgedAt: iso(T0) };
    expect(missedAlarms([acked], T0, memory)).toEqual([]);
  });

  it('survives a reload: the memory is kept on the phone, and forgets timers gone', () => {
    const storage = new MemoryStorage();
    const t = timer('a', -1);
    writeMemory(storage, 'k', remember(emptyMemory(), { onTime: [t], sounded: [t] }, [t]));
    const read = readMemory(storage, 'k');
    expect(missedAlarms([t], T0, read)).toEqual([]);
    expect(remember(read, {}, [])).toEqual(emptyMemory());
    storage.setItem('k', 'not json');
    expect(readMemory(storage, 'k')).toEqual(emptyMemory());
  });
});
