import { act, cleanup, fireEvent, render, screen } from '@testing-library/react';
import { useState } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { lazyPage } from './lazyPage';

afterEach(cleanup);

function Counter() {
  const [n, setN] = useState(0);
  return <button onClick={() => setN(n + 1)}>taps {n}</button>;
}
const module = { default: Counter };

describe('lazyPage', () => {
  it('a preloaded page renders in the first render, with no loading placeholder', async () => {
    const load = vi.fn(() => Promise.resolve(module));
    const Page = lazyPage(load);
    await Page.preload();
    const { container } = render(<Page />);
    // Synchronously: no await between render and the check.
    expect(screen.getByText('taps 0')).toBeTruthy();
    expect(container.querySelector('.pp-loading')).toBeNull();
    expect(load).toHaveBeenCalledTimes(1);
  });

  it('a page not loaded yet shows the placeholder, then the page, loading its code once', async () => {
    const load = vi.fn(() => Promise.resolve(module));
    const Page = lazyPage(load);
    const { container } = render(<Page />);
    expect(container.querySelector('.pp-loading')).not.toBeNull();
    expect(await screen.findByText('taps 0')).toBeTruthy();
    await Page.preload();
    expect(load).toHaveBeenCalledTimes(1);
  });

  it('keeps a page mounted the lazy way once its code arrives (its state survives a re-render)', async () => {
    const Page = lazyPage(() => Promise.resolve(module));
    const { rerender } = render(<Page />);
    fireEvent.click(await screen.findByText('taps 0'));
    rerender(<Page />);
    expect(screen.getByText('taps 1')).toBeTruthy();
  });

  it('tries again after a failed load (the code may be reachable later)', async () => {
    const load = vi
      .fn<() => Promise<typeof module>>()
      .mockRejectedValueOnce(new Error('offline'))
      .mockResolvedValue(module);
    const Page = lazyPage(load);
    await expect(Page.preload()).rejects.toThrow('offline');
    await act(() => Page.preload());
    render(<Page />);
    expect(screen.getByText('taps 0')).toBeTruthy();
    expect(load).toHaveBeenCalledTimes(2);
  });
});
