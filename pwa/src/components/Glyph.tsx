/**
 * Small line icons drawn for Panelpass, inline so the first screen needs no icon library.
 * Decorative: the words beside them carry the meaning.
 */
export type GlyphName = 'alert' | 'check' | 'info' | 'eye' | 'eye-off' | 'refresh';

const paths: Record<GlyphName, string> = {
  // A triangle with an exclamation mark: something stopped.
  alert: 'M12 3 2.5 20h19L12 3Zm0 6v5m0 3v.5',
  // A tick in a circle: done, saved.
  check: 'M12 2.5a9.5 9.5 0 1 0 0 19 9.5 9.5 0 0 0 0-19ZM7.5 12.5l3 3 6-6.5',
  // An i in a circle: something to know.
  info: 'M12 2.5a9.5 9.5 0 1 0 0 19 9.5 9.5 0 0 0 0-19ZM12 11v6m0-9.5v.5',
  eye: 'M2 12s3.6-6.5 10-6.5S22 12 22 12s-3.6 6.5-10 6.5S2 12 2 12Zm10-3a3 3 0 1 0 0 6 3 3 0 0 0 0-6Z',
  'eye-off':
    'M3 3l18 18M10.6 5.6A10.7 10.7 0 0 1 12 5.5c6.4 0 10 6.5 10 6.5a17 17 0 0 1-3 3.8M6.6 6.6C3.7 8.4 2 12 2 12s3.6 6.5 10 6.5c1.8 0 3.3-.5 4.6-1.2M9.9 9.9a3 3 0 0 0 4.2 4.2',
  refresh: 'M20 12a8 8 0 1 1-2.3-5.7M20 4v4.5h-4.5',
};

export function Glyph({ name, size = 24 }: { name: GlyphName; size?: number }) {
  return (
    <svg
      className="pp-glyph"
      width={size}
      height={size}
      viewBox="0 0 24 24"
      fill="none"
      stroke="currentColor"
      strokeWidth={2.2}
      strokeLinecap="round"
      strokeLinejoin="round"
      aria-hidden="true"
      focusable="false"
    >
      <path d={paths[name]} />
    </svg>
  );
}
