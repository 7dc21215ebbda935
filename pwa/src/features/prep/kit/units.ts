import {
  formatTemp,
  formatThickness,
  fromCelsius,
  toCelsius,
  type TempUnit,
  type ThicknessUnit,
} from '@panelpass/shared';

/**
 * What the stage screens need from the business's settings: units and the default keep-dry
 * window. The same shape as the settings' `useUnits()` view, so either can feed the screens.
 */
export interface StageUnits {
  thickness: ThicknessUnit;
  temperature: TempUnit;
  waits: { keepDryHours: number | null };
  thicknessSymbol: string;
  temperatureSymbol: string;
  formatThickness(um: number): string;
  formatTemp(celsius: number, decimals?: number): string;
  /** A typed temperature in the business's unit → °C. */
  toC(value: number): number;
  /** °C → the business's unit, for filling a field. */
  fromC(celsius: number): number;
}

/** Units from the settings (shared conversions); no keep-dry default unless given. */
export function stageUnits(
  thickness: ThicknessUnit = 'um',
  temperature: TempUnit = 'C',
  keepDryHours: number | null = null,
): StageUnits {
  return {
    thickness,
    temperature,
    waits: { keepDryHours },
    thicknessSymbol: thickness === 'mil' ? 'mil' : 'µm',
    temperatureSymbol: `°${temperature}`,
    formatThickness: (um) => formatThickness(um, thickness),
    formatTemp: (c, decimals = 1) => formatTemp(c, temperature, decimals),
    toC: (value) => toCelsius(value, temperature),
    fromC: (c) => fromCelsius(c, temperature),
  };
}
