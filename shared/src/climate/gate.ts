// The climate gate: may this product go on this surface now?
//
// Rules: surface temperature at least 3 °C above the dew point (ISO 8502-4:2017; some US
// charts use 5 °F, pass `minMarginC` to follow them), and air temperature, surface
// temperature and relative humidity inside the product's own limits (its data sheet).
// Every failing rule is listed, not only the first.
import { InputError } from '../errors';
import { finite, inRange, nonNegative } from '../internal/validate';
import { BASIS, Reason, noStops, reason } from '../reasons';
import { dewPointC } from './dew-point';
import { TempUnit, formatTemp, formatTempDelta } from './temperature';

/** ISO 8502-4: the surface must be at least this far above the dew point. */
export const ISO_8502_4_MARGIN_C = 3;

/** A product's application window, from its data sheet. Every limit is optional. */
export interface ApplicationWindow {
  /** Lowest air and surface temperature for application (°C). */
  readonly minC?: number;
  /** Highest air and surface temperature for application (°C). */
  readonly maxC?: number;
  /** Highest relative humidity for application (%). */
  readonly maxRhPercent?: number;
  /** A wider dew-point margin than 3 °C, if the product asks for one (°C). */
  readonly minAboveDewPointC?: number;
}

export interface ClimateGateInput {
  readonly airC: number;
  readonly rhPercent: number;
  readonly surfaceC: number;
  readonly product?: ApplicationWindow;
  /** Default 3 °C (ISO 8502-4). The product's own margin wins when it is wider. */
  readonly minMarginC?: number;
  /** Unit for the numbers inside the messages; the result's fields stay in °C. */
  readonly displayUnit?: TempUnit;
}

export type ClimateReasonCode =
  | 'surface-at-or-below-dew-point'
  | 'surface-too-close-to-dew-point'
  | 'air-below-product-minimum'
  | 'air-above-product-maximum'
  | 'surface-below-product-minimum'
  | 'surface-above-product-maximum'
  | 'humidity-above-product-maximum'
  | 'frost-possible'
  | 'no-product-limits';

export interface ClimateGateResult {
  readonly ok: boolean;
  readonly dewPointC: number;
  /** Surface temperature minus dew point (°C). */
  readonly marginC: number;
  /** The margin that was required (°C). */
  readonly requiredMarginC: number;
  readonly reasons: readonly Reason<ClimateReasonCode>[];
  /** One line for the screen: "Go: …" or "No go: …". */
  readonly summary: string;
}

// Float noise must not turn an exact 3.0 °C margin into a fail.
const EPSILON_C = 1e-9;

export function climateGate(input: ClimateGateInput): ClimateGateResult {
  const unit = input.displayUnit ?? 'C';
  const airC = finite('airC', input.airC);
  const surfaceC = inRange('surfaceC', input.surfaceC, -60, 120, { unit: '°C' });
  const rh = input.rhPercent;
  const dew = dewPointC(airC, rh);
  const product = input.product ?? {};
  const minC = product.minC === undefined ? undefined : finite('product.minC', product.minC);
  const maxC = product.maxC === undefined ? undefined : finite('product.maxC', product.maxC);
  const maxRh =
    product.maxRhPercent === undefined
      ? undefined
      : inRange('product.maxRhPercent', product.maxRhPercent, 0, 100, { unit: '%' });
  const productMargin =
    product.minAboveDewPointC === undefined
      ? 0
      : nonNegative('product.minAboveDewPointC', product.minAboveDewPointC);
  const baseMargin =
    input.minMarginC === undefined
      ? ISO_8502_4_MARGIN_C
      : nonNegative('minMarginC', input.minMarginC);
  const requiredMarginC = Math.max(baseMargin, productMargin);
  if (minC !== undefined && maxC !== undefined && minC > maxC) {
    throw new InputError('product.minC', 'order', 'product.minC must not be above product.maxC');
  }

  const marginC = surfaceC - dew;
  const reasons: Reason<ClimateReasonCode>[] = [];
  const t = (c: number) => formatTemp(c, unit);
  const d = (c: number) => formatTempDelta(c, unit);
  const marginBasis =
    requiredMarginC === productMargin && productMargin > baseMargin
      ? BASIS.productSheet
      : input.minMarginC === undefined
        ? 'ISO 8502-4'
        : BASIS.userSetting;

  if (marginC <= 0) {
    reasons.push(
      reason(
        'surface-at-or-below-dew-point',
        'stop',
        `Surface (${t(surfaceC)}) is at or below the dew point (${t(dew)}): moisture is forming on it. It needs to be at least ${d(requiredMarginC)} above.`,
        marginBasis,
      ),
    );
  } else if (marginC < requiredMarginC - EPSILON_C) {
    reasons.push(
      reason(
        'surface-too-close-to-dew-point',
        'stop',
        `Surface is ${d(marginC)} above dew point; needs at least ${d(requiredMarginC)}.`,
        marginBasis,
      ),
    );
  }
  if (minC !== undefined && airC < minC) {
    reasons.push(
      reason(
        'air-below-product-minimum',
        'stop',
        `Air is ${t(airC)}; the product needs at least ${t(minC)}.`,
        BASIS.productSheet,
      ),
    );
  }
  if (maxC !== undefined && airC > maxC) {
    reasons.push(
      reason(
        'air-above-product-maximum',
        'stop',
        `Air is ${t(airC)}; the product allows at most ${t(maxC)}.`,
        BASIS.productSheet,
      ),
    );
  }
  if (minC !== undefined && surfaceC < minC) {
    reasons.push(
      reason(
        'surface-below-product-minimum',
        'stop',
        `Surface is ${t(surfaceC)}; the product needs at least ${t(minC)}.`,
        BASIS.productSheet,
      ),
    );
  }
  if (maxC !== undefined && surfaceC > maxC) {
    reasons.push(
      reason(
        'surface-above-product-maximum',
        'stop',
        `Surface is ${t(surfaceC)}; the product allows at most ${t(maxC)}. Move to shade or let the panel cool.`,
        BASIS.productSheet,
      ),
    );
  }
  if (maxRh !== undefined && rh > maxRh) {
    reasons.push(
      reason(
        'humidity-above-product-maximum',
        'stop',
        `Humidity is ${Math.round(rh)} %; the product allows at most ${Math.round(maxRh)} %.`,
        BASIS.productSheet,
      ),
    );
  }
  if (dew < 0) {
    reasons.push(
      reason(
        'frost-possible',
        'warn',
        `Dew point is below freezing (${t(dew)}): frost forms a little above this, so keep a wider margin.`,
        'Magnus formula is over water; below 0 °C the frost point is higher',
      ),
    );
  }
  if (minC === undefined && maxC === undefined && maxRh === undefined) {
    reasons.push(
      reason(
        'no-product-limits',
        'info',
        "No product limits entered: only the dew-point margin was checked. Check the product's data sheet.",
      ),
    );
  }

  const ok = noStops(reasons);
  const stops = reasons.filter((r) => r.severity === 'stop');
  const summary = ok
    ? `Go: surface ${d(marginC)} above dew point ${t(dew)} (needs ${d(requiredMarginC)}).`
    : `No go: ${stops.map((r) => r.message).join(' ')}`;
  return { ok, dewPointC: dew, marginC, requiredMarginC, reasons, summary };
}
