import { toMicrometres, type ThicknessUnit } from '@panelpass/shared';

/** Fewest readings a spot takes here (SSPC-PA 2 asks for at least 3 close together). */
export const MIN_READINGS = 3;
export const MAX_READINGS = 10;
/** Anything thicker than this is a slip of the finger, not paint and filler (µm). */
export const MAX_READING_UM = 5000;

export type ParsedReading =
  | { state: 'empty' }
  | { state: 'ok'; value: number; um: number }
  | { state: 'bad'; message: string };

/** A typed gauge reading: "112", "112.5" or "112,5"; in µm or mil. */
export function parseReading(text: string, unit: ThicknessUnit): ParsedReading {
  const t = text.trim().replace(',', '.');
  if (t === '') return { state: 'empty' };
  if (!/^\d+(\.\d*)?$|^\.\d+$/.test(t)) {
    return { state: 'bad', message: 'A reading is a number, like 112 or 4.4.' };
  }
  const value = Number(t);
  if (!(value > 0)) return { state: 'bad', message: 'A reading must be above 0.' };
  const um = toMicrometres(value, unit);
  if (um > MAX_READING_UM) {
    return {
      state: 'bad',
      message: `${t} ${unit === 'mil' ? 'mil' : 'µm'} is more than any paint or filler: check the number.`,
    };
  }
  return { state: 'ok', value, um };
}

export interface SpotEntry {
  /** The readings as typed, in the entry's unit, ready for reading.add. */
  values: number[];
  /** The same in µm (what is stored). */
  um: number[];
  problems: { index: number; message: string }[];
  /** Enough readings and none wrong: the spot may be saved. */
  ready: boolean;
  /** What is missing, in words, when not ready. */
  missing: string | null;
}

/** Reads the typed fields of one spot: blanks are skipped, wrong numbers named. */
export function readSpot(fields: readonly string[], unit: ThicknessUnit): SpotEntry {
  const values: number[] = [];
  const um: number[] = [];
  const problems: { index: number; message: string }[] = [];
  fields.forEach((text, index) => {
    const parsed = parseReading(text, unit);
    if (parsed.state === 'ok') {
      values.push(parsed.value);
      um.push(parsed.um);
    } else if (parsed.state === 'bad') problems.push({ index, message: parsed.message });
  });
  const missing =
    problems.length > 0
      ? 'Fix the reading marked above.'
      : values.length < MIN_READINGS
        ? `Enter at least ${MIN_READINGS} readings for the spot (${values.length} so far).`
        : null;
  return { values, um, problems, ready: missing === null, missing };
}
