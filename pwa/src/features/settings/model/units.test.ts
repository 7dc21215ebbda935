import { describe, expect, it } from 'vitest';
import { MemoryStorage } from '../../../test/memoryStorage';
import {
  DEFAULT_FIELD_SETTINGS,
  keepSettings,
  keptSettingsKey,
  readFieldSettings,
  readKeptSettings,
  unitsView,
} from './units';

const ownerAnswer = {
  id: 'b1',
  name: 'Heronwake Mobile Finish',
  settings: {
    units: { thickness: 'mil', temperature: 'F' },
    waits: { keepDryHours: 12, maintenanceReminderMonths: 4 },
    drive: { roadFactor: 1.4, averageSpeedKmh: 45 },
    services: [],
  },
};

describe('the field settings from GET /api/business', () => {
  it("reads the owner's units, waits and drive factors (the server's averageSpeedKmh)", () => {
    expect(readFieldSettings(ownerAnswer)).toEqual({
      thickness: 'mil',
      temperature: 'F',
      waits: { keepDryHours: 12, maintenanceReminderMonths: 4 },
      drive: { roadFactor: 1.4, averageKmh: 45 },
    });
  });

  it("a helper's answer (the name alone) has no settings: null, so the defaults hold", () => {
    expect(readFieldSettings({ id: 'b1', name: 'Heronwake Mobile Finish' })).toBeNull();
    expect(DEFAULT_FIELD_SETTINGS).toMatchObject({
      thickness: 'um',
      temperature: 'C',
      drive: { roadFactor: 1.3, averageKmh: 40 },
    });
  });

  it('a malformed section falls back to its own default only', () => {
    const read = readFieldSettings({
      settings: { units: { thickness: 'inch', temperature: 'F' }, drive: { roadFactor: -2 } },
    });
    expect(read).toMatchObject({
      thickness: 'um',
      temperature: 'F',
      drive: { roadFactor: 1.3, averageKmh: 40 },
    });
  });
});

describe('the copy kept on the phone (offline)', () => {
  it('round-trips per business', () => {
    const storage = new MemoryStorage();
    const settings = readFieldSettings(ownerAnswer)!;
    keepSettings(storage, 'b1', settings);
    expect(readKeptSettings(storage, 'b1')).toEqual(settings);
    expect(readKeptSettings(storage, 'b2')).toBeNull();
  });

  it('ignores a kept copy it cannot read', () => {
    const storage = new MemoryStorage();
    storage.setItem(keptSettingsKey('b1'), '{not json');
    expect(readKeptSettings(storage, 'b1')).toBeNull();
  });
});

describe('unitsView: conversions and words from shared', () => {
  it('°F and mil: typed values go to °C and µm, stored values come out in words', () => {
    const v = unitsView(readFieldSettings(ownerAnswer)!, 'server');
    expect(v.toC(68)).toBeCloseTo(20, 10);
    expect(v.fromC(20)).toBeCloseTo(68, 10);
    expect(v.formatTemp(20)).toBe('68.0 °F');
    expect(v.formatTempDelta(3)).toBe('5.4 °F');
    expect(v.toUm(4)).toBeCloseTo(101.6, 10);
    expect(v.formatThickness(112)).toBe('4.41 mil');
    expect(v.temperatureSymbol).toBe('°F');
    expect(v.thicknessSymbol).toBe('mil');
  });

  it('the defaults are µm and °C', () => {
    const v = unitsView(DEFAULT_FIELD_SETTINGS, 'defaults');
    expect(v.formatTemp(21.25)).toBe('21.3 °C');
    expect(v.formatThickness(112)).toBe('112 µm');
    expect(v.toC(21)).toBe(21);
  });
});
