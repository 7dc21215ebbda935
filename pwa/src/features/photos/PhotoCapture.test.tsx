import { cleanup, fireEvent, render, screen, waitFor } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';

const attachPhoto = vi.fn((_input: unknown) => Promise.resolve({ id: 1 } as unknown));
vi.mock('../../sync/useChanges', () => ({
  useChanges: () => ({ attachPhoto }),
}));

const { PhotoCapture } = await import('./PhotoCapture');
const { NOT_A_PICTURE } = await import('./resizeImage');

function pick(file: File) {
  const input = document.querySelector<HTMLInputElement>('input[type="file"]');
  if (!input) throw new Error('no file input');
  fireEvent.change(input, { target: { files: [file] } });
  return input;
}

beforeEach(() => attachPhoto.mockClear());
afterEach(cleanup);

describe('PhotoCapture: a file that is no picture, or far too large, is refused in words', () => {
  it('says a text file renamed photo.jpg is not a picture, queues nothing and keeps the picker', async () => {
    render(<PhotoCapture jobId="job-1" kind="before" />);
    const text = new File(['Tyres dressed, glass done.\n'], 'photo.jpg', { type: 'image/jpeg' });
    const input = pick(text);
    expect(await screen.findByRole('alert')).toHaveProperty('textContent', NOT_A_PICTURE);
    expect(attachPhoto).not.toHaveBeenCalled();
    // Ready for another try: the button is back, not stuck on "Saving the photo…".
    await waitFor(() => expect(input.disabled).toBe(false));
    expect(screen.getByText('Take a photo')).toBeTruthy();
  });

  it('says how large a far too large picture is, and queues nothing', async () => {
    render(<PhotoCapture jobId="job-1" kind="after" />);
    const big = new File([new Uint8Array([0xff, 0xd8, 0xff, 0xe0])], 'pano.jpg', {
      type: 'image/jpeg',
    });
    Object.defineProperty(big, 'size', { value: 95 * 1024 * 1024 });
    pick(big);
    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('This picture is 95.0 MB, too large for the phone to open');
    expect(attachPhoto).not.toHaveBeenCalled();
  });
});
