import { describe, expect, it } from 'vitest';
import { MAX_VISIT_WINDOW_MS, visitWindowProblem } from './window';

// Our own limit (14 days, no published source); these check its edges, not a trade value.
describe('visitWindowProblem', () => {
  const start = Date.UTC(2026, 11, 1, 8);

  it('accepts a window that ends after it starts, up to exactly the limit', () => {
    expect(visitWindowProblem(start, start + 60_000)).toBeNull();
    expect(visitWindowProblem(start, start + MAX_VISIT_WINDOW_MS)).toBeNull();
  });

  it('refuses an end at or before the start', () => {
    expect(visitWindowProblem(start, start)).toMatch(/end after it starts/);
    expect(visitWindowProblem(start, start - 1)).toMatch(/end after it starts/);
    expect(visitWindowProblem(start, Number.NaN)).toMatch(/end after it starts/);
  });

  it('refuses a window one millisecond longer than the limit, naming the limit', () => {
    expect(visitWindowProblem(start, start + MAX_VISIT_WINDOW_MS + 1)).toMatch(/at most 14 days/);
  });
});
