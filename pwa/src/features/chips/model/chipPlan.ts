/**
 * The chip planner and climate gate in the detailer's words, all computed by shared:
 * `planChip` (when the next layer may go on, when it is ready to level) from the chip's
 * layers, the paint's cure properties and the job's temperatures; `climateGate` (may paint go
 * on now) from the latest climate entry and the paint's window.
 */
import {
  BASIS,
  climateGate,
  InputError,
  planChip,
  reason,
  type ApplicationWindow,
  type ChipPlanResult,
  type ClimateReadingRow,
  type CureProduct,
  type Reason,
  type TempReading,
  type TempUnit,
} from '@panelpass/shared';
import type { Tone } from '../../prep/kit/StateTag';
import { clockTime, dayAndTime, durationWords } from '../../prep/kit/time';

type Properties = Record<string, unknown> | null | undefined;

const num = (v: unknown): number | undefined =>
  typeof v === 'number' && Number.isFinite(v) ? v : undefined;

/** A paint's cure properties from the Shelf, or null when its data-sheet times are missing. */
export function cureProductOf(properties: Properties): CureProduct | null {
  if (!properties) return null;
  const refC = num(properties.refC);
  const flashMinAtRef = num(properties.flashMinAtRef);
  const cureMinAtRef = num(properties.cureMinAtRef);
  if (refC === undefined || !flashMinAtRef || !cureMinAtRef) return null;
  if (flashMinAtRef <= 0 || cureMinAtRef <= 0) return null;
  const minC = num(properties.minC);
  const maxC = num(properties.maxC);
  const maxRhPercent = num(properties.maxRhPercent);
  return {
    refC,
    flashMinAtRef,
    cureMinAtRef,
    ...(minC !== undefined ? { minC } : {}),
    ...(maxC !== undefined ? { maxC } : {}),
    ...(maxRhPercent !== undefined ? { maxRhPercent } : {}),
  };
}

/** A product's application window (the gate's limits) from the Shelf. */
export function applicationWindowOf(properties: Properties): ApplicationWindow {
  if (!properties) return {};
  const minC = num(properties.minC);
  const maxC = num(properties.maxC);
  const maxRhPercent = num(properties.maxRhPercent);
  const minAboveDewPointC = num(properties.minAboveDewPointC);
  return {
    ...(minC !== undefined ? { minC } : {}),
    ...(maxC !== undefined ? { maxC } : {}),
    ...(maxRhPercent !== undefined ? { maxRhPercent } : {}),
    ...(minAboveDewPointC !== undefined ? { minAboveDewPointC } : {}),
  };
}

/** A panel temperature typed on the chips screen, and when. */
export interface EnteredTemp {
  tempC: number;
  atMs: number;
}

/**
 * The temperature series the planner integrates: each climate entry's panel (surface)
 * temperature, else its air temperature, with its humidity; plus the one typed on the screen.
 */
export function temperatureReadings(
  climate: readonly ClimateReadingRow[],
  entered: EnteredTemp | null,
): TempReading[] {
  const out: TempReading[] = climate.map((c) => ({
    atMs: Date.parse(c.takenAt),
    tempC: c.surfaceC ?? c.airC,
    rhPercent: c.rhPct,
  }));
  if (entered) out.push({ atMs: entered.atMs, tempC: entered.tempC });
  return out.sort((a, b) => a.atMs - b.atMs);
}

export type ChipPlanOutcome =
  { kind: 'plan'; plan: ChipPlanResult } | { kind: 'cannot-plan'; message: string };

/** The chip's schedule (shared `planChip`), or why there is none, in words. */
export function chipPlanFor(input: {
  layersAppliedAtMs: readonly number[];
  layersPlanned: number;
  paint: Properties;
  paintName: string | null;
  readings: readonly TempReading[];
  nowMs: number;
  unit: TempUnit;
}): ChipPlanOutcome {
  const product = cureProductOf(input.paint);
  if (!product) {
    return {
      kind: 'cannot-plan',
      message: input.paintName
        ? `No flash and cure times on the Shelf for ${input.paintName}: add them from its data sheet to plan the layers.`
        : 'No paint named for this chip: pick its touch-up paint to plan the layers.',
    };
  }
  if (input.readings.length === 0) {
    return {
      kind: 'cannot-plan',
      message: 'No temperature yet: type the panel temperature or take a climate reading.',
    };
  }
  // A layer stamped a moment ahead of this phone's clock is "now", not the future.
  const nowMs = Math.max(input.nowMs, ...input.layersAppliedAtMs);
  try {
    return {
      kind: 'plan',
      plan: planChip({
        product,
        layersAppliedAtMs: input.layersAppliedAtMs,
        layersPlanned: Math.max(1, Math.round(input.layersPlanned)),
        readings: input.readings,
        nowMs,
        displayUnit: input.unit,
      }),
    };
  } catch (error) {
    if (error instanceof InputError) return { kind: 'cannot-plan', message: error.message };
    throw error;
  }
}

export interface ChipWords {
  tag: string;
  tone: Tone;
  /** "Ready for layer 3 at 15:05", "Ready to level at 18:40". */
  headline: string;
  /** A second line: when it will be level-ready if each layer goes on when allowed. */
  detail: string | null;
}

/** The chip's state in words from its plan at `nowMs`. */
export function chipWords(plan: ChipPlanResult, nowMs: number, locale?: string): ChipWords {
  const next = plan.layersDone + 1;
  const at = (ms: number) => dayAndTime(ms, nowMs, locale);
  const level =
    plan.levelReadyAtMs !== null && plan.levelReadyIsProjected
      ? `Ready to level at ${at(plan.levelReadyAtMs)} if each layer goes on when ready.`
      : null;
  switch (plan.status) {
    case 'ready-for-next-layer':
      return { tag: 'Ready', tone: 'go', headline: `Ready for layer ${next} now`, detail: level };
    case 'flashing':
      return {
        tag: 'Flashing',
        tone: 'wait',
        headline: `Ready for layer ${next} at ${at(plan.nextLayerAtMs ?? nowMs)}`,
        detail:
          plan.nextLayerAtMs !== null
            ? `${durationWords(plan.nextLayerAtMs - nowMs)} to wait. ${level ?? ''}`.trim()
            : level,
      };
    case 'curing':
      return {
        tag: 'Curing',
        tone: 'wait',
        headline: `Ready to level at ${at(plan.levelReadyAtMs ?? nowMs)}`,
        detail:
          plan.levelReadyAtMs !== null
            ? `${durationWords(plan.levelReadyAtMs - nowMs)} of cure left.`
            : null,
      };
    case 'ready-to-level':
      return {
        tag: 'Ready to level',
        tone: 'done',
        headline: 'Ready to level and polish now',
        detail: null,
      };
    case 'too-cold-to-apply':
      return {
        tag: 'Too cold',
        tone: 'stop',
        headline: `Too cold for layer ${next}`,
        detail: level,
      };
    case 'too-hot-to-apply':
      return { tag: 'Too hot', tone: 'stop', headline: `Too hot for layer ${next}`, detail: level };
    case 'too-humid-to-apply':
      return {
        tag: 'Too humid',
        tone: 'stop',
        headline: `Too humid for layer ${next}`,
        detail: level,
      };
    case 'cure-stalled':
      return {
        tag: 'Not curing',
        tone: 'stop',
        headline: 'Not curing: too cold',
        detail: null,
      };
  }
}

/** How old a climate entry may be before the gate asks for a new one (our own rule). */
export const CLIMATE_FRESH_MS = 2 * 60 * 60 * 1000;

export interface GateOutcome {
  ok: boolean;
  /** Every reason, stops first; the stops are why the Layer button is blocked. */
  reasons: Reason[];
}

/**
 * May paint go on now? Shared `climateGate` with the latest climate entry (its panel
 * temperature, else the one typed on the screen, else the air's) and the paint's window.
 * Without a climate entry the dew point cannot be checked, so it blocks and says why.
 */
export function chipGate(input: {
  latest: ClimateReadingRow | null;
  entered: EnteredTemp | null;
  window: ApplicationWindow;
  nowMs: number;
  unit: TempUnit;
}): GateOutcome {
  const { latest, entered, nowMs } = input;
  if (!latest) {
    return {
      ok: false,
      reasons: [
        reason(
          'no-climate-reading',
          'stop',
          'No climate reading on this job: take one (air temperature and humidity) so the dew point can be checked before paint goes on.',
          'ISO 8502-4',
        ),
      ],
    };
  }
  const extra: Reason[] = [];
  let surfaceC = latest.surfaceC;
  if (surfaceC === null) {
    if (entered) {
      surfaceC = entered.tempC;
      extra.push(
        reason(
          'typed-panel-temperature',
          'info',
          'Panel temperature as typed on this screen (the climate reading has none).',
        ),
      );
    } else {
      surfaceC = latest.airC;
      extra.push(
        reason(
          'air-used-for-surface',
          'warn',
          'No panel temperature measured: the air temperature was used. A panel in shade or at dusk can be colder than the air.',
        ),
      );
    }
  }
  const age = nowMs - Date.parse(latest.takenAt);
  if (age > CLIMATE_FRESH_MS) {
    extra.push(
      reason(
        'climate-reading-old',
        'warn',
        `The last climate reading is ${durationWords(age)} old (${clockTime(Date.parse(latest.takenAt))}): take a new one.`,
        BASIS.ourOwnRule,
      ),
    );
  }
  try {
    const gate = climateGate({
      airC: latest.airC,
      rhPercent: latest.rhPct,
      surfaceC,
      product: input.window,
      displayUnit: input.unit,
    });
    const reasons = [...gate.reasons, ...extra].sort((a, b) => rank(a) - rank(b));
    return { ok: gate.ok, reasons };
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
    return {
      ok: false,
      reasons: [
        reason(
          'climate-not-judged',
          'stop',
          `The climate reading cannot be judged: ${error.message}`,
        ),
      ],
    };
  }
}

const rank = (r: Reason) => (r.severity === 'stop' ? 0 : r.severity === 'warn' ? 1 : 2);

/**
 * Why the Layer button is blocked: every stop of the gate and of the planner (too cold, too
 * hot, too humid to apply), each said once. Empty when a layer may go on.
 */
export function layerBlockers(gate: GateOutcome, plan: ChipPlanResult | null): string[] {
  const stops = [
    ...gate.reasons.filter((r) => r.severity === 'stop'),
    ...(plan?.reasons ?? []).filter(
      (r) => r.severity === 'stop' && r.code !== 'cure-stalled-too-cold',
    ),
  ].map((r) => r.message);
  return [...new Set(stops)];
}

/** A layer before the flash is done asks for a second tap; this says why. */
export function earlyLayerWords(plan: ChipPlanResult | null, nowMs: number): string | null {
  if (!plan || plan.layersLeft === 0) {
    return plan && plan.layersLeft === 0
      ? `All ${plan.layersDone} planned layers are on: tap again to add another.`
      : null;
  }
  if (plan.nextLayerAtMs !== null && plan.nextLayerAtMs > nowMs) {
    return `Layer ${plan.layersDone + 1} is due at ${clockTime(plan.nextLayerAtMs)} (${durationWords(plan.nextLayerAtMs - nowMs)} to go): tap again to put it on now.`;
  }
  return null;
}

/** What the reminder timer after a layer says and when it ends (null: nothing to wait for). */
export function reminderAfterLayer(
  chipNumber: number,
  plan: ChipPlanResult,
  nowMs: number,
): { label: string; endsAtMs: number } | null {
  if (plan.layersLeft > 0 && plan.nextLayerAtMs !== null && plan.nextLayerAtMs > nowMs) {
    return {
      label: `Chip ${chipNumber} ready for layer ${plan.layersDone + 1}`,
      endsAtMs: plan.nextLayerAtMs,
    };
  }
  if (plan.layersLeft === 0 && plan.levelReadyAtMs !== null && plan.levelReadyAtMs > nowMs) {
    return { label: `Chip ${chipNumber} ready to level`, endsAtMs: plan.levelReadyAtMs };
  }
  return null;
}
