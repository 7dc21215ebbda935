import { describe, expect, it } from 'vitest';
import {
  BODY_STYLES,
  BodyStyle,
  PANEL_BANDS,
  bodyStyleTemplate,
  templateAreaM2,
} from './templates';

// Areas are approximate, from memory (no published source); these tests check the
// templates' shape and order, and only broad plausibility of their totals.
describe('body-style templates', () => {
  it.each(BODY_STYLES)('%s: panels are ordered top-down by band, with unique ids', (style) => {
    const panels = bodyStyleTemplate(style);
    const bandIndex = panels.map((p) => PANEL_BANDS.indexOf(p.band));
    expect([...bandIndex].sort((a, b) => a - b)).toEqual(bandIndex);
    expect(new Set(panels.map((p) => p.id)).size).toBe(panels.length);
    expect(panels[0]?.id).toBe('roof');
    for (const p of panels) expect(p.areaM2).toBeGreaterThan(0);
  });

  it.each(BODY_STYLES)(
    '%s: bumpers and mirrors default to plastic, roof and hood to steel',
    (style) => {
      const byId = new Map(bodyStyleTemplate(style).map((p) => [p.id, p]));
      expect(byId.get('front-bumper')?.substrate).toBe('plastic');
      expect(byId.get('left-mirror')?.substrate).toBe('plastic');
      expect(byId.get('roof')?.substrate).toBe('steel');
      expect(byId.get('hood')?.substrate).toBe('steel');
    },
  );

  it('has the doors each style should have', () => {
    const ids = (s: BodyStyle) => bodyStyleTemplate(s).map((p) => p.id);
    expect(ids('coupe')).not.toContain('left-rear-door');
    expect(ids('sedan')).toEqual(expect.arrayContaining(['left-rear-door', 'trunk-lid']));
    expect(ids('hatchback')).toContain('tailgate');
    expect(ids('pickup')).toEqual(expect.arrayContaining(['left-bed-side', 'tailgate']));
    expect(ids('van')).toContain('right-sliding-door');
  });

  it('gives plausible totals: a sedan near 12–14 m², a van the largest', () => {
    expect(templateAreaM2('sedan')).toBeGreaterThan(11);
    expect(templateAreaM2('sedan')).toBeLessThan(15);
    const totals = BODY_STYLES.map((s) => templateAreaM2(s));
    expect(Math.max(...totals)).toBe(templateAreaM2('van'));
    expect(templateAreaM2('coupe')).toBeLessThan(templateAreaM2('suv'));
  });

  it('returns frozen templates and refuses an unknown style', () => {
    expect(Object.isFrozen(bodyStyleTemplate('sedan'))).toBe(true);
    expect(() => bodyStyleTemplate('limousine' as BodyStyle)).toThrow(
      expect.objectContaining({ field: 'style', rule: 'one-of' }),
    );
  });
});
