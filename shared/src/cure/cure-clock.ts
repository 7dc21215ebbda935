// Cure progress over a changing temperature.
//
// Progress is counted in "reference minutes": one minute at the data sheet's reference
// temperature is one reference minute; at 10 °C below it (Q10 = 2) a real minute counts
// half. Between two readings the temperature is taken as a straight line, and the rate
// Q10^((T − Tref)/10) is integrated exactly along it (it is an exponential in time), so a
// cooling evening counts as it cools, not as the last reading. Before the first reading
// the first reading is held; after the last reading the last one is held.
//
// Our own conservative rules (stated in docs/computations.md): below the product's
// minimum temperature no progress is counted; above its maximum the rate stays at the
// maximum's. Both keep "colder never shortens a cure" true.
import { InputError } from '../errors';
import { epochMs, finite, inRange, nonEmpty } from '../internal/validate';
import { MS_PER_MINUTE } from '../internal/format';

/** A surface temperature reading at an instant. */
export interface TempReading {
  readonly atMs: number;
  readonly tempC: number;
  /** Relative humidity at the same time (%), when measured. */
  readonly rhPercent?: number;
}

export interface CureClockOptions {
  readonly refC: number;
  readonly q10: number;
  readonly minC?: number | undefined;
  readonly maxC?: number | undefined;
}

// One stretch of straight-line temperature with a single rate behaviour.
interface Piece {
  readonly startMs: number;
  readonly endMs: number;
  /** Progress (reference minutes) reached at startMs. */
  readonly startProgress: number;
  /** Rate at startMs (reference minutes per minute). */
  readonly rateStart: number;
  /** Growth constant of the rate per ms (0 for a constant rate). */
  readonly growthPerMs: number;
}

export function checkReadings(readings: readonly TempReading[], field = 'readings'): TempReading[] {
  const list = nonEmpty(field, readings);
  const checked = list.map((r, i) => {
    if (typeof r !== 'object' || r === null) {
      throw new InputError(`${field}[${i}]`, 'finite', `${field}[${i}] is missing`);
    }
    const atMs = epochMs(`${field}[${i}].atMs`, r.atMs);
    const tempC = inRange(`${field}[${i}].tempC`, r.tempC, -60, 120, { unit: '°C' });
    if (r.rhPercent === undefined) return { atMs, tempC };
    const rhPercent = inRange(`${field}[${i}].rhPercent`, r.rhPercent, 0, 100, { unit: '%' });
    return { atMs, tempC, rhPercent };
  });
  // Readings may arrive out of order from two devices; order them by time (stable).
  return checked
    .map((r, i) => ({ r, i }))
    .sort((a, b) => a.r.atMs - b.r.atMs || a.i - b.i)
    .map(({ r }) => r);
}

export class CureClock {
  private readonly pieces: Piece[] = [];
  private readonly firstMs: number;
  private readonly lastMs: number;
  private readonly rateBefore: number;
  private readonly rateAfter: number;
  private readonly endProgress: number;
  private readonly sorted: readonly TempReading[];

  /** `readings` must be checked and sorted (see {@link checkReadings}). */
  constructor(
    sortedReadings: readonly TempReading[],
    private readonly options: CureClockOptions,
  ) {
    const first = sortedReadings[0];
    const last = sortedReadings[sortedReadings.length - 1];
    if (first === undefined || last === undefined) {
      throw new InputError('readings', 'non-empty', 'readings must not be empty');
    }
    this.sorted = sortedReadings;
    this.firstMs = first.atMs;
    this.lastMs = last.atMs;
    this.rateBefore = this.rateAt(first.tempC);
    this.rateAfter = this.rateAt(last.tempC);
    let progress = 0;
    for (let i = 0; i + 1 < sortedReadings.length; i += 1) {
      const a = sortedReadings[i] as TempReading;
      const b = sortedReadings[i + 1] as TempReading;
      if (b.atMs === a.atMs) continue;
      progress = this.addStretch(a.atMs, a.tempC, b.atMs, b.tempC, progress);
    }
    this.endProgress = progress;
  }

  /** Rate (reference minutes per minute) at a steady temperature. */
  rateAt(tempC: number): number {
    const { minC, maxC, refC, q10 } = this.options;
    if (minC !== undefined && tempC < minC) return 0;
    const capped = maxC !== undefined && tempC > maxC ? maxC : tempC;
    return Math.pow(q10, (capped - refC) / 10);
  }

  /** Temperature at an instant (straight line between readings, held outside them). */
  tempAt(atMs: number): number {
    const readings = this.sorted;
    const first = readings[0] as TempReading;
    const last = readings[readings.length - 1] as TempReading;
    if (atMs <= first.atMs) return first.tempC;
    if (atMs >= last.atMs) return last.tempC;
    let lo = 0;
    let hi = readings.length - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if ((readings[mid] as TempReading).atMs <= atMs) lo = mid;
      else hi = mid;
    }
    const a = readings[lo] as TempReading;
    const b = readings[hi] as TempReading;
    if (b.atMs === a.atMs) return b.tempC;
    return a.tempC + ((b.tempC - a.tempC) * (atMs - a.atMs)) / (b.atMs - a.atMs);
  }

  /** The readings' time span. */
  get span(): { readonly firstMs: number; readonly lastMs: number } {
    return { firstMs: this.firstMs, lastMs: this.lastMs };
  }

  // Split a straight-line stretch where it crosses the product's min and max, so each
  // piece has one behaviour: no cure, capped, or exponential.
  private addStretch(aMs: number, aC: number, bMs: number, bC: number, progress: number): number {
    const cuts = [aMs, bMs];
    for (const limit of [this.options.minC, this.options.maxC]) {
      if (limit === undefined) continue;
      if ((aC - limit) * (bC - limit) < 0) {
        cuts.push(aMs + ((limit - aC) / (bC - aC)) * (bMs - aMs));
      }
    }
    cuts.sort((x, y) => x - y);
    const tempAt = (ms: number) => aC + ((bC - aC) * (ms - aMs)) / (bMs - aMs);
    let reached = progress;
    for (let i = 0; i + 1 < cuts.length; i += 1) {
      const s = cuts[i] as number;
      const e = cuts[i + 1] as number;
      if (e <= s) continue;
      const sC = tempAt(s);
      const eC = tempAt(e);
      const midC = (sC + eC) / 2;
      const { minC, maxC } = this.options;
      let rateStart: number;
      let growthPerMs: number;
      if (minC !== undefined && midC < minC) {
        rateStart = 0;
        growthPerMs = 0;
      } else if (maxC !== undefined && midC > maxC) {
        rateStart = this.rateAt(maxC);
        growthPerMs = 0;
      } else {
        rateStart = Math.pow(this.options.q10, (sC - this.options.refC) / 10);
        // ln(rate) is a straight line in time: d ln r / dt = ln(q10)/10 · dT/dt.
        growthPerMs = ((Math.log(this.options.q10) / 10) * (eC - sC)) / (e - s);
      }
      const piece: Piece = { startMs: s, endMs: e, startProgress: reached, rateStart, growthPerMs };
      this.pieces.push(piece);
      reached += pieceProgress(piece, e - s);
    }
    return reached;
  }

  /** Progress (reference minutes) reached at `atMs`, counted from the first reading. */
  progressAt(atMs: number): number {
    finite('atMs', atMs);
    if (atMs <= this.firstMs) return (this.rateBefore * (atMs - this.firstMs)) / MS_PER_MINUTE;
    if (atMs >= this.lastMs) {
      return this.endProgress + (this.rateAfter * (atMs - this.lastMs)) / MS_PER_MINUTE;
    }
    const piece = this.pieceAt(atMs);
    if (piece === undefined) return this.endProgress;
    return piece.startProgress + pieceProgress(piece, atMs - piece.startMs);
  }

  /**
   * The first instant at which `minutesAtRef` reference minutes have passed since
   * `fromMs`; null when that never happens (the held temperature is below the minimum).
   */
  reachedAt(fromMs: number, minutesAtRef: number): number | null {
    const target = this.progressAt(fromMs) + minutesAtRef;
    return this.timeOfProgress(target, fromMs);
  }

  private timeOfProgress(target: number, notBeforeMs: number): number | null {
    if (target <= 0) {
      // Only reachable before the first reading, at the rate held there.
      if (this.rateBefore > 0) {
        return Math.max(notBeforeMs, this.firstMs + (target * MS_PER_MINUTE) / this.rateBefore);
      }
      if (target <= this.progressAt(notBeforeMs)) return notBeforeMs;
    }
    if (target > this.endProgress) {
      if (this.rateAfter <= 0) return null;
      return this.lastMs + ((target - this.endProgress) * MS_PER_MINUTE) / this.rateAfter;
    }
    // First piece whose end progress reaches the target.
    let lo = 0;
    let hi = this.pieces.length - 1;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      const p = this.pieces[mid] as Piece;
      if (p.startProgress + pieceProgress(p, p.endMs - p.startMs) >= target) hi = mid;
      else lo = mid + 1;
    }
    const piece = this.pieces[lo];
    if (piece === undefined) return Math.max(notBeforeMs, this.firstMs);
    const need = target - piece.startProgress;
    const within = Math.min(piece.endMs - piece.startMs, pieceTimeFor(piece, need));
    return Math.max(notBeforeMs, piece.startMs + within);
  }

  private pieceAt(atMs: number): Piece | undefined {
    let lo = 0;
    let hi = this.pieces.length - 1;
    if (hi < 0) return undefined;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if ((this.pieces[mid] as Piece).startMs <= atMs) lo = mid;
      else hi = mid - 1;
    }
    return this.pieces[lo];
  }

  /** Lowest and highest temperature between two instants (readings inside, plus the ends). */
  tempRange(fromMs: number, toMs: number): { readonly minC: number; readonly maxC: number } {
    let minC = Math.min(this.tempAt(fromMs), this.tempAt(toMs));
    let maxC = Math.max(this.tempAt(fromMs), this.tempAt(toMs));
    for (const r of this.sorted) {
      if (r.atMs <= fromMs) continue;
      if (r.atMs >= toMs) break;
      if (r.tempC < minC) minC = r.tempC;
      if (r.tempC > maxC) maxC = r.tempC;
    }
    return { minC, maxC };
  }
}

// ∫₀^d rateStart·e^(k t) dt, in reference minutes, for d ms into the piece.
function pieceProgress(piece: Piece, durationMs: number): number {
  const k = piece.growthPerMs;
  if (piece.rateStart === 0 || durationMs <= 0) return 0;
  if (Math.abs(k * durationMs) < 1e-12) return (piece.rateStart * durationMs) / MS_PER_MINUTE;
  return (piece.rateStart * Math.expm1(k * durationMs)) / k / MS_PER_MINUTE;
}

// Inverse of pieceProgress: ms into the piece to gain `progress` reference minutes.
function pieceTimeFor(piece: Piece, progress: number): number {
  if (progress <= 0) return 0;
  if (piece.rateStart === 0) return Number.POSITIVE_INFINITY;
  const k = piece.growthPerMs;
  const linearMs = (progress * MS_PER_MINUTE) / piece.rateStart;
  if (Math.abs(k * linearMs) < 1e-12) return linearMs;
  const inside = 1 + (k * progress * MS_PER_MINUTE) / piece.rateStart;
  if (inside <= 0) return Number.POSITIVE_INFINITY;
  return Math.log1p((k * progress * MS_PER_MINUTE) / piece.rateStart) / k;
}
