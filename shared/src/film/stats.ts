// Panel film statistics: min, mean, max and standard deviation, as ISO 2360 / ISO 2178
// reports list them.
//
// The standard deviation is the SAMPLE one (divisor n − 1): the readings are a sample of
// the panel's film, and the number estimates how the whole panel varies, which the
// population formula (divisor n) understates for the 3–10 readings a panel gets. It is
// null for a single reading, where no spread can be estimated.
import { nonEmpty, nonNegative } from '../internal/validate';

export interface FilmStats {
  readonly count: number;
  readonly minUm: number;
  readonly meanUm: number;
  readonly maxUm: number;
  /** Sample standard deviation (n − 1); null for a single reading. */
  readonly sdUm: number | null;
  readonly rangeUm: number;
}

export function filmStats(valuesUm: readonly number[], field = 'readingsUm'): FilmStats {
  const values = nonEmpty(field, valuesUm);
  // Welford's running mean and sum of squares: steady for any number of readings.
  let mean = 0;
  let m2 = 0;
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  values.forEach((raw, i) => {
    const x = nonNegative(`${field}[${i}]`, raw);
    const delta = x - mean;
    mean += delta / (i + 1);
    m2 += delta * (x - mean);
    if (x < min) min = x;
    if (x > max) max = x;
  });
  const n = values.length;
  return {
    count: n,
    minUm: min,
    meanUm: mean,
    maxUm: max,
    sdUm: n < 2 ? null : Math.sqrt(m2 / (n - 1)),
    rangeUm: max - min,
  };
}

/** Median; for an even count, the mean of the two middle values. */
export function median(values: readonly number[], field = 'values'): number {
  const sorted = [...nonEmpty(field, values)].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  const upper = sorted[mid] as number;
  return sorted.length % 2 === 1 ? upper : ((sorted[mid - 1] as number) + upper) / 2;
}
