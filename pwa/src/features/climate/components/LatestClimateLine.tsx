import { dewPointC, type ClimateReadingRow } from '@panelpass/shared';
import { useUnits } from '../../settings/useUnits';

function clock(iso: string): string {
  const at = new Date(iso);
  return Number.isNaN(at.getTime())
    ? ''
    : at.toLocaleTimeString(undefined, { hour: 'numeric', minute: '2-digit' });
}

/** "Last reading at 14:02: air 18.2 °C, 65 % humidity, panel 21.0 °C, dew point 11.6 °C". */
export function latestClimateWords(
  reading: ClimateReadingRow,
  formatTemp: (c: number) => string,
): string {
  const parts = [`air ${formatTemp(reading.airC)}`, `${Math.round(reading.rhPct)} % humidity`];
  if (reading.surfaceC !== null) parts.push(`panel ${formatTemp(reading.surfaceC)}`);
  try {
    if (reading.rhPct > 0)
      parts.push(`dew point ${formatTemp(dewPointC(reading.airC, reading.rhPct))}`);
  } catch {
    // Out of the formula's range: leave the dew point out.
  }
  return `Last reading at ${clock(reading.takenAt)}: ${parts.join(', ')}.`;
}

export function LatestClimateLine({ reading }: { reading: ClimateReadingRow }) {
  const units = useUnits();
  return <p className="pp-climate__latest">{latestClimateWords(reading, units.formatTemp)}</p>;
}
