import { describe, expect, it } from 'vitest';
import { ApiError, NetworkError } from '../../../api/errors';
import { dueWords, linkProblemWords, stageWords } from './customerWords';

describe('linkProblemWords', () => {
  it("says the server's words for a used or expired link", () => {
    const used = new ApiError(410, 'link-not-valid', 'This sign-in link has been used already');
    expect(linkProblemWords(used)).toBe('This sign-in link has been used already');
  });

  it('tells a missing signal apart from a spent link', () => {
    expect(linkProblemWords(new NetworkError())).toMatch(/has not been used/);
    expect(linkProblemWords(new Error('x'))).toMatch(/ask for a new one/);
  });
});

describe('dueWords', () => {
  it('shows what is left to pay, or that nothing is', () => {
    expect(dueWords({ amountDueMinor: 35_050, stage: 'handover' })).toBe('350.50 to pay.');
    expect(dueWords({ amountDueMinor: 0, stage: 'closed' })).toBe('Paid in full.');
    expect(dueWords({ amountDueMinor: 0, stage: 'booked' })).toBe('Nothing to pay.');
  });

  it("says the amount in the business's currency once it is known", () => {
    expect(dueWords({ amountDueMinor: 35_050, stage: 'handover' }, 'EUR')).toBe('€350.50 to pay.');
    expect(dueWords({ amountDueMinor: 35_050, stage: 'handover' }, 'JPY')).toBe('¥35,050 to pay.');
  });

  it('names stages in words', () => {
    expect(stageWords('closed')).toBe('Finished');
    expect(stageWords('correction')).toBe('In progress');
  });
});
