// Flags of a panel against the vehicle's own baseline: the median of its panels' mean
// film thickness (only valid readings on metal panels count towards it).
//
// Thresholds are editable defaults, common practice with no published source:
// - thin: under 75 % of the baseline, or under 80 µm total film (correction is usually
//   avoided under ~80–90 µm);
// - probably repainted: over 150 % of the baseline;
// - probably filled: any spot over 400 µm (above the ~350 µm a factory rework can
//   reach), since body filler sits in one place rather than across the panel.
// A flag is a hint to look closer, not proof.
import { InputError } from '../errors';
import { nonEmpty, nonNegative, positive } from '../internal/validate';
import { BASIS, Reason, reason } from '../reasons';
import { GaugeKind, Substrate, checkGaugeOnSubstrate } from './substrate';
import { ThicknessUnit, formatThickness } from './units';
import { median } from './stats';

export interface FilmFlagThresholds {
  readonly thinRatio: number;
  readonly thinBelowUm: number;
  readonly repaintedRatio: number;
  readonly filledAboveUm: number;
  /** Fewest metal panels needed for a baseline. */
  readonly minPanelsForBaseline: number;
}

export const DEFAULT_FILM_FLAG_THRESHOLDS: FilmFlagThresholds = {
  thinRatio: 0.75,
  thinBelowUm: 80,
  repaintedRatio: 1.5,
  filledAboveUm: 400,
  minPanelsForBaseline: 3,
};

export interface PanelFilmInput {
  readonly panelId: string;
  readonly substrate: Substrate;
  readonly gauge: GaugeKind;
  /** Each spot's mean (µm). */
  readonly spotMeansUm: readonly number[];
}

export type PanelFlag = 'thin' | 'probably-repainted' | 'probably-filled';

export type PanelFlagReasonCode =
  | PanelFlag
  | 'reading-not-valid'
  | 'substrate-unknown'
  | 'not-in-baseline'
  | 'too-few-panels-for-baseline';

export interface PanelFlags {
  readonly panelId: string;
  /** Null when the reading is not valid on this substrate. */
  readonly meanUm: number | null;
  readonly maxSpotUm: number | null;
  /** Panel mean ÷ vehicle baseline; null without a baseline or a valid reading. */
  readonly ratio: number | null;
  readonly flags: readonly PanelFlag[];
  readonly reasons: readonly Reason<PanelFlagReasonCode>[];
}

export interface FlagPanelsInput {
  readonly panels: readonly PanelFilmInput[];
  readonly thresholds?: Partial<FilmFlagThresholds>;
  readonly displayUnit?: ThicknessUnit;
}

export interface FlagPanelsResult {
  /** Median of the metal panels' means (µm); null with too few panels. */
  readonly baselineUm: number | null;
  readonly panels: readonly PanelFlags[];
  readonly reasons: readonly Reason<PanelFlagReasonCode>[];
}

export function flagPanels(input: FlagPanelsInput): FlagPanelsResult {
  const th = {
    thinRatio: positive(
      'thresholds.thinRatio',
      input.thresholds?.thinRatio ?? DEFAULT_FILM_FLAG_THRESHOLDS.thinRatio,
    ),
    thinBelowUm: nonNegative(
      'thresholds.thinBelowUm',
      input.thresholds?.thinBelowUm ?? DEFAULT_FILM_FLAG_THRESHOLDS.thinBelowUm,
    ),
    repaintedRatio: positive(
      'thresholds.repaintedRatio',
      input.thresholds?.repaintedRatio ?? DEFAULT_FILM_FLAG_THRESHOLDS.repaintedRatio,
    ),
    filledAboveUm: positive(
      'thresholds.filledAboveUm',
      input.thresholds?.filledAboveUm ?? DEFAULT_FILM_FLAG_THRESHOLDS.filledAboveUm,
    ),
    minPanelsForBaseline: positive(
      'thresholds.minPanelsForBaseline',
      input.thresholds?.minPanelsForBaseline ?? DEFAULT_FILM_FLAG_THRESHOLDS.minPanelsForBaseline,
    ),
  };
  if (th.thinRatio >= th.repaintedRatio) {
    throw new InputError('thresholds.thinRatio', 'order', 'thinRatio must be below repaintedRatio');
  }
  const unit = input.displayUnit ?? 'um';
  const f = (um: number) => formatThickness(um, unit);
  const seen = new Set<string>();
  const measured = nonEmpty('panels', input.panels).map((p, i) => {
    if (typeof p.panelId !== 'string' || p.panelId === '') {
      throw new InputError(`panels[${i}].panelId`, 'non-empty', 'Each panel needs an id');
    }
    if (seen.has(p.panelId)) {
      throw new InputError(`panels[${i}].panelId`, 'unique', `Panel ${p.panelId} is listed twice`);
    }
    seen.add(p.panelId);
    const spots = nonEmpty(`panels[${i}].spotMeansUm`, p.spotMeansUm).map((s, j) =>
      nonNegative(`panels[${i}].spotMeansUm[${j}]`, s),
    );
    const check = checkGaugeOnSubstrate(p.gauge, p.substrate);
    const meanUm = spots.reduce((a, b) => a + b, 0) / spots.length;
    return { input: p, spots, check, meanUm, maxSpotUm: Math.max(...spots) };
  });

  const metal = measured.filter(
    (m) =>
      m.check.validity === 'valid' &&
      (m.input.substrate === 'steel' || m.input.substrate === 'aluminium'),
  );
  const reasons: Reason<PanelFlagReasonCode>[] = [];
  const baselineUm =
    metal.length >= th.minPanelsForBaseline ? median(metal.map((m) => m.meanUm)) : null;
  if (baselineUm === null) {
    reasons.push(
      reason(
        'too-few-panels-for-baseline',
        'info',
        `Only ${metal.length} metal panel${metal.length === 1 ? '' : 's'} measured; ${th.minPanelsForBaseline} are needed to compare panels with each other. Only absolute limits were checked.`,
      ),
    );
  }

  const panels = measured.map((m): PanelFlags => {
    const panelReasons: Reason<PanelFlagReasonCode>[] = [];
    if (m.check.validity === 'not-valid') {
      panelReasons.push(
        reason(
          'reading-not-valid',
          'stop',
          m.check.reasons[0]?.message ?? 'This reading is not valid on this substrate.',
          m.check.reasons[0]?.basis,
        ),
      );
      return {
        panelId: m.input.panelId,
        meanUm: null,
        maxSpotUm: null,
        ratio: null,
        flags: [],
        reasons: panelReasons,
      };
    }
    if (m.check.validity === 'unknown') {
      panelReasons.push(
        reason(
          'substrate-unknown',
          'warn',
          m.check.reasons[0]?.message ?? 'Panel substrate not set.',
        ),
      );
    }
    const onMetal = m.input.substrate === 'steel' || m.input.substrate === 'aluminium';
    const ratio = baselineUm !== null && onMetal && baselineUm > 0 ? m.meanUm / baselineUm : null;
    if (!onMetal && baselineUm !== null) {
      panelReasons.push(
        reason(
          'not-in-baseline',
          'info',
          'Plastic and composite panels are built differently; they are not compared with the metal panels.',
        ),
      );
    }
    const flags: PanelFlag[] = [];
    const thinByRatio = ratio !== null && ratio < th.thinRatio;
    const thinAbsolute = onMetal && m.meanUm < th.thinBelowUm;
    if (thinByRatio || thinAbsolute) {
      flags.push('thin');
      const why = thinAbsolute
        ? `under ${f(th.thinBelowUm)}`
        : `${Math.round((ratio ?? 0) * 100)} % of this car's usual ${f(baselineUm ?? 0)}`;
      panelReasons.push(
        reason(
          'thin',
          'warn',
          `Thin: ${f(m.meanUm)}, ${why}. Go gently or skip correction here.`,
          BASIS.commonPractice,
        ),
      );
    }
    if (m.maxSpotUm > th.filledAboveUm) {
      flags.push('probably-filled');
      panelReasons.push(
        reason(
          'probably-filled',
          'warn',
          `Probably filler: a spot reads ${f(m.maxSpotUm)}, over ${f(th.filledAboveUm)}. Tell the owner before work.`,
          BASIS.commonPractice,
        ),
      );
    } else if (ratio !== null && ratio > th.repaintedRatio) {
      flags.push('probably-repainted');
      panelReasons.push(
        reason(
          'probably-repainted',
          'warn',
          `Probably repainted: ${f(m.meanUm)}, ${Math.round(ratio * 100)} % of this car's usual ${f(baselineUm ?? 0)}. Clear coat may be thinner or softer.`,
          BASIS.commonPractice,
        ),
      );
    }
    return {
      panelId: m.input.panelId,
      meanUm: m.meanUm,
      maxSpotUm: m.maxSpotUm,
      ratio,
      flags,
      reasons: panelReasons,
    };
  });
  return { baselineUm, panels, reasons };
}
