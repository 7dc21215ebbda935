// Spots and their acceptance.
//
// SSPC-PA 2 (2015): a spot is the mean of at least 3 gauge readings within a 4 cm circle;
// readings that are unusually high or low and do not repeat are discarded by the
// operator (re-measure; leave them out of the list). At the default level every spot must
// be ≥ 80 % of the specified minimum and ≤ 120 % of the specified maximum; single
// readings are not judged. Example: a spec of 8–12 mil allows spots of 6.4–14.4 mil.
//
// ISO 19840 (2012), for a nominal dry film thickness (NDFT) of 40 µm and more: accept
// when the mean of all readings ≥ NDFT, every reading ≥ 80 % of NDFT, readings in
// [80 %, 100 %) of NDFT are fewer than 20 % of all, and every reading ≤ the specified
// maximum (often 3 × NDFT).
//
// These rules were written for steel structures; applying them per car panel is
// Panelpass's own adaptation.
import { InputError } from '../errors';
import { nonEmpty, nonNegative, positive } from '../internal/validate';
import { Reason, reason } from '../reasons';
import { ThicknessUnit, formatThickness } from './units';

export const SSPC_PA2_MIN_READINGS_PER_SPOT = 3;
const ADAPTATION = 'our own adaptation to car panels';

// Compare at 1e-6 µm so a limit like 0.8 × 203.2 µm is not missed by float noise.
const nano = (um: number): number => Math.round(um * 1e6);

export interface SpotResult {
  readonly meanUm: number;
  readonly count: number;
  /** True when it has the ≥ 3 readings SSPC-PA 2 asks for. */
  readonly enoughReadings: boolean;
  readonly reasons: readonly Reason<'fewer-than-three-readings'>[];
}

/** A spot: the mean of its gauge readings (µm). */
export function spotMean(readingsUm: readonly number[], field = 'readingsUm'): SpotResult {
  const readings = nonEmpty(field, readingsUm);
  let sum = 0;
  readings.forEach((r, i) => {
    sum += nonNegative(`${field}[${i}]`, r);
  });
  const count = readings.length;
  const enoughReadings = count >= SSPC_PA2_MIN_READINGS_PER_SPOT;
  return {
    meanUm: sum / count,
    count,
    enoughReadings,
    reasons: enoughReadings
      ? []
      : [
          reason(
            'fewer-than-three-readings',
            'warn',
            `Only ${count} reading${count === 1 ? '' : 's'} in this spot; take at least 3 close together.`,
            'SSPC-PA 2',
          ),
        ],
  };
}

export type SpotVerdict = 'within' | 'below' | 'above' | 'not-judged';

export interface SspcPa2Input {
  /** Each spot's gauge readings (µm). */
  readonly spots: readonly (readonly number[])[];
  readonly specMinUm: number;
  readonly specMaxUm: number;
  /** Default 0.8 (80 % of the minimum). */
  readonly lowFactor?: number;
  /** Default 1.2 (120 % of the maximum). */
  readonly highFactor?: number;
  readonly displayUnit?: ThicknessUnit;
}

export type SspcPa2ReasonCode =
  'spot-below-allowed' | 'spot-above-allowed' | 'spot-not-judged' | 'no-spot-judged';

export interface SspcPa2Result {
  readonly ok: boolean;
  readonly allowedMinUm: number;
  readonly allowedMaxUm: number;
  readonly spots: readonly {
    readonly meanUm: number;
    readonly count: number;
    readonly verdict: SpotVerdict;
  }[];
  readonly reasons: readonly Reason<SspcPa2ReasonCode>[];
}

export function acceptSpotsSspcPa2(input: SspcPa2Input): SspcPa2Result {
  const specMinUm = nonNegative('specMinUm', input.specMinUm);
  const specMaxUm = nonNegative('specMaxUm', input.specMaxUm);
  if (specMinUm > specMaxUm) {
    throw new InputError('specMinUm', 'order', 'specMinUm must not be above specMaxUm');
  }
  const lowFactor = positive('lowFactor', input.lowFactor ?? 0.8);
  const highFactor = positive('highFactor', input.highFactor ?? 1.2);
  const unit = input.displayUnit ?? 'um';
  const allowedMinUm = nano(specMinUm * lowFactor) / 1e6;
  const allowedMaxUm = nano(specMaxUm * highFactor) / 1e6;
  const reasons: Reason<SspcPa2ReasonCode>[] = [];
  const spots = nonEmpty('spots', input.spots).map((readings, i) => {
    const spot = spotMean(readings, `spots[${i}]`);
    let verdict: SpotVerdict;
    if (!spot.enoughReadings) verdict = 'not-judged';
    else if (nano(spot.meanUm) < nano(allowedMinUm)) verdict = 'below';
    else if (nano(spot.meanUm) > nano(allowedMaxUm)) verdict = 'above';
    else verdict = 'within';
    const mean = formatThickness(spot.meanUm, unit);
    if (verdict === 'below') {
      reasons.push(
        reason(
          'spot-below-allowed',
          'stop',
          `Spot ${i + 1} is ${mean}, under the ${formatThickness(allowedMinUm, unit)} allowed.`,
          `SSPC-PA 2, ${ADAPTATION}`,
        ),
      );
    } else if (verdict === 'above') {
      reasons.push(
        reason(
          'spot-above-allowed',
          'stop',
          `Spot ${i + 1} is ${mean}, over the ${formatThickness(allowedMaxUm, unit)} allowed.`,
          `SSPC-PA 2, ${ADAPTATION}`,
        ),
      );
    } else if (verdict === 'not-judged') {
      reasons.push(
        reason(
          'spot-not-judged',
          'warn',
          `Spot ${i + 1} has only ${spot.count} reading${spot.count === 1 ? '' : 's'}: not judged (needs 3).`,
          'SSPC-PA 2',
        ),
      );
    }
    return { meanUm: spot.meanUm, count: spot.count, verdict };
  });
  if (spots.every((s) => s.verdict === 'not-judged')) {
    reasons.push(
      reason(
        'no-spot-judged',
        'stop',
        'No spot has 3 readings yet, so nothing could be judged.',
        'SSPC-PA 2',
      ),
    );
  }
  return {
    ok: reasons.every((r) => r.severity !== 'stop'),
    allowedMinUm,
    allowedMaxUm,
    spots,
    reasons,
  };
}

export interface Iso19840Input {
  readonly readingsUm: readonly number[];
  /** Nominal dry film thickness (µm). */
  readonly ndftUm: number;
  /** Highest reading allowed (µm); default 3 × NDFT. */
  readonly maxUm?: number;
  readonly displayUnit?: ThicknessUnit;
}

export type Iso19840ReasonCode =
  | 'mean-below-ndft'
  | 'reading-below-80-percent'
  | 'too-many-between-80-and-100-percent'
  | 'reading-above-maximum'
  | 'outside-iso-19840-scope';

export interface Iso19840Result {
  readonly ok: boolean;
  readonly meanUm: number;
  readonly maxUm: number;
  /** Share of readings in [0.8, 1.0) × NDFT (0–1). */
  readonly shareBetween80And100: number;
  readonly reasons: readonly Reason<Iso19840ReasonCode>[];
}

export function acceptIso19840(input: Iso19840Input): Iso19840Result {
  const ndft = positive('ndftUm', input.ndftUm);
  const maxUm = input.maxUm === undefined ? 3 * ndft : positive('maxUm', input.maxUm);
  const unit = input.displayUnit ?? 'um';
  const readings = nonEmpty('readingsUm', input.readingsUm).map((r, i) =>
    nonNegative(`readingsUm[${i}]`, r),
  );
  const basis = `ISO 19840, ${ADAPTATION}`;
  const reasons: Reason<Iso19840ReasonCode>[] = [];
  const mean = readings.reduce((a, b) => a + b, 0) / readings.length;
  const low = readings.filter((r) => nano(r) < nano(0.8 * ndft));
  const between = readings.filter((r) => nano(r) >= nano(0.8 * ndft) && nano(r) < nano(ndft));
  const high = readings.filter((r) => nano(r) > nano(maxUm));
  const share = between.length / readings.length;
  const f = (um: number) => formatThickness(um, unit);
  if (nano(mean) < nano(ndft)) {
    reasons.push(
      reason('mean-below-ndft', 'stop', `Mean ${f(mean)} is under the nominal ${f(ndft)}.`, basis),
    );
  }
  if (low.length > 0) {
    reasons.push(
      reason(
        'reading-below-80-percent',
        'stop',
        `${low.length} reading${low.length === 1 ? ' is' : 's are'} under 80 % of nominal (${f(0.8 * ndft)}).`,
        basis,
      ),
    );
  }
  if (share >= 0.2) {
    reasons.push(
      reason(
        'too-many-between-80-and-100-percent',
        'stop',
        `${Math.round(share * 100)} % of readings are between 80 % and 100 % of nominal; fewer than 20 % may be.`,
        basis,
      ),
    );
  }
  if (high.length > 0) {
    reasons.push(
      reason(
        'reading-above-maximum',
        'stop',
        `${high.length} reading${high.length === 1 ? ' is' : 's are'} over the maximum ${f(maxUm)}.`,
        basis,
      ),
    );
  }
  if (ndft < 40) {
    reasons.push(
      reason(
        'outside-iso-19840-scope',
        'warn',
        `ISO 19840 covers a nominal thickness of 40 µm and more; ${f(ndft)} is below it.`,
        'ISO 19840',
      ),
    );
  }
  return {
    ok: reasons.every((r) => r.severity !== 'stop'),
    meanUm: mean,
    maxUm,
    shareBetween80And100: share,
    reasons,
  };
}

/** Square metres per square foot, exact (0.3048 m per foot). */
export const SQUARE_METRES_PER_SQUARE_FOOT = 0.09290304;

export interface SspcPa2Sampling {
  readonly areas: number;
  readonly spots: number;
  readonly readings: number;
}

/**
 * How many 100 ft² areas, spots and readings SSPC-PA 2 asks for on a coated area.
 * Over 1,000 ft²: 3 areas for the first 1,000 ft² and 1 more for each further 1,000 ft² or
 * part of it (checked against the standard's examples: 2,800 → 5; 12,500 → 15; 28,000 → 30).
 * Up to 300 ft², each 100 ft² (or part) is an area; 300–1,000 ft²: 3 areas (from memory).
 * Each area has 5 spots, each spot 3 readings.
 */
export function sspcPa2Sampling(areaFt2: number): SspcPa2Sampling {
  const area = positive('areaFt2', areaFt2);
  let areas: number;
  if (area <= 300) areas = Math.ceil(area / 100);
  else if (area <= 1000) areas = 3;
  else areas = 3 + Math.ceil((area - 1000) / 1000);
  return { areas, spots: areas * 5, readings: areas * 15 };
}
