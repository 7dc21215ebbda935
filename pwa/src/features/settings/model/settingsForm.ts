import { typedNumber } from '../../climate/model/climateEntry';
import type { FieldSettings } from './units';
import type { FieldSettingsPatch } from '../api/businessApi';

export interface SettingsDraft {
  thickness: 'um' | 'mil';
  temperature: 'C' | 'F';
  roadFactor: string;
  averageKmh: string;
}

export function draftOf(s: FieldSettings): SettingsDraft {
  return {
    thickness: s.thickness,
    temperature: s.temperature,
    roadFactor: String(s.drive.roadFactor),
    averageKmh: String(s.drive.averageKmh),
  };
}

const decimals = (n: number) => (String(n).split('.')[1] ?? '').length;

/**
 * Checks the settings as the server will (road factor 1–3 with two decimals at most, average
 * speed 5–150 km/h with one decimal): the problem of each field in words, and the patch to
 * send when there is none.
 */
export function checkSettings(d: SettingsDraft): {
  problems: { roadFactor: string | null; averageKmh: string | null };
  patch: FieldSettingsPatch | null;
} {
  const factor = typedNumber(d.roadFactor);
  const kmh = typedNumber(d.averageKmh);
  const problems = {
    roadFactor:
      factor === null || factor < 1 || factor > 3 || decimals(factor) > 2
        ? 'A number from 1 to 3, like 1.3 (two decimals at most).'
        : null,
    averageKmh:
      kmh === null || kmh < 5 || kmh > 150 || decimals(kmh) > 1
        ? 'A speed from 5 to 150 km/h, like 40.'
        : null,
  };
  if (problems.roadFactor || problems.averageKmh || factor === null || kmh === null) {
    return { problems, patch: null };
  }
  return {
    problems,
    patch: {
      units: { thickness: d.thickness, temperature: d.temperature },
      drive: { roadFactor: factor, averageSpeedKmh: kmh },
    },
  };
}
