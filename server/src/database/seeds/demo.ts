/**
 * The invented demo business: a one-person mobile finishing business in the invented town of
 * Larkspur Bay, with one helper, and a week of visits in different stages. Every name,
 * address, coordinate, price and reading here is made up for the demo.
 */
import { bodyStyleTemplate, type BodyStyle } from '@panelpass/shared';

export const DEMO_PASSWORD = 'detail-demo-1';

export const demoBusiness = {
  name: 'Heronwake Mobile Finish',
  town: 'Larkspur Bay',
};

export const demoPeople = [
  { key: 'owner', email: 'owner@heronwake.example', name: 'Mara Ellison', role: 'owner' },
  { key: 'helper', email: 'helper@heronwake.example', name: 'Tobin Reyes', role: 'tech' },
] as const;

export type ProductKey =
  | 'heavyCompound'
  | 'onestep'
  | 'finishing'
  | 'tar'
  | 'sap'
  | 'tape'
  | 'touchUpGreen'
  | 'coating'
  | 'iron'
  | 'cuttingPad';

export const demoProducts: Record<ProductKey, Record<string, unknown>> = {
  heavyCompound: {
    name: 'Heavy cut compound',
    kind: 'compound',
    properties: { cutLevel: 9, finishLevel: 3 },
    unit: 'mL',
    stockQty: 900,
    amountPerUse: 8,
    unitCostMinor: 4,
    lowStockAt: 200,
  },
  onestep: {
    name: 'One-step polish',
    kind: 'polish',
    properties: { cutLevel: 5, finishLevel: 7 },
    unit: 'mL',
    stockQty: 150,
    amountPerUse: 8,
    unitCostMinor: 4,
    lowStockAt: 200,
  },
  finishing: {
    name: 'Finishing polish',
    kind: 'finishing-polish',
    properties: { cutLevel: 2, finishLevel: 9 },
    unit: 'mL',
    stockQty: 850,
    amountPerUse: 6,
    unitCostMinor: 5,
    lowStockAt: 150,
  },
  tar: {
    name: 'Tar and adhesive remover',
    kind: 'solvent',
    properties: { maxDwellMin: 3, maxSurfaceC: 40 },
    unit: 'mL',
    stockQty: 480,
    amountPerUse: 10,
    unitCostMinor: 2,
    lowStockAt: 100,
    sdsUrl: 'https://sds.invalid/tar-and-adhesive-remover.pdf',
  },
  sap: {
    name: 'Sap and resin remover',
    kind: 'solvent',
    properties: { maxDwellMin: 5, maxSurfaceC: 35 },
    unit: 'mL',
    stockQty: 300,
    amountPerUse: 8,
    unitCostMinor: 3,
    lowStockAt: 100,
    sdsUrl: 'https://sds.invalid/sap-and-resin-remover.pdf',
  },
  tape: {
    name: 'Fine-line masking tape 18 mm',
    kind: 'tape',
    properties: { cleanRemovalDays: 7, cleanRemovalDaysInSun: 3 },
    unit: 'm',
    stockQty: 200,
    amountPerUse: 2,
    unitCostMinor: 3,
    lowStockAt: 30,
  },
  touchUpGreen: {
    name: 'Touch-up paint, dark green',
    kind: 'touch-up',
    properties: {
      refC: 20,
      flashMinAtRef: 10,
      cureMinAtRef: 240,
      minC: 10,
      maxC: 35,
      maxRhPercent: 85,
    },
    unit: 'mL',
    stockQty: 30,
    amountPerUse: 0.2,
    unitCostMinor: 60,
    lowStockAt: 5,
    sdsUrl: 'https://sds.invalid/touch-up-paint.pdf',
  },
  coating: {
    name: 'Glass-coat protection',
    kind: 'protection',
    properties: {
      refC: 20,
      flashMinAtRef: 5,
      cureMinAtRef: 720,
      minC: 10,
      maxC: 32,
      maxRhPercent: 80,
    },
    unit: 'mL',
    stockQty: 120,
    amountPerUse: 30,
    unitCostMinor: 90,
    lowStockAt: 60,
    sdsUrl: 'https://sds.invalid/glass-coat.pdf',
  },
  iron: {
    name: 'Iron fallout remover',
    kind: 'cleaner',
    properties: { dilution: { concentrateParts: 1, waterParts: 4 } },
    unit: 'mL',
    stockQty: 2000,
    amountPerUse: 100,
    unitCostMinor: 1,
    lowStockAt: 500,
  },
  cuttingPad: {
    name: 'Foam cutting pad 125 mm',
    kind: 'pad',
    unit: 'each',
    stockQty: 6,
    unitCostMinor: 900,
  },
};

export interface DemoVisit {
  key: string;
  customer: {
    name: string;
    email: string;
    phone: string;
    address: string;
    lat: number;
    lng: number;
  };
  vehicle: {
    make: string;
    model: string;
    year: number;
    bodyStyle: BodyStyle;
    colour: string;
    paintNotes: string;
    plate: string;
  };
  /** Days from today and hours of the day (local time of the server). */
  day: number;
  from: number;
  to: number;
  priceMinor: number;
  services: string[];
  helper: boolean;
  /** How far the visit has come. */
  stage: 'booked' | 'walkaround' | 'prep' | 'correction' | 'handover' | 'closed';
  notes: string;
  conditionNotes?: string;
}

export const demoVisits: DemoVisit[] = [
  {
    key: 'pickup',
    customer: {
      name: 'Ada Fernhill',
      email: 'ada.fernhill@customers.example',
      phone: '555-0141',
      address: '4 Gull Lane, Larkspur Bay',
      lat: 44.6312,
      lng: -124.0521,
    },
    vehicle: {
      make: 'Harrow',
      model: 'Ridgeback',
      year: 2019,
      bodyStyle: 'pickup',
      colour: 'white',
      paintNotes: 'Heavy wash swirls all over; bed rails scuffed',
      plate: 'LKB 4471',
    },
    day: 0,
    from: 8,
    to: 13,
    priceMinor: 78_000,
    services: ['wash', 'decontaminate', 'two-step'],
    helper: false,
    stage: 'correction',
    notes: 'Park on the street side; water tap by the garage.',
    conditionNotes:
      'Swirls on every panel, worst on the hood and tailgate. Small dent in the left bed side (noted, not our work).',
  },
  {
    key: 'wagon',
    customer: {
      name: 'Corin Waylock',
      email: 'corin.waylock@customers.example',
      phone: '555-0188',
      address: '17 Harbour Row, Larkspur Bay',
      lat: 44.6251,
      lng: -124.0418,
    },
    vehicle: {
      make: 'Tessaly',
      model: 'Longroof',
      year: 2016,
      bodyStyle: 'wagon',
      colour: 'dark green',
      paintNotes: 'Tree-sap etching on roof and hood; eight stone chips on the front',
      plate: 'LKB 2093',
    },
    day: 0,
    from: 14,
    to: 18,
    priceMinor: 52_000,
    services: ['wash', 'decontaminate', 'one-step'],
    helper: true,
    stage: 'prep',
    notes: 'Parked under the pine — move it into the sun before touch-up.',
    conditionNotes:
      'Sap spots on roof and hood, some etched. Eight chips: hood (5), front bumper (3).',
  },
  {
    key: 'sedan',
    customer: {
      name: 'Ines Marlowe',
      email: 'ines.marlowe@customers.example',
      phone: '555-0112',
      address: '88 Dune Road, Larkspur Bay',
      lat: 44.6419,
      lng: -124.0563,
    },
    vehicle: {
      make: 'Calder',
      model: 'Sable',
      year: 2021,
      bodyStyle: 'sedan',
      colour: 'silver',
      paintNotes: 'Light marring only',
      plate: 'LKB 8805',
    },
    day: 1,
    from: 9,
    to: 12,
    priceMinor: 39_000,
    services: ['wash', 'one-step'],
    helper: true,
    stage: 'booked',
    notes: 'Customer works from home; ring the side door.',
  },
  {
    key: 'suv',
    customer: {
      name: 'Rafe Callender',
      email: 'rafe.callender@customers.example',
      phone: '555-0175',
      address: '3 Lighthouse Close, Larkspur Bay',
      lat: 44.6174,
      lng: -124.0602,
    },
    vehicle: {
      make: 'Borrow',
      model: 'Tundrel',
      year: 2018,
      bodyStyle: 'suv',
      colour: 'black',
      paintNotes: 'Soft black paint; front left door repainted after a scrape',
      plate: 'LKB 3317',
    },
    day: -1,
    from: 8,
    to: 15,
    priceMinor: 96_000,
    services: ['wash', 'decontaminate', 'two-step', 'protect'],
    helper: false,
    stage: 'walkaround',
    notes:
      'Two-day job: walkaround done, correction to book. Soft paint: test spot first, finishing pad only on the door.',
    conditionNotes:
      'Front left door reads far thicker than the rest: repainted. Holograms on the rear hatch from a rotary.',
  },
  {
    key: 'van',
    customer: {
      name: 'Juniper Hale',
      email: 'juniper.hale@customers.example',
      phone: '555-0130',
      address: '9 Cannery Way, Larkspur Bay',
      lat: 44.6357,
      lng: -124.0384,
    },
    vehicle: {
      make: 'Marlin',
      model: 'Cargo',
      year: 2020,
      bodyStyle: 'van',
      colour: 'white',
      paintNotes: 'Business van, road film and tar on the lower sides',
      plate: 'LKB 6620',
    },
    day: 4,
    from: 9,
    to: 14,
    priceMinor: 44_000,
    services: ['wash', 'decontaminate', 'one-step'],
    helper: true,
    stage: 'booked',
    notes: 'Van must be back on the road by 15:00.',
  },
  {
    key: 'hatch',
    customer: {
      name: 'Wren Ashby',
      email: 'wren.ashby@customers.example',
      phone: '555-0166',
      address: '51 Kelp Street, Larkspur Bay',
      lat: 44.6288,
      lng: -124.0476,
    },
    vehicle: {
      make: 'Pell',
      model: 'Sprite',
      year: 2022,
      bodyStyle: 'hatchback',
      colour: 'blue',
      paintNotes: 'Near new; protection only',
      plate: 'LKB 1209',
    },
    day: -5,
    from: 9,
    to: 15,
    priceMinor: 58_000,
    services: ['wash', 'one-step', 'protect'],
    helper: false,
    stage: 'closed',
    notes: '',
    conditionNotes: 'Clean car; light marring from the dealer wash.',
  },
  {
    // At Handover this afternoon, the owner's own: the customer signs and pays by card on
    // their own phone (the browser test of the card payment uses this visit and closes it).
    key: 'coupe',
    customer: {
      name: 'Solenne Tarrowby',
      email: 'solenne.tarrowby@customers.example',
      phone: '555-0153',
      address: '26 Tidewater Crescent, Larkspur Bay',
      lat: 44.6336,
      lng: -124.0449,
    },
    vehicle: {
      make: 'Orrin',
      model: 'Vale',
      year: 2020,
      bodyStyle: 'coupe',
      colour: 'deep red',
      paintNotes: 'Swirls on the hood and trunk lid; clear coat thinner on the edges',
      plate: 'LKB 5538',
    },
    day: 0,
    from: 15,
    to: 18,
    priceMinor: 64_000,
    services: ['wash', 'decontaminate', 'one-step', 'protect'],
    helper: false,
    stage: 'handover',
    notes: 'Customer home from 17:00; pays by card.',
    conditionNotes: 'Swirls on the hood and trunk lid. Small scuff on the rear bumper (noted).',
  },
];

/** A plausible set of gauge readings (µm) for a panel, repainted or not. */
export function demoReadings(
  panelKey: string,
  opts: { repainted?: string; thinBy?: number } = {},
): number[] {
  const base = panelKey === opts.repainted ? 245 : 112 - (opts.thinBy ?? 0);
  const spread = [0, 4, -3];
  return spread.map((d, i) => base + d + ((panelKey.length + i) % 5));
}

export const panelsOf = (style: BodyStyle) => bodyStyleTemplate(style).map((p) => p.id);
