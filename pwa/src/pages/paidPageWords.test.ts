import { describe, expect, it } from 'vitest';
import { paidPageWords } from './paidPageWords';

describe('the page after the card payment page', () => {
  it('thanks the customer when they come back from paying', () => {
    const words = paidPageWords('?job=5d0c6a8e-1111-4a4a-9b9b-000000000001');
    expect(words.title).toBe('Thank you: payment made');
    expect(words.tone).toBe('done');
  });

  it('says plainly that nothing was taken when they turned back', () => {
    const words = paidPageWords('?job=5d0c6a8e-1111-4a4a-9b9b-000000000001&cancelled=1');
    expect(words.title).toBe('No payment taken');
    expect(words.notice).toMatch(/nothing was taken/);
    expect(words.tone).toBe('info');
  });
});
