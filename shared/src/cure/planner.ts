// The cure planner: flash and cure times scaled to the working temperature, and the
// touch-up schedule of a chip filled in thin layers.
import { TempUnit, formatTemp } from '../climate/temperature';
import { InputError } from '../errors';
import { MS_PER_MINUTE, minutesText } from '../internal/format';
import { epochMs, finite, list, positiveInteger } from '../internal/validate';
import { BASIS, Reason, noStops, reason } from '../reasons';
import { CureClock, TempReading, checkReadings } from './cure-clock';
import { CureProduct, checkCureProduct } from './product';
import { DEFAULT_Q10, checkQ10 } from './temperature-factor';

const Q10_BASIS = 'Q10 temperature rule, common coatings practice';
const CUTOFF_BASIS = `${BASIS.ourOwnRule} (conservative)`;

export type CureTimesReasonCode =
  'below-product-minimum' | 'above-product-maximum' | 'no-product-window' | 'scaled-by-q10';

export interface CureTimesInput {
  readonly product: CureProduct;
  /** Working (surface) temperature, °C. */
  readonly tempC: number;
  /** Default 2. */
  readonly q10?: number;
  readonly displayUnit?: TempUnit;
}

export interface CureTimesResult {
  readonly ok: boolean;
  /** Multiplier applied to the data-sheet times (2 = twice as long). Null when refused. */
  readonly factor: number | null;
  /** Flash between layers at the working temperature (minutes). Null when refused. */
  readonly flashMin: number | null;
  /** Cure before levelling/polishing at the working temperature (minutes). Null when refused. */
  readonly cureMin: number | null;
  readonly reasons: readonly Reason<CureTimesReasonCode>[];
}

/** Data-sheet flash and cure times scaled to a steady working temperature. */
export function scaleCureTimes(input: CureTimesInput): CureTimesResult {
  const product = checkCureProduct(input.product);
  const tempC = finite('tempC', input.tempC);
  const q10 = input.q10 === undefined ? DEFAULT_Q10 : checkQ10(input.q10);
  const unit = input.displayUnit ?? 'C';
  const reasons: Reason<CureTimesReasonCode>[] = [];
  if (product.minC !== undefined && tempC < product.minC) {
    reasons.push(
      reason(
        'below-product-minimum',
        'stop',
        `At ${formatTemp(tempC, unit)} the product is below its minimum of ${formatTemp(product.minC, unit)}: it may not cure at all. Warm the panel or wait.`,
        BASIS.productSheet,
      ),
    );
  }
  if (product.maxC !== undefined && tempC > product.maxC) {
    reasons.push(
      reason(
        'above-product-maximum',
        'stop',
        `At ${formatTemp(tempC, unit)} the product is above its maximum of ${formatTemp(product.maxC, unit)}. Move to shade or let the panel cool.`,
        BASIS.productSheet,
      ),
    );
  }
  if (product.minC === undefined && product.maxC === undefined) {
    reasons.push(
      reason(
        'no-product-window',
        'warn',
        'No temperature window entered for this product: check its data sheet. Times far from its reference temperature are rough.',
      ),
    );
  }
  if (!noStops(reasons)) {
    return { ok: false, factor: null, flashMin: null, cureMin: null, reasons };
  }
  const factor = Math.pow(q10, (product.refC - tempC) / 10);
  const flashMin = product.flashMinAtRef * factor;
  const cureMin = product.cureMinAtRef * factor;
  reasons.push(
    reason(
      'scaled-by-q10',
      'info',
      `Data-sheet times are for ${formatTemp(product.refC, unit)}; at ${formatTemp(tempC, unit)} they take ×${factor.toFixed(2)}: flash ${minutesText(flashMin)}, cure ${minutesText(cureMin)}.`,
      Q10_BASIS,
    ),
  );
  return { ok: true, factor, flashMin, cureMin, reasons };
}

export type ChipStatus =
  | 'ready-for-next-layer'
  | 'flashing'
  | 'curing'
  | 'ready-to-level'
  | 'too-cold-to-apply'
  | 'too-hot-to-apply'
  | 'too-humid-to-apply'
  | 'cure-stalled';

export type ChipReasonCode =
  | 'too-cold-to-apply'
  | 'too-hot-to-apply'
  | 'too-humid-to-apply'
  | 'cure-stalled-too-cold'
  | 'no-cure-counted-while-cold'
  | 'rate-capped-while-hot'
  | 'layer-applied-early'
  | 'no-reading-before-layer'
  | 'last-reading-held'
  | 'more-layers-than-planned'
  | 'no-product-window';

export interface ChipPlanInput {
  readonly product: CureProduct;
  /** When each layer already on the chip went on (epoch ms). May be empty. */
  readonly layersAppliedAtMs: readonly number[];
  /** How many layers the chip needs in all to come level (≥ 1). */
  readonly layersPlanned: number;
  /** Surface temperature readings over time; the last one is held into the future. */
  readonly readings: readonly TempReading[];
  readonly nowMs: number;
  /** Default 2. */
  readonly q10?: number;
  readonly displayUnit?: TempUnit;
}

export interface ChipLayer {
  /** 1-based. */
  readonly number: number;
  /** When it went on, or, for a layer still to come, the earliest it may go on. */
  readonly atMs: number;
  readonly projected: boolean;
  /** When its flash is done (the next layer may go on). Null if never at the held temperature. */
  readonly flashDoneAtMs: number | null;
}

export interface ChipPlanResult {
  readonly ok: boolean;
  readonly status: ChipStatus;
  readonly layersDone: number;
  readonly layersLeft: number;
  /** When the next layer may go on; null when no layer is left or the flash never ends. */
  readonly nextLayerAtMs: number | null;
  /** When the chip may be levelled and polished; null when the cure never ends. */
  readonly levelReadyAtMs: number | null;
  /** True when layers are still to go on: then it assumes each goes on as soon as allowed. */
  readonly levelReadyIsProjected: boolean;
  readonly layers: readonly ChipLayer[];
  /** Temperature now, from the readings (°C). */
  readonly tempNowC: number;
  readonly reasons: readonly Reason<ChipReasonCode>[];
}

/**
 * The touch-up schedule of a chip: when the next layer may go on and when the chip is
 * ready to level and polish, integrating the cure rate over the temperature readings.
 */
export function planChip(input: ChipPlanInput): ChipPlanResult {
  const product = checkCureProduct(input.product);
  const q10 = input.q10 === undefined ? DEFAULT_Q10 : checkQ10(input.q10);
  const nowMs = epochMs('nowMs', input.nowMs);
  const planned = positiveInteger('layersPlanned', input.layersPlanned);
  const unit = input.displayUnit ?? 'C';
  const applied = list('layersAppliedAtMs', input.layersAppliedAtMs).map((t, i) =>
    epochMs(`layersAppliedAtMs[${i}]`, t),
  );
  applied.sort((a, b) => a - b);
  const latestApplied = applied[applied.length - 1];
  if (latestApplied !== undefined && latestApplied > nowMs) {
    throw new InputError(
      `layersAppliedAtMs[${applied.length - 1}]`,
      'order',
      'A layer cannot have gone on after now',
    );
  }
  const readings = checkReadings(input.readings);
  const clock = new CureClock(readings, {
    refC: product.refC,
    q10,
    minC: product.minC,
    maxC: product.maxC,
  });
  const t = (c: number) => formatTemp(c, unit);
  const reasons: Reason<ChipReasonCode>[] = [];

  const layersDone = applied.length;
  const layersLeft = Math.max(0, planned - layersDone);
  if (layersDone > planned) {
    reasons.push(
      reason(
        'more-layers-than-planned',
        'info',
        `${layersDone} layers are on, more than the ${planned} planned; the cure counts from the last one.`,
      ),
    );
  }
  if (product.minC === undefined && product.maxC === undefined) {
    reasons.push(
      reason(
        'no-product-window',
        'warn',
        'No temperature window entered for this product: check its data sheet.',
      ),
    );
  }

  // Layers already on, and each one's flash.
  const layers: ChipLayer[] = [];
  applied.forEach((atMs, i) => {
    const flashDoneAtMs = clock.reachedAt(atMs, product.flashMinAtRef);
    layers.push({ number: i + 1, atMs, projected: false, flashDoneAtMs });
    const previous = layers[i - 1];
    if (previous !== undefined) {
      const due = previous.flashDoneAtMs;
      if (due === null || atMs < due) {
        const early =
          due === null
            ? 'before its flash could finish'
            : `${minutesText((due - atMs) / MS_PER_MINUTE)} before the flash was done`;
        reasons.push(
          reason(
            'layer-applied-early',
            'warn',
            `Layer ${i + 1} went on ${early}; it may sag or stay soft. The schedule counts from when it went on.`,
          ),
        );
      }
    }
  });
  const firstApplied = applied[0];
  if (firstApplied !== undefined && firstApplied < clock.span.firstMs) {
    reasons.push(
      reason(
        'no-reading-before-layer',
        'info',
        `No temperature reading before layer 1; the first reading (${t(readings[0]?.tempC ?? 0)}) was assumed for the time before it.`,
      ),
    );
  }

  // Layers still to come, each as soon as allowed (never before now).
  let cursor: number | null = nowMs;
  const lastLayer = layers[layers.length - 1];
  if (lastLayer !== undefined) {
    cursor = lastLayer.flashDoneAtMs === null ? null : Math.max(nowMs, lastLayer.flashDoneAtMs);
  }
  const nextLayerAtMs =
    layersLeft === 0 ? null : lastLayer === undefined ? nowMs : lastLayer.flashDoneAtMs;
  for (let n = layersDone + 1; n <= planned; n += 1) {
    if (cursor === null) break;
    const flashDoneAtMs = clock.reachedAt(cursor, product.flashMinAtRef);
    layers.push({ number: n, atMs: cursor, projected: true, flashDoneAtMs });
    cursor = flashDoneAtMs;
  }

  // Level-ready: the cure after the final layer (actual or projected).
  const finalLayer = layers[layers.length - 1];
  let levelReadyAtMs: number | null = null;
  if (finalLayer !== undefined && layers.length >= Math.max(planned, layersDone)) {
    levelReadyAtMs = clock.reachedAt(finalLayer.atMs, product.cureMinAtRef);
  }

  // What the temperature did and does.
  const tempNowC = clock.tempAt(nowMs);
  const { firstMs: firstReadingMs } = clock.span;
  const waitStart = firstApplied ?? nowMs;
  const waitEnd = Math.max(nowMs, levelReadyAtMs ?? nextLayerAtMs ?? nowMs);
  const range = clock.tempRange(Math.max(waitStart, firstReadingMs), waitEnd);
  if (product.minC !== undefined && range.minC < product.minC && tempNowC >= product.minC) {
    reasons.push(
      reason(
        'no-cure-counted-while-cold',
        'warn',
        `The panel went down to ${t(range.minC)}, below the product's ${t(product.minC)}: no cure was counted while it was that cold.`,
        CUTOFF_BASIS,
      ),
    );
  }
  if (product.maxC !== undefined && range.maxC > product.maxC) {
    reasons.push(
      reason(
        'rate-capped-while-hot',
        'warn',
        `The panel reached ${t(range.maxC)}, above the product's ${t(product.maxC)}: the cure was not counted faster than at ${t(product.maxC)}.`,
        CUTOFF_BASIS,
      ),
    );
  }
  const lastReading = readings[readings.length - 1];
  if (lastReading !== undefined && waitEnd > lastReading.atMs) {
    reasons.push(
      reason(
        'last-reading-held',
        'info',
        `After the last reading the temperature is taken to stay at ${t(lastReading.tempC)}; a new reading updates the times.`,
      ),
    );
  }

  if (layersLeft > 0) {
    if (product.minC !== undefined && tempNowC < product.minC) {
      reasons.push(
        reason(
          'too-cold-to-apply',
          'stop',
          `Panel is ${t(tempNowC)}; the product needs at least ${t(product.minC)} to go on. Warm the panel or wait.`,
          BASIS.productSheet,
        ),
      );
    }
    if (product.maxC !== undefined && tempNowC > product.maxC) {
      reasons.push(
        reason(
          'too-hot-to-apply',
          'stop',
          `Panel is ${t(tempNowC)}; the product allows at most ${t(product.maxC)}. Move to shade or let it cool.`,
          BASIS.productSheet,
        ),
      );
    }
    const rhNow = latestHumidity(readings, nowMs);
    if (product.maxRhPercent !== undefined && rhNow !== undefined && rhNow > product.maxRhPercent) {
      reasons.push(
        reason(
          'too-humid-to-apply',
          'stop',
          `Humidity is ${Math.round(rhNow)} %; the product allows at most ${Math.round(product.maxRhPercent)} %.`,
          BASIS.productSheet,
        ),
      );
    }
  }
  const stalled = levelReadyAtMs === null || (layersLeft > 0 && nextLayerAtMs === null);
  if (stalled) {
    reasons.push(
      reason(
        'cure-stalled-too-cold',
        'stop',
        `At ${t(lastReading?.tempC ?? tempNowC)} the product is below its minimum${product.minC === undefined ? '' : ` of ${t(product.minC)}`}: it is not curing, so no time can be given. Warm the panel or wait for a warmer reading.`,
        CUTOFF_BASIS,
      ),
    );
  }

  const stopCodes = new Set(reasons.filter((r) => r.severity === 'stop').map((r) => r.code));
  let status: ChipStatus;
  if (stopCodes.has('cure-stalled-too-cold')) status = 'cure-stalled';
  else if (stopCodes.has('too-cold-to-apply')) status = 'too-cold-to-apply';
  else if (stopCodes.has('too-hot-to-apply')) status = 'too-hot-to-apply';
  else if (stopCodes.has('too-humid-to-apply')) status = 'too-humid-to-apply';
  else if (layersLeft > 0)
    status = nextLayerAtMs !== null && nextLayerAtMs <= nowMs ? 'ready-for-next-layer' : 'flashing';
  else status = levelReadyAtMs !== null && levelReadyAtMs <= nowMs ? 'ready-to-level' : 'curing';

  return {
    ok: noStops(reasons),
    status,
    layersDone,
    layersLeft,
    nextLayerAtMs,
    levelReadyAtMs,
    levelReadyIsProjected: layersLeft > 0,
    layers,
    tempNowC,
    reasons,
  };
}

// The humidity of the latest reading at or before now that measured it.
function latestHumidity(readings: readonly TempReading[], nowMs: number): number | undefined {
  let rh: number | undefined;
  for (const r of readings) {
    if (r.atMs > nowMs) break;
    if (r.rhPercent !== undefined) rh = r.rhPercent;
  }
  return rh;
}
