import { beforeCallingOut, CallOutInRerunnableRun, runRerunnable } from './call-out';

const tick = () => new Promise((r) => setTimeout(r, 1));

describe('beforeCallingOut: no call outside the database from a run that may be repeated', () => {
  it('lets the call go outside any such run (REST, a careful push)', () => {
    expect(() => beforeCallingOut()).not.toThrow();
  });

  it('stops it inside one, across awaits, and marks the run so a swallowed throw still shows', async () => {
    const run = await runRerunnable(async (r) => {
      await tick();
      try {
        beforeCallingOut();
      } catch (e) {
        expect(e).toBeInstanceOf(CallOutInRerunnableRun);
      }
      return r;
    });
    expect(run.calledOut).toBe(true);
  });

  it('lets it go once the run has stopped being repeatable', async () => {
    await runRerunnable(async (r) => {
      r.active = false;
      await tick();
      expect(() => beforeCallingOut()).not.toThrow();
      expect(r.calledOut).toBe(false);
    });
  });

  it('keeps runs side by side apart', async () => {
    const calls: string[] = [];
    await Promise.all([
      runRerunnable(async (r) => {
        await tick();
        expect(() => beforeCallingOut()).toThrow(CallOutInRerunnableRun);
        calls.push(`a ${r.calledOut}`);
      }),
      runRerunnable(async (r) => {
        r.active = false;
        await tick();
        beforeCallingOut();
        calls.push(`b ${r.calledOut}`);
      }),
    ]);
    expect(calls.sort()).toEqual(['a true', 'b false']);
  });
});
