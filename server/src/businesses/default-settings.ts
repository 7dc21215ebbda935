import type { BusinessSettingsDto } from './dto/business-settings.dto';

/**
 * Settings a new business starts with, so a first quote can be priced at once. Invented
 * starting points for the owner to change, not recommendations: amounts in minor units of
 * the business's currency, labour rates in minutes per m² of panel or per job.
 */
export function defaultSettings(): BusinessSettingsDto {
  return {
    services: [
      {
        id: 'wash',
        name: 'Hand wash and dry',
        priceMinor: 6_000,
        labourMinutes: 4,
        labourPer: 'm2',
        step: 'wash',
      },
      {
        id: 'decontaminate',
        name: 'Decontamination (iron, tar, clay)',
        priceMinor: 9_000,
        labourMinutes: 5,
        labourPer: 'm2',
        step: 'decontaminate',
      },
      {
        id: 'one-step',
        name: 'One-step polish',
        priceMinor: 35_000,
        labourMinutes: 12,
        labourPer: 'm2',
        step: 'polish',
      },
      {
        id: 'two-step',
        name: 'Two-step correction',
        priceMinor: 65_000,
        labourMinutes: 25,
        labourPer: 'm2',
        step: 'compound',
      },
      {
        id: 'protect',
        name: 'Protective coating',
        priceMinor: 45_000,
        labourMinutes: 6,
        labourPer: 'm2',
        step: 'protect',
      },
    ],
    sizeClasses: [
      { id: 'small', name: 'Small', factor: 0.9 },
      { id: 'medium', name: 'Medium', factor: 1 },
      { id: 'large', name: 'Large', factor: 1.2 },
      { id: 'xl', name: 'Extra large', factor: 1.4 },
    ],
    conditions: [
      { id: 'light', name: 'Light marks', factor: 1 },
      { id: 'moderate', name: 'Moderate swirls', factor: 1.15 },
      { id: 'heavy', name: 'Heavy defects', factor: 1.35 },
    ],
    chipPriceMinor: 1_500,
    chipLabourMinutes: 10,
    addOns: [
      { id: 'trim', name: 'Trim care', priceMinor: 4_000, labourMinutes: 30 },
      { id: 'headlights', name: 'Headlight restoration', priceMinor: 8_000, labourMinutes: 45 },
      { id: 'engine-bay', name: 'Engine bay clean', priceMinor: 5_000, labourMinutes: 40 },
    ],
    travel: {
      bands: [
        { upToKm: 10, feeMinor: 0 },
        { upToKm: 25, feeMinor: 2_500 },
        { upToKm: 50, feeMinor: 5_000 },
      ],
      taxable: true,
    },
    tax: { rateBp: 800, basis: 'per-invoice', rounding: 'half-up' },
    deposit: { kind: 'percent', percentBp: 2_000, roundToMinor: 100 },
    units: { thickness: 'um', temperature: 'C' },
    waits: { keepDryHours: 24, maintenanceReminderMonths: 6 },
    labourCostPerHourMinor: 3_500,
    drive: { roadFactor: 1.3, averageSpeedKmh: 45 },
    profile: { email: '', phone: '', address: '', base: null },
  };
}

/** The settings in force: what was saved, section by section, over the defaults. */
export function effectiveSettings(saved: Record<string, unknown> | null): BusinessSettingsDto {
  return { ...defaultSettings(), ...(saved ?? {}) };
}
