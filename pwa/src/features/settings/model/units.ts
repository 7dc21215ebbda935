import {
  DEFAULT_DRIVE,
  formatTemp,
  formatTempDelta,
  formatThickness,
  fromCelsius,
  fromMicrometres,
  toCelsius,
  toMicrometres,
  type DriveSettings,
  type TempUnit,
  type ThicknessUnit,
} from '@panelpass/shared';

/** What the field screens need from the business's settings. */
export interface FieldSettings {
  thickness: ThicknessUnit;
  temperature: TempUnit;
  waits: { keepDryHours: number; maintenanceReminderMonths: number };
  drive: DriveSettings;
}

/** Where the settings in use came from: the server now, the copy kept on the phone, or ours. */
export type SettingsSource = 'server' | 'kept' | 'defaults';

/**
 * Until the owner says otherwise: µm and °C, a day's keep-dry window, a maintenance visit
 * after six months (the server's own defaults for a new business), and the drive-time
 * factors of shared `DEFAULT_DRIVE`.
 */
export const DEFAULT_FIELD_SETTINGS: FieldSettings = {
  thickness: 'um',
  temperature: 'C',
  waits: { keepDryHours: 24, maintenanceReminderMonths: 6 },
  drive: DEFAULT_DRIVE,
};

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

const positive = (value: unknown): value is number =>
  typeof value === 'number' && Number.isFinite(value) && value > 0;

/**
 * The field settings out of `GET /api/business` (the owner's answer carries `settings`), or
 * out of the copy kept on the phone. Null when there are none: a helper gets only the
 * business's name. A section that is missing or malformed falls back to its default alone.
 */
export function readFieldSettings(body: unknown): FieldSettings | null {
  if (!isRecord(body) || !isRecord(body.settings)) return null;
  const { units, waits, drive } = body.settings;
  const out: FieldSettings = {
    ...DEFAULT_FIELD_SETTINGS,
    waits: { ...DEFAULT_FIELD_SETTINGS.waits },
    drive: { ...DEFAULT_FIELD_SETTINGS.drive },
  };
  if (isRecord(units)) {
    if (units.thickness === 'um' || units.thickness === 'mil') out.thickness = units.thickness;
    if (units.temperature === 'C' || units.temperature === 'F') out.temperature = units.temperature;
  }
  if (isRecord(waits)) {
    if (typeof waits.keepDryHours === 'number' && waits.keepDryHours >= 0) {
      out.waits.keepDryHours = waits.keepDryHours;
    }
    if (positive(waits.maintenanceReminderMonths)) {
      out.waits.maintenanceReminderMonths = waits.maintenanceReminderMonths;
    }
  }
  if (isRecord(drive)) {
    // The server calls it averageSpeedKmh; the copy on the phone averageKmh.
    const kmh = drive.averageSpeedKmh ?? drive.averageKmh;
    out.drive = {
      roadFactor:
        positive(drive.roadFactor) && drive.roadFactor >= 1 && drive.roadFactor <= 5
          ? drive.roadFactor
          : out.drive.roadFactor,
      averageKmh: positive(kmh) && kmh <= 200 ? kmh : out.drive.averageKmh,
    };
  }
  return out;
}

export const keptSettingsKey = (businessId: string) => `panelpass-field-settings-${businessId}`;

/** The copy kept on the phone for working offline; null when there is none (or it is bad). */
export function readKeptSettings(storage: Storage, businessId: string): FieldSettings | null {
  try {
    const text = storage.getItem(keptSettingsKey(businessId));
    if (!text) return null;
    const kept: unknown = JSON.parse(text);
    return readFieldSettings({ settings: toSettingsShape(kept) });
  } catch {
    return null;
  }
}

export function keepSettings(storage: Storage, businessId: string, settings: FieldSettings): void {
  try {
    storage.setItem(keptSettingsKey(businessId), JSON.stringify(settings));
  } catch {
    // A full or blocked storage: the settings still hold for this session.
  }
}

function toSettingsShape(kept: unknown): unknown {
  if (!isRecord(kept)) return null;
  return {
    units: { thickness: kept.thickness, temperature: kept.temperature },
    waits: kept.waits,
    drive: kept.drive,
  };
}

/** The settings with the conversions and words every field screen uses (all from shared). */
export interface UnitsView extends FieldSettings {
  source: SettingsSource;
  /** "µm" or "mil". */
  thicknessSymbol: string;
  /** "°C" or "°F". */
  temperatureSymbol: string;
  /** "112 µm" / "4.41 mil" for a thickness held in µm. */
  formatThickness: (um: number) => string;
  /** "14.2 °C" / "57.6 °F" for a temperature held in °C. */
  formatTemp: (celsius: number, decimals?: number) => string;
  /** "3 °C" / "5.4 °F" for a difference held in °C. */
  formatTempDelta: (deltaC: number, decimals?: number) => string;
  /** A typed temperature in the business's unit → °C (what commands take). */
  toC: (value: number) => number;
  /** °C → the business's unit, for filling a field. */
  fromC: (celsius: number) => number;
  /** A typed thickness in the business's unit → µm. */
  toUm: (value: number) => number;
  fromUm: (um: number) => number;
}

export function unitsView(settings: FieldSettings, source: SettingsSource): UnitsView {
  const t = settings.temperature;
  const th = settings.thickness;
  return {
    ...settings,
    source,
    thicknessSymbol: th === 'mil' ? 'mil' : 'µm',
    temperatureSymbol: `°${t}`,
    formatThickness: (um) => formatThickness(um, th),
    formatTemp: (c, decimals = 1) => formatTemp(c, t, decimals),
    formatTempDelta: (d, decimals = 1) => formatTempDelta(d, t, decimals),
    toC: (value) => toCelsius(value, t),
    fromC: (c) => fromCelsius(c, t),
    toUm: (value) => toMicrometres(value, th),
    fromUm: (um) => fromMicrometres(um, th),
  };
}
