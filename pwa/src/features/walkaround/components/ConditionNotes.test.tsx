import { act, cleanup, fireEvent, render, screen } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';

const updateJob = vi.fn((_args: { id: string; conditionNotes?: string }) =>
  Promise.resolve({ id: 1 } as unknown),
);
vi.mock('../../../sync/useChanges', () => ({
  useChanges: () => ({ changes: { updateJob } }),
}));

const { ConditionNotes } = await import('./ConditionNotes');

beforeEach(() => {
  vi.useFakeTimers();
  updateJob.mockClear();
});

afterEach(() => {
  cleanup();
  vi.useRealTimers();
});

const field = () => screen.getByLabelText('Condition notes');

describe('condition notes', () => {
  it('saves once, after a pause in typing, with the last words typed', async () => {
    render(<ConditionNotes jobId="job-1" saved="" readOnly={false} />);
    fireEvent.change(field(), { target: { value: 'Swirls' } });
    fireEvent.change(field(), { target: { value: 'Swirls on the hood' } });
    expect(screen.getByRole('status').textContent).toContain('Not saved yet');
    await act(async () => {
      await vi.advanceTimersByTimeAsync(1300);
    });
    expect(updateJob).toHaveBeenCalledTimes(1);
    expect(updateJob).toHaveBeenCalledWith({ id: 'job-1', conditionNotes: 'Swirls on the hood' });
    expect(screen.getByRole('status').textContent).toContain('Saved');
  });

  it('saves at once when the field is left', async () => {
    render(<ConditionNotes jobId="job-1" saved="Old" readOnly={false} />);
    fireEvent.change(field(), { target: { value: 'Old and new' } });
    await act(async () => {
      fireEvent.blur(field());
      await Promise.resolve();
    });
    expect(updateJob).toHaveBeenCalledWith({ id: 'job-1', conditionNotes: 'Old and new' });
    await act(async () => {
      await vi.advanceTimersByTimeAsync(2000);
    });
    expect(updateJob).toHaveBeenCalledTimes(1);
  });

  it('says "Not saved" when the change could not be stored', async () => {
    updateJob.mockResolvedValueOnce(null);
    render(<ConditionNotes jobId="job-1" saved="" readOnly={false} />);
    fireEvent.change(field(), { target: { value: 'Dent' } });
    await act(async () => {
      await vi.advanceTimersByTimeAsync(1300);
    });
    expect(screen.getByRole('status').textContent).toContain('Not saved');
  });

  it('does not save text that did not change', async () => {
    render(<ConditionNotes jobId="job-1" saved="Same" readOnly={false} />);
    fireEvent.change(field(), { target: { value: 'Same' } });
    await act(async () => {
      await vi.advanceTimersByTimeAsync(1300);
    });
    expect(updateJob).not.toHaveBeenCalled();
  });
});
