/**
 * An ionicons icon drawn inline as SVG. The build turns each `import { x } from 'ionicons/icons'`
 * into a module holding that icon's SVG as a `data:image/svg+xml;utf8,` string
 * (vite.startup.ts, iconPerModule); this draws it straight into the page, with none of
 * `<ion-icon>`'s work (its own component runtime, a shadow root, waiting to be scrolled into
 * view, then parsing and cleaning the SVG for each copy). Decorative: the words beside an icon
 * carry the meaning, so it is hidden from screen readers. Sized by the font (1em), coloured by
 * the text colour.
 */
export interface IconProps {
  /** An icon from 'ionicons/icons'. */
  icon: string;
  className?: string;
  /** Where an Ionic button or item places it ('icon-only', 'start', 'end'). */
  slot?: 'icon-only' | 'start' | 'end';
}

interface ParsedIcon {
  viewBox: string;
  body: string;
}

const parsed = new Map<string, ParsedIcon>();

/** The viewBox and inner markup of an icon's SVG, read once per icon. */
export function parseIcon(icon: string): ParsedIcon {
  let result = parsed.get(icon);
  if (result) return result;
  const comma = icon.indexOf(',');
  const svg = icon.startsWith('data:image/svg+xml') && comma !== -1 ? icon.slice(comma + 1) : icon;
  const open = /^<svg\b[^>]*>/.exec(svg);
  if (!open || !svg.trimEnd().endsWith('</svg>')) throw new Error('Not an SVG icon');
  result = {
    viewBox: /viewBox=['"]([^'"]+)['"]/.exec(open[0])?.[1] ?? '0 0 512 512',
    body: svg.slice(open[0].length, svg.lastIndexOf('</svg>')),
  };
  parsed.set(icon, result);
  return result;
}

export function Icon({ icon, className, slot }: IconProps) {
  const { viewBox, body } = parseIcon(icon);
  return (
    <svg
      className={className ? `pp-icon ${className}` : 'pp-icon'}
      viewBox={viewBox}
      slot={slot}
      aria-hidden="true"
      focusable="false"
      // The icon's own markup, from the ionicons package at build time (never user input).
      dangerouslySetInnerHTML={{ __html: body }}
    />
  );
}
