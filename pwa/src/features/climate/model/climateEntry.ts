import {
  climateGate,
  dewPointC,
  InputError,
  toCelsius,
  type ApplicationWindow,
  type ClimateGateResult,
  type TempUnit,
} from '@panelpass/shared';

/** What the person typed, as typed (in their unit). */
export interface ClimateDraft {
  air: string;
  rh: string;
  surface: string;
}

export const emptyDraft: ClimateDraft = { air: '', rh: '', surface: '' };

/** A typed number, accepting a decimal comma ("18,5") and spaces; null when empty or not a number. */
export function typedNumber(text: string): number | null {
  const cleaned = text.trim().replace(/\s+/g, '').replace(',', '.');
  if (cleaned === '' || !/^[-+]?(\d+\.?\d*|\.\d+)$/.test(cleaned)) return null;
  return Number(cleaned);
}

/** Empty, half-typed ("-", "."), not a number, or a number. */
type Read =
  { state: 'empty' } | { state: 'typing' } | { state: 'bad' } | { state: 'ok'; value: number };

function read(text: string): Read {
  const trimmed = text.trim();
  if (trimmed === '') return { state: 'empty' };
  if (/^[-+.,]$/.test(trimmed)) return { state: 'typing' };
  const value = typedNumber(trimmed);
  return value === null ? { state: 'bad' } : { state: 'ok', value };
}

export interface ClimateCheck {
  /** Per field, what is wrong in words (null when fine or not typed yet). */
  problems: { air: string | null; rh: string | null; surface: string | null };
  /** Ready to record: °C and % to one decimal (null until air and RH are valid). */
  values: { airC: number; rhPct: number; surfaceC: number | null } | null;
  dewPointC: number | null;
  /** The climate gate, once the surface temperature is in too. */
  gate: ClimateGateResult | null;
}

// Air where the dew-point formula was fitted (and the server takes); a panel in the sun
// may be far hotter than the air.
const AIR_RANGE_C = { min: -40, max: 60 };
const SURFACE_RANGE_C = { min: -40, max: 120 };

function rangeWords(unit: TempUnit, min: number, max: number): string {
  const f = (c: number) => Math.round(unit === 'F' ? (c * 9) / 5 + 32 : c);
  return `between ${f(min)} and ${f(max)} °${unit}`;
}

function temperature(
  text: string,
  unit: TempUnit,
  range: { min: number; max: number },
  what: string,
  example: string,
): { c: number | null; problem: string | null } {
  const r = read(text);
  if (r.state === 'empty' || r.state === 'typing') return { c: null, problem: null };
  if (r.state === 'bad') return { c: null, problem: `Type a number, like ${example}.` };
  const c = toCelsius(r.value, unit);
  if (c < range.min || c > range.max) {
    return { c: null, problem: `${what} must be ${rangeWords(unit, range.min, range.max)}.` };
  }
  return { c, problem: null };
}

/**
 * Checks a climate entry as it is typed and, as soon as air and humidity are in, gives the
 * dew point (shared `dewPointC`); with the surface temperature too, the climate gate's answer
 * and its reasons (shared `climateGate`, its messages in the business's unit), against the
 * product's window when one is given.
 */
export function checkClimate(
  draft: ClimateDraft,
  unit: TempUnit,
  product?: ApplicationWindow,
): ClimateCheck {
  const air = temperature(draft.air, unit, AIR_RANGE_C, 'Air temperature', '18.5');
  const surface = temperature(draft.surface, unit, SURFACE_RANGE_C, 'Surface temperature', '21');
  const rhRead = read(draft.rh);
  let rhPct: number | null = null;
  let rhProblem: string | null = null;
  if (rhRead.state === 'bad') rhProblem = 'Type a number, like 65.';
  else if (rhRead.state === 'ok') {
    if (rhRead.value <= 0 || rhRead.value > 100) {
      rhProblem = 'Humidity is a percentage: above 0, at most 100.';
    } else rhPct = rhRead.value;
  }
  const problems = { air: air.problem, rh: rhProblem, surface: surface.problem };
  const nothing = { problems, values: null, dewPointC: null, gate: null };
  if (air.c === null || rhPct === null || surface.problem) return nothing;

  const airC = round1(air.c);
  const rh = round1(rhPct);
  const surfaceC = surface.c === null ? null : round1(surface.c);
  try {
    const dew = dewPointC(airC, rh);
    const gate =
      surfaceC === null
        ? null
        : climateGate({
            airC,
            rhPercent: rh,
            surfaceC,
            displayUnit: unit,
            ...(product ? { product } : {}),
          });
    return { problems, values: { airC, rhPct: rh, surfaceC }, dewPointC: dew, gate };
  } catch (error) {
    if (error instanceof InputError) return nothing;
    throw error;
  }
}

/** Readings are kept to a tenth of a degree (and of a percent), as the server keeps them. */
function round1(value: number): number {
  return Math.round(value * 10) / 10;
}
