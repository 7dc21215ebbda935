import {
  checkGaugeOnSubstrate,
  filmStats,
  flagPanels,
  GAUGE_KINDS,
  PANEL_BANDS,
  spotMean,
  SUBSTRATES,
  type FilmReadingRow,
  type FilmStats,
  type GaugeCheck,
  type GaugeKind,
  type JobPanelRow,
  type PanelBand,
  type PanelFilmInput,
  type PanelFlag,
  type PanelFlags,
  type Reason,
  type Substrate,
} from '@panelpass/shared';

/** One spot: the gauge readings taken close together, and their mean (shared spotMean). */
export interface Spot {
  id: string;
  readingsUm: readonly number[];
  meanUm: number;
  enoughReadings: boolean;
  gauge: GaugeKind;
  takenAt: string;
  /** Whether that gauge can measure on the panel's substrate as it is set now. */
  valid: boolean;
}

export interface PanelFilm {
  panel: JobPanelRow;
  substrate: Substrate;
  /** Oldest first. */
  spots: Spot[];
  /** Statistics of every reading of the panel's valid spots; null before any. */
  stats: FilmStats | null;
  /** The panel's flags against the vehicle's baseline (shared flagPanels); null unmeasured. */
  flags: PanelFlags | null;
}

export interface VehicleFilm {
  panels: PanelFilm[];
  /** The car's usual film (median of its metal panels, µm); null with too few. */
  baselineUm: number | null;
  /** How many metal panels gave the baseline. */
  measuredPanels: number;
  reasons: readonly Reason[];
}

export const substrateOf = (value: string): Substrate =>
  (SUBSTRATES as readonly string[]).includes(value) ? (value as Substrate) : 'unknown';

export const gaugeOf = (value: string): GaugeKind | null =>
  (GAUGE_KINDS as readonly string[]).includes(value) ? (value as GaugeKind) : null;

export const bandOf = (value: string): PanelBand =>
  (PANEL_BANDS as readonly string[]).includes(value) ? (value as PanelBand) : 'middle';

/**
 * The film picture of a car from its readings of one phase: each panel's spots and
 * statistics, and its flags against the car's own baseline (shared filmStats, spotMean,
 * flagPanels). A spot taken with a gauge that cannot measure on the panel's substrate (set
 * later, e.g. found to be plastic) is kept in the list but left out of the numbers.
 */
export function vehicleFilm(
  panels: readonly JobPanelRow[],
  readings: readonly FilmReadingRow[],
  phase: 'before' | 'after' = 'before',
): VehicleFilm {
  const byPanel = new Map<string, FilmReadingRow[]>();
  for (const r of readings) {
    if (r.phase !== phase || r.readingsUm.length === 0) continue;
    const list = byPanel.get(r.panelId) ?? [];
    list.push(r);
    byPanel.set(r.panelId, list);
  }

  const ordered = [...panels].sort((a, b) => a.position - b.position);
  const inputs: PanelFilmInput[] = [];
  const partial = ordered.map((panel) => {
    const substrate = substrateOf(panel.substrate);
    const rows = (byPanel.get(panel.id) ?? []).sort(
      (a, b) => a.takenAt.localeCompare(b.takenAt) || a.id.localeCompare(b.id),
    );
    const spots: Spot[] = [];
    for (const r of rows) {
      const gauge = gaugeOf(r.gaugeType);
      if (!gauge) continue;
      const mean = spotMean(r.readingsUm);
      spots.push({
        id: r.id,
        readingsUm: r.readingsUm,
        meanUm: mean.meanUm,
        enoughReadings: mean.enoughReadings,
        gauge,
        takenAt: r.takenAt,
        valid: checkGaugeOnSubstrate(gauge, substrate).validity !== 'not-valid',
      });
    }
    const valid = spots.filter((s) => s.valid);
    const last = spots[spots.length - 1];
    if (valid.length) {
      inputs.push({
        panelId: panel.id,
        substrate,
        gauge: (valid[valid.length - 1] as Spot).gauge,
        spotMeansUm: valid.map((s) => s.meanUm),
      });
    } else if (last) {
      // Nothing valid: let flagPanels say why the readings do not count.
      inputs.push({
        panelId: panel.id,
        substrate,
        gauge: last.gauge,
        spotMeansUm: spots.map((s) => s.meanUm),
      });
    }
    const stats = valid.length ? filmStats(valid.flatMap((s) => s.readingsUm)) : null;
    return { panel, substrate, spots, stats };
  });

  const flagged = inputs.length ? flagPanels({ panels: inputs }) : null;
  const flagsById = new Map(flagged?.panels.map((p) => [p.panelId, p]) ?? []);
  const measuredPanels = inputs.filter((i) => {
    const p = flagsById.get(i.panelId);
    return p?.meanUm !== null && (i.substrate === 'steel' || i.substrate === 'aluminium');
  }).length;
  return {
    panels: partial.map((p) => ({ ...p, flags: flagsById.get(p.panel.id) ?? null })),
    baselineUm: flagged?.baselineUm ?? null,
    measuredPanels,
    reasons: flagged?.reasons ?? [],
  };
}

export const FLAG_WORDS: Record<PanelFlag, string> = {
  thin: 'Thin',
  'probably-repainted': 'Probably repainted',
  'probably-filled': 'Probably filler',
};

export const SUBSTRATE_WORDS: Record<Substrate, string> = {
  steel: 'Steel',
  aluminium: 'Aluminium',
  plastic: 'Plastic',
  composite: 'Composite',
  unknown: 'Not known',
};

export const GAUGE_WORDS: Record<GaugeKind, string> = {
  magnetic: 'Magnetic',
  'eddy-current': 'Eddy-current',
  'magnetic-eddy': 'Magnetic + eddy',
  ultrasonic: 'Ultrasonic',
};

export const BAND_WORDS: Record<PanelBand, string> = {
  top: 'Top',
  upper: 'Upper',
  middle: 'Middle',
  lower: 'Lower',
};

/** The gauge to offer first: the one last used on this job, else one that suits the panel. */
export function defaultGauge(substrate: Substrate, lastUsed: GaugeKind | null): GaugeKind {
  if (lastUsed && checkGaugeOnSubstrate(lastUsed, substrate).validity !== 'not-valid') {
    return lastUsed;
  }
  return substrate === 'plastic' || substrate === 'composite' ? 'ultrasonic' : 'magnetic-eddy';
}

/** Whether a gauge can measure on a substrate, with the shared reasons. */
export function gaugeCheck(gauge: GaugeKind, substrate: Substrate): GaugeCheck {
  return checkGaugeOnSubstrate(gauge, substrate);
}
