import { describe, expect, it } from 'vitest';
import { DEFAULT_FIELD_SETTINGS } from './units';
import { checkSettings, draftOf } from './settingsForm';

describe('the units and drive-time settings form', () => {
  it('starts from the settings in use and sends both sections whole', () => {
    const d = draftOf(DEFAULT_FIELD_SETTINGS);
    expect(d).toEqual({ thickness: 'um', temperature: 'C', roadFactor: '1.3', averageKmh: '40' });
    expect(checkSettings({ ...d, temperature: 'F', averageKmh: '32,5' }).patch).toEqual({
      units: { thickness: 'um', temperature: 'F' },
      drive: { roadFactor: 1.3, averageSpeedKmh: 32.5 },
    });
  });

  it('refuses what the server would refuse, in words', () => {
    const d = draftOf(DEFAULT_FIELD_SETTINGS);
    expect(checkSettings({ ...d, roadFactor: '0.9' }).problems.roadFactor).toMatch(/from 1 to 3/);
    expect(checkSettings({ ...d, roadFactor: '1.255' }).patch).toBeNull();
    expect(checkSettings({ ...d, averageKmh: '200' }).problems.averageKmh).toMatch(/5 to 150/);
    expect(checkSettings({ ...d, averageKmh: 'fast' }).patch).toBeNull();
  });
});
