import {
  bodyStyleTemplate,
  jobPanelId,
  type BodyStyle,
  type DamagePinRow,
  type FilmReadingRow,
  type JobPanelRow,
} from '@panelpass/shared';

/** Rows as the phone holds them, for the walkaround's model tests. */
export const JOB = '0b7d2c55-2a7e-4f59-9d3e-5a3cbd1e0001';

const base = (id: string) => ({
  id,
  businessId: 'b',
  version: 1,
  createdAt: '2025-05-01T08:00:00.000Z',
  updatedAt: '2025-05-01T08:00:00.000Z',
  deletedAt: null,
});

export function panelsFor(style: BodyStyle): JobPanelRow[] {
  return bodyStyleTemplate(style).map((p, position) => ({
    ...base(jobPanelId(JOB, p.id)),
    jobId: JOB,
    panelKey: p.id,
    label: p.label,
    band: p.band,
    position,
    substrate: p.substrate,
    finish: 'clear-coat',
    hardness: null,
    state: 'todo',
    areaM2: p.areaM2,
    clearEstimateUm: null,
    testSpotNote: '',
  }));
}

let n = 0;
export function reading(
  panelKey: string,
  readingsUm: number[],
  over: Partial<FilmReadingRow> = {},
): FilmReadingRow {
  n += 1;
  return {
    ...base(`r-${String(n).padStart(4, '0')}`),
    jobId: JOB,
    panelId: jobPanelId(JOB, panelKey),
    phase: 'before',
    readingsUm,
    unit: 'um',
    gaugeType: 'magnetic-eddy',
    takenAt: `2025-05-01T08:${String(n % 60).padStart(2, '0')}:00.000Z`,
    takenBy: 'u',
    ...over,
  };
}

export function pin(number: number, over: Partial<DamagePinRow> = {}): DamagePinRow {
  return {
    ...base(`p-${number}`),
    jobId: JOB,
    number,
    x: 0.3,
    y: 0.4,
    panelKey: 'left-front-door',
    kind: 'scratch',
    severity: 2,
    note: '',
    photoId: null,
    ...over,
  };
}
