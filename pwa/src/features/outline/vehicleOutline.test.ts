import { describe, expect, it } from 'vitest';
import { BODY_STYLES, bodyStyleTemplate } from '@panelpass/shared';
import {
  panelAt,
  panelCentre,
  pinPlace,
  regionAt,
  toFraction,
  vehicleOutline,
} from './vehicleOutline';

describe.each(BODY_STYLES)('the %s outline', (style) => {
  const outline = vehicleOutline(style);
  const template = bodyStyleTemplate(style);
  const panels = outline.regions.filter((r) => r.kind === 'panel');

  it('draws every panel of the template once, and nothing that is not a panel of it', () => {
    const drawn = panels.map((r) => r.panelKey).sort();
    expect(drawn).toEqual(template.map((p) => p.id).sort());
  });

  it('maps a tap in the middle of each panel to that panel', () => {
    for (const p of template) {
      const centre = panelCentre(outline, p.id);
      expect(centre, p.id).not.toBeNull();
      expect(panelAt(outline, centre!.x, centre!.y), p.id).toBe(p.id);
    }
  });

  it('has no two regions overlapping, so a tap is never ambiguous', () => {
    const { regions } = outline;
    for (let i = 0; i < regions.length; i++) {
      for (let j = i + 1; j < regions.length; j++) {
        const a = regions[i]!;
        const b = regions[j]!;
        const apart = a.x + a.w <= b.x || b.x + b.w <= a.x || a.y + a.h <= b.y || b.y + b.h <= a.y;
        expect(apart, `${a.panelKey ?? a.kind} / ${b.panelKey ?? b.kind}`).toBe(true);
      }
    }
  });

  it('keeps every region inside the drawing', () => {
    for (const r of outline.regions) {
      expect(r.x).toBeGreaterThanOrEqual(0);
      expect(r.y).toBeGreaterThanOrEqual(0);
      expect(r.x + r.w).toBeLessThanOrEqual(outline.width);
      expect(r.y + r.h).toBeLessThanOrEqual(outline.height);
      expect(r.w).toBeGreaterThan(0);
      expect(r.h).toBeGreaterThan(0);
    }
  });

  it('answers no panel outside the car, in a corner of the drawing', () => {
    expect(panelAt(outline, 0, 0)).toBeNull();
    expect(panelAt(outline, 1, 1)).toBeNull();
  });

  it('puts the front at the top and the driver’s left on the viewer’s left', () => {
    const front = panelCentre(outline, 'front-bumper')!;
    const rear = panelCentre(outline, 'rear-bumper')!;
    expect(front.y).toBeLessThan(rear.y);
    const left = panelCentre(outline, 'left-front-door')!;
    const right = panelCentre(outline, 'right-front-door')!;
    expect(left.x).toBeLessThan(0.5);
    expect(right.x).toBeGreaterThan(0.5);
    expect(panelCentre(outline, 'hood')!.y).toBeLessThan(panelCentre(outline, 'roof')!.y);
  });
});

describe('hit-testing details', () => {
  it('a tap on the windscreen is glass, not a panel', () => {
    const sedan = vehicleOutline('sedan');
    const screen = sedan.regions.find((r) => r.kind === 'glass')!;
    const fx = (screen.x + screen.w / 2) / sedan.width;
    const fy = (screen.y + screen.h / 2) / sedan.height;
    expect(regionAt(sedan, fx, fy)?.kind).toBe('glass');
    expect(panelAt(sedan, fx, fy)).toBeNull();
  });

  it('a pickup has a bed between the cab and the tailgate that is not a panel', () => {
    const pickup = vehicleOutline('pickup');
    const bed = pickup.regions.find((r) => r.kind === 'bed')!;
    const roof = pickup.regions.find((r) => r.panelKey === 'roof')!;
    const tailgate = pickup.regions.find((r) => r.panelKey === 'tailgate')!;
    expect(bed.y).toBeGreaterThan(roof.y);
    expect(tailgate.y).toBeGreaterThan(bed.y);
    expect(panelAt(pickup, 0.5, (bed.y + bed.h / 2) / pickup.height)).toBeNull();
  });

  it('a van has a sliding door on the right only', () => {
    const van = vehicleOutline('van');
    const door = panelCentre(van, 'right-sliding-door')!;
    expect(door.x).toBeGreaterThan(0.5);
    expect(panelCentre(van, 'left-sliding-door')).toBeNull();
  });

  it('an unknown body style still draws (as a sedan)', () => {
    expect(vehicleOutline('limousine').style).toBe('sedan');
  });

  it('stores fractions within 0..1 to four places', () => {
    expect(toFraction(0.123456)).toBe(0.1235);
    expect(toFraction(-0.2)).toBe(0);
    expect(toFraction(1.3)).toBe(1);
  });

  it('draws a pin that lies off its panel at the nearest point inside that panel', () => {
    const suv = vehicleOutline('suv');
    const place = pinPlace(suv, 'left-pillars', 0.32, 0.18);
    expect(panelAt(suv, place.x, place.y)).toBe('left-pillars');
    const door = panelCentre(suv, 'left-front-door')!;
    expect(pinPlace(suv, 'left-front-door', door.x, door.y)).toEqual(door);
    expect(pinPlace(suv, null, 0.01, 0.02)).toEqual({ x: 0.01, y: 0.02 });
  });
});
