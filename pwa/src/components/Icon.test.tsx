import { cleanup, render } from '@testing-library/react';
import { addOutline, checkmarkCircle, warningOutline } from 'ionicons/icons';
import { afterEach, describe, expect, it } from 'vitest';
import { Icon, parseIcon } from './Icon';

afterEach(cleanup);

describe('Icon', () => {
  it('draws an ionicons icon inline, hidden from screen readers, with its own paths', () => {
    const { container } = render(<Icon icon={warningOutline} className="pp-due__state" />);
    const svg = container.querySelector('svg');
    expect(svg?.getAttribute('class')).toBe('pp-icon pp-due__state');
    expect(svg?.getAttribute('viewBox')).toBe('0 0 512 512');
    expect(svg?.getAttribute('aria-hidden')).toBe('true');
    expect(svg?.getAttribute('focusable')).toBe('false');
    // The package's triangle with its stroke classes (styled in app.css as ion-icon would).
    const paths = svg?.querySelectorAll('path') ?? [];
    expect(paths.length).toBe(3);
    expect(paths[0]?.getAttribute('class')).toBe('ionicon-fill-none ionicon-stroke-width');
    expect(container.querySelector('ion-icon')).toBeNull();
  });

  it('passes the slot an Ionic button lays it out by', () => {
    const { container } = render(<Icon icon={addOutline} slot="icon-only" />);
    expect(container.querySelector('svg')?.getAttribute('slot')).toBe('icon-only');
  });

  it('reads each icon once and refuses what is not an SVG icon', () => {
    expect(parseIcon(checkmarkCircle)).toBe(parseIcon(checkmarkCircle));
    expect(parseIcon(addOutline).body).toContain("d='M256 112v288M400 256H112'");
    expect(() => parseIcon('data:image/png;base64,AAAA')).toThrow('Not an SVG icon');
  });
});
