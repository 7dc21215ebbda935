// Body-style templates: each style's panels in top-down working order, with a default
// substrate and an approximate area.
//
// The areas are approximate, from memory of typical cars, not measured: they serve the
// labour estimate and area-weighted progress, and the user may edit them per vehicle.
// Left and right are as seen from the driver's seat.
import { oneOf } from '../internal/validate';
import type { Substrate } from '../film/substrate';

export type BodyStyle = 'sedan' | 'hatchback' | 'coupe' | 'wagon' | 'suv' | 'pickup' | 'van';
export const BODY_STYLES: readonly BodyStyle[] = [
  'sedan',
  'hatchback',
  'coupe',
  'wagon',
  'suv',
  'pickup',
  'van',
];

/**
 * Where a panel sits, top to bottom: `top` (roof, pillars), `upper` (hood, trunk lid,
 * tailgate, mirrors), `middle` (fenders, doors, quarters, bed sides), `lower` (bumpers,
 * rockers).
 */
export type PanelBand = 'top' | 'upper' | 'middle' | 'lower';
export const PANEL_BANDS: readonly PanelBand[] = ['top', 'upper', 'middle', 'lower'];

export interface PanelTemplate {
  readonly id: string;
  readonly label: string;
  readonly band: PanelBand;
  readonly substrate: Substrate;
  /** Approximate painted area (m²), from memory, not measured. */
  readonly areaM2: number;
}

type Spec = readonly [
  id: string,
  label: string,
  band: PanelBand,
  substrate: Substrate,
  areaM2: number,
];

interface SideSizes {
  readonly fender: number;
  readonly frontDoor: number;
  readonly rearDoor?: number;
  readonly quarter: number;
}

function side(which: 'left' | 'right', s: SideSizes): Spec[] {
  const Side = which === 'left' ? 'Left' : 'Right';
  const specs: Spec[] = [
    [`${which}-front-fender`, `${Side} front fender`, 'middle', 'steel', s.fender],
    [
      `${which}-front-door`,
      `${Side} ${s.rearDoor === undefined ? 'door' : 'front door'}`,
      'middle',
      'steel',
      s.frontDoor,
    ],
  ];
  if (s.rearDoor !== undefined)
    specs.push([`${which}-rear-door`, `${Side} rear door`, 'middle', 'steel', s.rearDoor]);
  specs.push([`${which}-rear-quarter`, `${Side} rear quarter`, 'middle', 'steel', s.quarter]);
  return specs;
}

interface CarSizes extends SideSizes {
  readonly roof: number;
  readonly pillars: number;
  readonly hood: number;
  readonly rear: readonly [id: 'trunk-lid' | 'tailgate', area: number];
  readonly mirror: number;
  readonly frontBumper: number;
  readonly rearBumper: number;
  readonly rocker: number;
}

function car(s: CarSizes): Spec[] {
  const [rearId, rearArea] = s.rear;
  return [
    ['roof', 'Roof', 'top', 'steel', s.roof],
    ['left-pillars', 'Left pillars', 'top', 'steel', s.pillars],
    ['right-pillars', 'Right pillars', 'top', 'steel', s.pillars],
    ['hood', 'Hood', 'upper', 'steel', s.hood],
    [rearId, rearId === 'trunk-lid' ? 'Trunk lid' : 'Tailgate', 'upper', 'steel', rearArea],
    ['left-mirror', 'Left mirror', 'upper', 'plastic', s.mirror],
    ['right-mirror', 'Right mirror', 'upper', 'plastic', s.mirror],
    ...side('left', s),
    ...side('right', s),
    ['front-bumper', 'Front bumper', 'lower', 'plastic', s.frontBumper],
    ['left-rocker', 'Left rocker', 'lower', 'steel', s.rocker],
    ['right-rocker', 'Right rocker', 'lower', 'steel', s.rocker],
    ['rear-bumper', 'Rear bumper', 'lower', 'plastic', s.rearBumper],
  ];
}

const SPECS: Readonly<Record<BodyStyle, readonly Spec[]>> = {
  sedan: car({
    roof: 1.5,
    pillars: 0.2,
    hood: 1.6,
    rear: ['trunk-lid', 0.8],
    mirror: 0.05,
    fender: 0.6,
    frontDoor: 0.9,
    rearDoor: 0.8,
    quarter: 0.7,
    frontBumper: 0.9,
    rearBumper: 0.8,
    rocker: 0.25,
  }),
  hatchback: car({
    roof: 1.4,
    pillars: 0.2,
    hood: 1.4,
    rear: ['tailgate', 0.8],
    mirror: 0.05,
    fender: 0.55,
    frontDoor: 0.85,
    rearDoor: 0.75,
    quarter: 0.6,
    frontBumper: 0.85,
    rearBumper: 0.8,
    rocker: 0.22,
  }),
  coupe: car({
    roof: 1.3,
    pillars: 0.2,
    hood: 1.6,
    rear: ['trunk-lid', 0.7],
    mirror: 0.05,
    fender: 0.6,
    frontDoor: 1.15,
    quarter: 0.9,
    frontBumper: 0.9,
    rearBumper: 0.8,
    rocker: 0.25,
  }),
  wagon: car({
    roof: 1.9,
    pillars: 0.25,
    hood: 1.6,
    rear: ['tailgate', 0.9],
    mirror: 0.05,
    fender: 0.6,
    frontDoor: 0.9,
    rearDoor: 0.85,
    quarter: 0.9,
    frontBumper: 0.9,
    rearBumper: 0.8,
    rocker: 0.25,
  }),
  suv: car({
    roof: 2.2,
    pillars: 0.3,
    hood: 1.9,
    rear: ['tailgate', 1.3],
    mirror: 0.07,
    fender: 0.75,
    frontDoor: 1.1,
    rearDoor: 1.0,
    quarter: 1.0,
    frontBumper: 1.1,
    rearBumper: 1.0,
    rocker: 0.3,
  }),
  pickup: [
    ['roof', 'Roof', 'top', 'steel', 1.5],
    ['left-pillars', 'Left pillars', 'top', 'steel', 0.25],
    ['right-pillars', 'Right pillars', 'top', 'steel', 0.25],
    ['hood', 'Hood', 'upper', 'steel', 2.0],
    ['left-mirror', 'Left mirror', 'upper', 'plastic', 0.08],
    ['right-mirror', 'Right mirror', 'upper', 'plastic', 0.08],
    ['left-front-fender', 'Left front fender', 'middle', 'steel', 0.8],
    ['left-front-door', 'Left front door', 'middle', 'steel', 1.1],
    ['left-rear-door', 'Left rear door', 'middle', 'steel', 0.9],
    ['left-bed-side', 'Left bed side', 'middle', 'steel', 1.5],
    ['tailgate', 'Tailgate', 'middle', 'steel', 1.0],
    ['right-bed-side', 'Right bed side', 'middle', 'steel', 1.5],
    ['right-rear-door', 'Right rear door', 'middle', 'steel', 0.9],
    ['right-front-door', 'Right front door', 'middle', 'steel', 1.1],
    ['right-front-fender', 'Right front fender', 'middle', 'steel', 0.8],
    ['front-bumper', 'Front bumper', 'lower', 'plastic', 1.0],
    ['left-rocker', 'Left rocker', 'lower', 'steel', 0.3],
    ['right-rocker', 'Right rocker', 'lower', 'steel', 0.3],
    ['rear-bumper', 'Rear bumper', 'lower', 'steel', 0.8],
  ],
  van: [
    ['roof', 'Roof', 'top', 'steel', 4.5],
    ['left-pillars', 'Left pillars', 'top', 'steel', 0.3],
    ['right-pillars', 'Right pillars', 'top', 'steel', 0.3],
    ['hood', 'Hood', 'upper', 'steel', 0.9],
    ['left-mirror', 'Left mirror', 'upper', 'plastic', 0.08],
    ['right-mirror', 'Right mirror', 'upper', 'plastic', 0.08],
    ['left-front-fender', 'Left front fender', 'middle', 'steel', 0.6],
    ['left-front-door', 'Left front door', 'middle', 'steel', 1.0],
    ['left-side-panel', 'Left side panel', 'middle', 'steel', 3.5],
    ['rear-doors', 'Rear doors', 'middle', 'steel', 2.2],
    ['right-rear-side-panel', 'Right rear side panel', 'middle', 'steel', 1.7],
    ['right-sliding-door', 'Right sliding door', 'middle', 'steel', 1.8],
    ['right-front-door', 'Right front door', 'middle', 'steel', 1.0],
    ['right-front-fender', 'Right front fender', 'middle', 'steel', 0.6],
    ['front-bumper', 'Front bumper', 'lower', 'plastic', 0.9],
    ['left-rocker', 'Left rocker', 'lower', 'steel', 0.4],
    ['right-rocker', 'Right rocker', 'lower', 'steel', 0.4],
    ['rear-bumper', 'Rear bumper', 'lower', 'plastic', 0.8],
  ],
};

const TEMPLATES = Object.fromEntries(
  BODY_STYLES.map((style) => [
    style,
    Object.freeze(
      SPECS[style].map(([id, label, band, substrate, areaM2]) =>
        Object.freeze({ id, label, band, substrate, areaM2 }),
      ),
    ),
  ]),
) as Record<BodyStyle, readonly PanelTemplate[]>;

/** The panels of a body style, top-down, with default substrates and approximate areas. */
export function bodyStyleTemplate(style: BodyStyle): readonly PanelTemplate[] {
  return TEMPLATES[oneOf('style', style, BODY_STYLES)];
}

/** Approximate painted area of a body style (m²). */
export function templateAreaM2(style: BodyStyle): number {
  return bodyStyleTemplate(style).reduce((sum, p) => sum + p.areaM2, 0);
}
