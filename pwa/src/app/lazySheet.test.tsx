import { act, cleanup, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { lazySheet } from './lazySheet';

afterEach(cleanup);

function RealSheet({ isOpen, title }: { isOpen: boolean; title: string }) {
  return <p>{isOpen ? `open: ${title}` : `closed: ${title}`}</p>;
}

describe('lazySheet', () => {
  it('shows nothing while never opened, then the loaded sheet with its props once opened', async () => {
    const load = vi.fn(() => Promise.resolve(RealSheet));
    const Sheet = lazySheet(load);
    const { rerender } = render(<Sheet isOpen={false} title="Start a timer" />);
    expect(screen.queryByText(/Start a timer/)).toBeNull();

    rerender(<Sheet isOpen title="Start a timer" />);
    expect(await screen.findByText('open: Start a timer')).toBeTruthy();
    expect(load).toHaveBeenCalled();
  });

  it('stays mounted once opened, so it can close like an eager sheet', async () => {
    const Sheet = lazySheet(() => Promise.resolve(RealSheet));
    const { rerender } = render(<Sheet isOpen title="Sync" />);
    expect(await screen.findByText('open: Sync')).toBeTruthy();
    rerender(<Sheet isOpen={false} title="Sync" />);
    expect(screen.getByText('closed: Sync')).toBeTruthy();
  });

  it('fetches the code when the browser is idle, before any tap', async () => {
    vi.useFakeTimers();
    try {
      const load = vi.fn(() => Promise.resolve(RealSheet));
      const Sheet = lazySheet(load);
      render(<Sheet isOpen={false} title="Units" />);
      expect(load).not.toHaveBeenCalled();
      await act(async () => {
        await vi.advanceTimersByTimeAsync(6000);
      });
      expect(load).toHaveBeenCalled();
      expect(screen.queryByText(/Units/)).toBeNull();
    } finally {
      vi.useRealTimers();
    }
  });
});

describe('lazySheet, code already fetched', () => {
  it('opens in the same render once its code has arrived (no suspending, no held-back reveal)', async () => {
    vi.useFakeTimers();
    try {
      const Sheet = lazySheet(() => Promise.resolve(RealSheet));
      const { rerender } = render(<Sheet isOpen={false} title="Mask" />);
      await act(async () => {
        await vi.advanceTimersByTimeAsync(6000); // the idle fetch
      });
      rerender(<Sheet isOpen title="Mask" />);
      // Synchronously, with the clock stopped: a lazy sheet would still be suspended here.
      expect(screen.getByText('open: Mask')).toBeTruthy();
    } finally {
      vi.useRealTimers();
    }
  });
});
