import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  alarmNotificationData,
  alarmPath,
  clickTarget,
  OPEN_JOB_ACTION,
  pickClient,
  type WindowLike,
} from './alarmClick';

/** The service worker's copy of the rules (public/sw-alarms.js), run with a stand-in `self`. */
function loadWorkerRules(clients: unknown = {}) {
  const source = readFileSync(join(__dirname, '../../../../public/sw-alarms.js'), 'utf8');
  const listeners: Record<string, unknown> = {};
  const fakeSelf: Record<string, unknown> = {
    location: { origin: 'https://pp.test' },
    clients,
    addEventListener: (type: string, fn: unknown) => {
      listeners[type] = fn;
    },
  };
  // eslint-disable-next-line @typescript-eslint/no-implied-eval
  const run = new Function('self', source) as (self: unknown) => void;
  run(fakeSelf);
  return {
    rules: fakeSelf.__panelpassAlarm as {
      clickTarget: typeof clickTarget;
      pickClient: typeof pickClient;
    },
    listeners,
    tap: fakeSelf.__panelpassTap as (
      n: { data: unknown; close(): void },
      action: string,
    ) => Promise<unknown>,
  };
}

/** A worker's `clients` with these windows, recording what the worker did. */
function fakeClients(urls: string[], navigateWorks = true) {
  const done: string[] = [];
  const windows = urls.map((url) => ({
    url,
    focused: false,
    visibilityState: 'hidden',
    focus() {
      done.push(`focus ${url}`);
      return Promise.reject(new Error('Not allowed to focus a window'));
    },
    navigate(to: string) {
      done.push(`navigate ${url} -> ${to}`);
      return navigateWorks ? Promise.resolve({ url: to }) : Promise.reject(new TypeError('x'));
    },
  }));
  return {
    done,
    clients: {
      matchAll: () => Promise.resolve(windows),
      openWindow: (to: string) => {
        done.push(`openWindow ${to}`);
        return Promise.resolve({ url: to });
      },
    },
  };
}

const origin = 'https://pp.test';
const job = 'a1b2c3d4-0000-4000-8000-000000000001';

const targetCases: [string, unknown, string, string][] = [
  ['a tap opens the url the alarm carries', alarmNotificationData('t1', job), '', `/jobs/${job}`],
  [
    'Open job opens the job',
    { url: '/', jobId: job, timerId: 't1' },
    OPEN_JOB_ACTION,
    `/jobs/${job}`,
  ],
  ['a timer of no job opens Today', alarmNotificationData('t2', null), '', '/'],
  [
    'Open job without a job opens the url',
    { url: '/jobs/x', jobId: null },
    OPEN_JOB_ACTION,
    '/jobs/x',
  ],
  ['an odd job id is escaped', { jobId: 'a/b?c' }, OPEN_JOB_ACTION, '/jobs/a%2Fb%3Fc'],
  ['another origin is never opened', { url: 'https://elsewhere.test/jobs/1' }, '', '/'],
  ['a protocol-relative url is never opened', { url: '//elsewhere.test/x' }, '', '/'],
  ['a backslash trick is never opened', { url: '/\\elsewhere.test' }, '', '/'],
  ['no data opens Today', null, '', '/'],
  ['data not ours opens Today', 'hello', 'snooze', '/'],
  ['an unknown action opens the url', { url: '/jobs/9', jobId: '9' }, 'snooze', '/jobs/9'],
];

const win = (url: string, focused = false, visibilityState = 'hidden'): WindowLike => ({
  url,
  focused,
  visibilityState,
});

const pickCases: [string, WindowLike[], number][] = [
  ['no window: open a new one', [], -1],
  ['only another origin: open a new one', [win('https://elsewhere.test/', true, 'visible')], -1],
  ['the focused window of ours', [win(`${origin}/`), win(`${origin}/jobs/1`, true, 'visible')], 1],
  ['else a visible one', [win(`${origin}/a`), win(`${origin}/b`, false, 'visible')], 1],
  ['else the most recently focused (first)', [win(`${origin}/a`), win(`${origin}/b`)], 0],
  ['another origin focused does not win', [win('https://x.test/', true), win(`${origin}/`)], 1],
  ['a bad url is skipped', [win('not a url', true), win(`${origin}/`)], 1],
];

describe('alarm notification tap (page module)', () => {
  it('a job alarm carries its job page; a timer of no job carries Today', () => {
    expect(alarmNotificationData('t1', job)).toEqual({
      url: `/jobs/${job}`,
      jobId: job,
      timerId: 't1',
    });
    expect(alarmPath(null)).toBe('/');
  });

  it.each(targetCases)('%s', (_name, data, action, want) => {
    expect(clickTarget(data, action)).toBe(want);
  });

  it.each(pickCases)('picks %s', (_name, windows, want) => {
    expect(pickClient(windows, origin)).toBe(want);
  });
});

describe('alarm notification tap (service worker file mirrors the module)', () => {
  const { rules, listeners } = loadWorkerRules();

  it('listens for notificationclick', () => {
    expect(typeof listeners.notificationclick).toBe('function');
  });

  it.each(targetCases)('%s', (_name, data, action, want) => {
    expect(rules.clickTarget(data, action)).toBe(want);
  });

  it.each(pickCases)('picks %s', (_name, windows, want) => {
    expect(rules.pickClient(windows, origin)).toBe(want);
  });
});

describe('alarm notification tap (what the worker does)', () => {
  const data = alarmNotificationData('t1', job);
  const closed: string[] = [];
  const notification = { data, close: () => closed.push('closed') };

  it('no window open: opens a new one on the job', async () => {
    const f = fakeClients([]);
    await loadWorkerRules(f.clients).tap(notification, '');
    expect(f.done).toEqual([`openWindow ${origin}/jobs/${job}`]);
    expect(closed).toEqual(['closed']);
  });

  it('a window open elsewhere in the app: brings it forward and moves it to the job', async () => {
    const f = fakeClients([`${origin}/`]);
    await loadWorkerRules(f.clients).tap(notification, OPEN_JOB_ACTION);
    expect(f.done).toEqual([`focus ${origin}/`, `navigate ${origin}/ -> ${origin}/jobs/${job}`]);
  });

  it('a window already on the job: only brings it forward', async () => {
    const f = fakeClients([`${origin}/jobs/${job}`]);
    await loadWorkerRules(f.clients).tap(notification, '');
    expect(f.done).toEqual([`focus ${origin}/jobs/${job}`]);
  });

  it('a window the worker cannot move: opens a new one', async () => {
    const f = fakeClients([`${origin}/`], false);
    await loadWorkerRules(f.clients).tap(notification, '');
    expect(f.done.at(-1)).toBe(`openWindow ${origin}/jobs/${job}`);
  });
});
