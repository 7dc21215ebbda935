import { afterEach, describe, expect, it, vi } from 'vitest';
import { hideSplash } from './splash';

afterEach(() => {
  document.body.innerHTML = '';
  vi.restoreAllMocks();
});

function page(html: string) {
  document.body.innerHTML = `<div id="pp-splash" class="pp-splash"></div><div id="root">${html}</div>`;
}

describe('hideSplash', () => {
  it('removes the splash on the next frame when a page is showing', () => {
    const frames: FrameRequestCallback[] = [];
    vi.spyOn(window, 'requestAnimationFrame').mockImplementation((callback) =>
      frames.push(callback),
    );
    page('<div class="ion-page"></div>');
    hideSplash(document);
    // Not in the task that mounts the first screen: that one is long enough.
    expect(document.getElementById('pp-splash')).not.toBeNull();
    frames.shift()?.(0);
    expect(document.getElementById('pp-splash')).toBeNull();
  });

  it('keeps the splash while the page is still invisible, and removes it on the frame it shows', () => {
    const frames: FrameRequestCallback[] = [];
    vi.spyOn(window, 'requestAnimationFrame').mockImplementation((callback) =>
      frames.push(callback),
    );
    page('<div class="ion-page ion-page-invisible"></div>');
    hideSplash(document);
    frames.shift()?.(0);
    frames.shift()?.(0);
    expect(document.getElementById('pp-splash')).not.toBeNull();
    document.querySelector('.ion-page')?.classList.remove('ion-page-invisible');
    frames.shift()?.(0);
    expect(document.getElementById('pp-splash')).toBeNull();
  });

  it('gives up waiting after the last frame it is allowed', () => {
    const frames: FrameRequestCallback[] = [];
    vi.spyOn(window, 'requestAnimationFrame').mockImplementation((callback) =>
      frames.push(callback),
    );
    page('<div class="ion-page ion-page-invisible"></div>');
    hideSplash(document, 3);
    frames.shift()?.(0);
    frames.shift()?.(0);
    expect(document.getElementById('pp-splash')).not.toBeNull();
    frames.shift()?.(0);
    expect(document.getElementById('pp-splash')).toBeNull();
  });

  it('does nothing when there is no splash (every page after the first)', () => {
    document.body.innerHTML = '<div id="root"><div class="ion-page"></div></div>';
    expect(() => hideSplash(document)).not.toThrow();
  });
});
