/**
 * The vehicle outline: our own plain drawing of a car seen from above with its two sides
 * folded out flat, one drawing per body style. Every painted panel of the body style's
 * template (shared `bodyStyleTemplate`) is one rectangle keyed by its panel id, so a tap on
 * the drawing tells which panel it hit; glass and the pickup's bed are drawn but are not
 * panels.
 *
 * Layout (front at the top): the roof line runs down the middle — front bumper, hood,
 * windscreen, roof with the pillars beside it, rear glass, trunk lid or tailgate, rear
 * bumper. Each side lies flat beside it with its window line inwards and its rocker on the
 * outside edge; the mirrors sit between the side and the windscreen. Left and right are the
 * driver's, as in the templates, so the driver's left is on the viewer's left.
 *
 * Coordinates are the SVG's own units; a pin stores its place as fractions (0..1) of the
 * drawing's width and height, so a pin stays on the same spot whatever the screen size.
 */
import { BODY_STYLES, type BodyStyle } from '@panelpass/shared';

export type RegionKind = 'panel' | 'glass' | 'bed';

export interface OutlineRegion {
  /** The template panel id; null for glass and the bed, which are not panels. */
  readonly panelKey: string | null;
  readonly kind: RegionKind;
  readonly x: number;
  readonly y: number;
  readonly w: number;
  readonly h: number;
  /** Corner rounding, for the look only (hit-testing uses the rectangle). */
  readonly rx: number;
  /** A word drawn inside the larger middle regions ("Hood", "Roof"). */
  readonly label?: string;
}

export interface Wheel {
  readonly cx: number;
  readonly cy: number;
  readonly r: number;
}

export interface VehicleOutline {
  readonly style: BodyStyle;
  readonly width: number;
  readonly height: number;
  readonly regions: readonly OutlineRegion[];
  /** Wheels, half showing at the outer edge of each side: drawing only (a tap there is the panel's). */
  readonly wheels: readonly Wheel[];
}

/** One piece of the middle column, top to bottom. */
type Middle =
  | readonly [key: string, length: number, label?: string]
  | readonly ['glass' | 'bed', length: number, label?: string];

interface SidePiece {
  /** Panel id without its side, e.g. `front-door` → `left-front-door`. */
  readonly key: string;
  /** Share of the side's length (the side spans from the hood to the rear bumper). */
  readonly weight: number;
  /** The piece has a wheel at its outer edge… */
  readonly wheel?: boolean;
  /** …this far along it (0 front, 1 rear; default the middle). */
  readonly wheelAt?: number;
}

interface StyleSpec {
  readonly middle: readonly Middle[];
  /** Keys (in `middle`) the pillars run beside: from the first to the last, inclusive. */
  readonly pillarsAlong: readonly [from: number, to: number];
  readonly left: readonly SidePiece[];
  readonly right: readonly SidePiece[];
  /** The rocker runs under these side pieces (first to last index, inclusive). */
  readonly rockerUnder: readonly [from: number, to: number];
}

const W = 120;
const TOP = 3;
const BUMPER_RX = 6;

// Columns across the drawing (SVG units).
const ROCKER_W = 5;
const SIDE_W = 25;
const MIRROR_W = 6;
const GAP = 1;
const LEFT_ROCKER_X = 1;
const LEFT_SIDE_X = LEFT_ROCKER_X + ROCKER_W + GAP;
const LEFT_MIRROR_X = LEFT_SIDE_X + SIDE_W + GAP;
const MIDDLE_X = LEFT_MIRROR_X + MIRROR_W + GAP;
const MIDDLE_W = W - 2 * MIDDLE_X;
const PILLAR_W = 5;
const RIGHT_MIRROR_X = MIDDLE_X + MIDDLE_W + GAP;
const RIGHT_SIDE_X = RIGHT_MIRROR_X + MIRROR_W + GAP;
const RIGHT_ROCKER_X = RIGHT_SIDE_X + SIDE_W + GAP;

const carSides = (rearDoor: boolean): { left: SidePiece[]; right: SidePiece[] } => {
  const pieces: SidePiece[] = [
    { key: 'front-fender', weight: 3, wheel: true },
    { key: 'front-door', weight: rearDoor ? 3 : 4.4 },
    ...(rearDoor ? [{ key: 'rear-door', weight: 2.8 }] : []),
    { key: 'rear-quarter', weight: rearDoor ? 3 : 3.4, wheel: true },
  ];
  return { left: pieces, right: pieces };
};

const SPECS: Record<BodyStyle, StyleSpec> = {
  sedan: {
    middle: [
      ['front-bumper', 10],
      ['hood', 38, 'Hood'],
      ['glass', 11],
      ['roof', 40, 'Roof'],
      ['glass', 12],
      ['trunk-lid', 26, 'Trunk'],
      ['rear-bumper', 10],
    ],
    pillarsAlong: [2, 4],
    ...carSides(true),
    rockerUnder: [1, 2],
  },
  hatchback: {
    middle: [
      ['front-bumper', 10],
      ['hood', 32, 'Hood'],
      ['glass', 11],
      ['roof', 46, 'Roof'],
      ['tailgate', 24, 'Tailgate'],
      ['rear-bumper', 10],
    ],
    pillarsAlong: [2, 3],
    ...carSides(true),
    rockerUnder: [1, 2],
  },
  coupe: {
    middle: [
      ['front-bumper', 10],
      ['hood', 42, 'Hood'],
      ['glass', 12],
      ['roof', 32, 'Roof'],
      ['glass', 15],
      ['trunk-lid', 22, 'Trunk'],
      ['rear-bumper', 10],
    ],
    pillarsAlong: [2, 4],
    ...carSides(false),
    rockerUnder: [1, 1],
  },
  wagon: {
    middle: [
      ['front-bumper', 10],
      ['hood', 36, 'Hood'],
      ['glass', 11],
      ['roof', 62, 'Roof'],
      ['tailgate', 18, 'Tailgate'],
      ['rear-bumper', 10],
    ],
    pillarsAlong: [2, 3],
    ...carSides(true),
    rockerUnder: [1, 2],
  },
  suv: {
    middle: [
      ['front-bumper', 11],
      ['hood', 38, 'Hood'],
      ['glass', 11],
      ['roof', 62, 'Roof'],
      ['tailgate', 20, 'Tailgate'],
      ['rear-bumper', 11],
    ],
    pillarsAlong: [2, 3],
    ...carSides(true),
    rockerUnder: [1, 2],
  },
  pickup: {
    middle: [
      ['front-bumper', 10],
      ['hood', 40, 'Hood'],
      ['glass', 11],
      ['roof', 26, 'Roof'],
      ['glass', 5],
      ['bed', 50, 'Bed'],
      ['tailgate', 10, 'Tailgate'],
      ['rear-bumper', 9],
    ],
    pillarsAlong: [2, 4],
    left: [
      { key: 'front-fender', weight: 4, wheel: true },
      { key: 'front-door', weight: 2.8 },
      { key: 'rear-door', weight: 2.2 },
      { key: 'bed-side', weight: 6, wheel: true, wheelAt: 0.4 },
    ],
    right: [
      { key: 'front-fender', weight: 4, wheel: true },
      { key: 'front-door', weight: 2.8 },
      { key: 'rear-door', weight: 2.2 },
      { key: 'bed-side', weight: 6, wheel: true, wheelAt: 0.4 },
    ],
    rockerUnder: [1, 2],
  },
  van: {
    middle: [
      ['front-bumper', 10],
      ['hood', 16, 'Hood'],
      ['glass', 12],
      ['roof', 104, 'Roof'],
      ['rear-doors', 14, 'Rear doors'],
      ['rear-bumper', 9],
    ],
    pillarsAlong: [2, 3],
    left: [
      { key: 'front-fender', weight: 2, wheel: true },
      { key: 'front-door', weight: 2.4 },
      { key: 'side-panel', weight: 9.6, wheel: true, wheelAt: 0.78 },
    ],
    right: [
      { key: 'front-fender', weight: 2, wheel: true },
      { key: 'front-door', weight: 2.4 },
      { key: 'sliding-door', weight: 4.2 },
      { key: 'rear-side-panel', weight: 5.4, wheel: true, wheelAt: 0.6 },
    ],
    rockerUnder: [1, 2],
  },
};

function build(style: BodyStyle): VehicleOutline {
  const spec = SPECS[style];
  const regions: OutlineRegion[] = [];
  const wheels: Wheel[] = [];

  // The middle column, top to bottom.
  const spans: { y: number; h: number }[] = [];
  let y = TOP;
  spec.middle.forEach(([key, length, label], i) => {
    spans.push({ y, h: length });
    const bumper = i === 0 || i === spec.middle.length - 1;
    const kind: RegionKind = key === 'glass' ? 'glass' : key === 'bed' ? 'bed' : 'panel';
    // Between the pillars the roof and the glass are narrower than the column.
    const [from, to] = spec.pillarsAlong;
    const inset = i >= from && i <= to ? PILLAR_W + GAP : 0;
    regions.push({
      panelKey: kind === 'panel' ? key : null,
      kind,
      x: MIDDLE_X + inset,
      y: y + (i === 0 ? 0 : GAP / 2),
      w: MIDDLE_W - 2 * inset,
      h: length - (i === 0 || i === spec.middle.length - 1 ? GAP / 2 : GAP),
      rx: bumper ? BUMPER_RX : 2,
      ...(label ? { label } : {}),
    });
    y += length;
  });
  const height = y + TOP;

  // Pillars beside the glass and roof.
  const [from, to] = spec.pillarsAlong;
  const pillarTop = (spans[from]?.y ?? 0) + GAP / 2;
  const pillarBottom = (spans[to]?.y ?? 0) + (spans[to]?.h ?? 0) - GAP / 2;
  for (const [side, x] of [
    ['left', MIDDLE_X],
    ['right', MIDDLE_X + MIDDLE_W - PILLAR_W],
  ] as const) {
    regions.push({
      panelKey: `${side}-pillars`,
      kind: 'panel',
      x,
      y: pillarTop,
      w: PILLAR_W,
      h: pillarBottom - pillarTop,
      rx: 1.5,
    });
  }

  // Mirrors beside the windscreen (the first glass piece).
  const screen = spans[from] ?? { y: 0, h: 0 };
  for (const [side, x] of [
    ['left', LEFT_MIRROR_X],
    ['right', RIGHT_MIRROR_X],
  ] as const) {
    regions.push({
      panelKey: `${side}-mirror`,
      kind: 'panel',
      x,
      y: screen.y + 1,
      w: MIRROR_W,
      h: Math.min(9, screen.h - 1),
      rx: 2,
    });
  }

  // The sides lie flat from the hood's top to the rear bumper's top.
  const sideTop = (spans[1]?.y ?? 0) + GAP / 2;
  const sideBottom = (spans[spans.length - 1]?.y ?? 0) - GAP / 2;
  for (const [side, pieces, sideX, rockerX, outerX] of [
    ['left', spec.left, LEFT_SIDE_X, LEFT_ROCKER_X, LEFT_SIDE_X],
    ['right', spec.right, RIGHT_SIDE_X, RIGHT_ROCKER_X, RIGHT_SIDE_X + SIDE_W],
  ] as const) {
    const total = pieces.reduce((sum, p) => sum + p.weight, 0);
    const scale = (sideBottom - sideTop) / total;
    let at = sideTop;
    const placed = pieces.map((p) => {
      const h = p.weight * scale;
      const r = { y: at, h };
      at += h;
      return r;
    });
    pieces.forEach((p, i) => {
      const r = placed[i] as { y: number; h: number };
      regions.push({
        panelKey: `${side}-${p.key}`,
        kind: 'panel',
        x: sideX,
        y: r.y + GAP / 2,
        w: SIDE_W,
        h: r.h - GAP,
        rx: 2,
      });
      if (p.wheel) wheels.push({ cx: outerX, cy: r.y + r.h * (p.wheelAt ?? 0.5), r: 6 });
    });
    const [rf, rt] = spec.rockerUnder;
    const rTop = (placed[rf]?.y ?? 0) + GAP / 2;
    const rBottom = (placed[rt]?.y ?? 0) + (placed[rt]?.h ?? 0) - GAP / 2;
    regions.push({
      panelKey: `${side}-rocker`,
      kind: 'panel',
      x: rockerX,
      y: rTop,
      w: ROCKER_W,
      h: rBottom - rTop,
      rx: 1.5,
    });
  }
  return { style, width: W, height, regions, wheels };
}

const OUTLINES = Object.fromEntries(BODY_STYLES.map((s) => [s, build(s)])) as Record<
  BodyStyle,
  VehicleOutline
>;

/** The outline of a body style; an unknown style gets the sedan's (and still works). */
export function vehicleOutline(style: string): VehicleOutline {
  return (BODY_STYLES as readonly string[]).includes(style)
    ? OUTLINES[style as BodyStyle]
    : OUTLINES.sedan;
}

/** The region under a point given as fractions (0..1) of the drawing, or null. */
export function regionAt(outline: VehicleOutline, fx: number, fy: number): OutlineRegion | null {
  const x = fx * outline.width;
  const y = fy * outline.height;
  return (
    outline.regions.find((r) => x >= r.x && x <= r.x + r.w && y >= r.y && y <= r.y + r.h) ?? null
  );
}

/** The panel under a point (fractions 0..1), or null on glass, the bed or outside the car. */
export function panelAt(outline: VehicleOutline, fx: number, fy: number): string | null {
  return regionAt(outline, fx, fy)?.panelKey ?? null;
}

/** The middle of a panel's region as fractions (0..1): where a pin goes when placed by list. */
export function panelCentre(
  outline: VehicleOutline,
  panelKey: string,
): { x: number; y: number } | null {
  const r = outline.regions.find((region) => region.panelKey === panelKey);
  if (!r) return null;
  return { x: (r.x + r.w / 2) / outline.width, y: (r.y + r.h / 2) / outline.height };
}

/** A fraction kept to 4 places and within 0..1 (what a pin stores). */
export function toFraction(v: number): number {
  return Math.round(Math.min(1, Math.max(0, v)) * 10_000) / 10_000;
}

/**
 * Where to draw a pin: its own place when that lies on its panel (or it has none); else the
 * nearest point inside its panel (a pin placed on another drawing or by another app).
 */
export function pinPlace(
  outline: VehicleOutline,
  panelKey: string | null,
  fx: number,
  fy: number,
): { x: number; y: number } {
  if (!panelKey || panelAt(outline, fx, fy) === panelKey) return { x: fx, y: fy };
  const r = outline.regions.find((region) => region.panelKey === panelKey);
  if (!r) return { x: fx, y: fy };
  const mx = Math.min(3, r.w / 2);
  const my = Math.min(3, r.h / 2);
  const x = Math.min(r.x + r.w - mx, Math.max(r.x + mx, fx * outline.width));
  const y = Math.min(r.y + r.h - my, Math.max(r.y + my, fy * outline.height));
  return { x: x / outline.width, y: y / outline.height };
}
