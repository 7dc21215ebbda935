import { describe, expect, it } from 'vitest';
import { isInputError } from '../errors';
import { bpPercent, priceFromSettings, type PricingSettings } from './settings';

// Invented demo settings (the server's starting settings for a new business). The expected
// figures below were worked by hand from the rules in docs/computations.md §7 (half-up
// rounding of each service line, of the tax and of the deposit), not by this code.
const settings: PricingSettings = {
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
      id: 'inspect',
      name: 'Paint inspection',
      priceMinor: 2_000,
      labourMinutes: 20,
      labourPer: 'job',
      step: 'other',
      taxable: false,
    },
  ],
  sizeClasses: [
    { id: 'small', name: 'Small', factor: 0.9 },
    { id: 'large', name: 'Large', factor: 1.2 },
  ],
  conditions: [
    { id: 'light', name: 'Light marks', factor: 1 },
    { id: 'moderate', name: 'Moderate swirls', factor: 1.15 },
  ],
  chipPriceMinor: 1_500,
  chipLabourMinutes: 10,
  addOns: [{ id: 'trim', name: 'Trim care', priceMinor: 4_000, labourMinutes: 30 }],
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
  labourCostPerHourMinor: 3_500,
};

describe('priceFromSettings (a quote from the business settings)', () => {
  it('prices a large sedan in moderate condition, worked by hand', () => {
    const q = priceFromSettings(
      settings,
      'USD',
      {
        sizeClass: 'large',
        condition: 'moderate',
        serviceIds: ['wash', 'one-step'],
        chips: 3,
        addOnIds: ['trim'],
        distanceKm: 18,
        discount: { kind: 'fixed', amountMinor: 1_000 },
      },
      'sedan',
    );
    // × 1.2 × 1.15 = × 1.38: wash 8,280, one-step 48,300; 3 chips 4,500; trim 4,000.
    expect(q.lines.map((l) => [l.kind, l.amountMinor])).toEqual([
      ['service', 8_280],
      ['service', 48_300],
      ['per-chip', 4_500],
      ['add-on', 4_000],
      ['travel', 2_500], // 18 km: the band up to 25 km
      ['discount', -1_000],
    ]);
    expect(q.result.subtotalMinor).toBe(66_580);
    expect(q.lines.reduce((a, l) => a + l.amountMinor, 0)).toBe(66_580);
    expect(q.result.taxMinor).toBe(5_326); // 8 % of 66,580 = 5,326.4
    expect(q.result.totalMinor).toBe(71_906);
    expect(q.result.depositMinor).toBe(14_400); // 20 % = 14,381.2 → whole dollars
    // Sedan 12.6 m² × (4 + 12) min/m² = 201.6, + trim 30 + 3 chips × 10 = 261.6 → 262 min.
    expect(q.labour.totalMin).toBe(262);
    expect(q.labourHours).toBe(4.37);
    expect(q.effectiveHourlyMinor).toBe(15_247); // 66,580 × 60 ÷ 262 = 15,247.3
    expect(q.labourCostMinor).toBe(15_283); // 3,500 × 262 ÷ 60 = 15,283.3
  });

  it('prices a percent discount, a chosen band, per-line tax and a fixed deposit', () => {
    const q = priceFromSettings(
      {
        ...settings,
        tax: { rateBp: 800, basis: 'per-line', rounding: 'half-up' },
        deposit: { kind: 'fixed', amountMinor: 10_000 },
      },
      'USD',
      {
        sizeClass: 'small',
        condition: 'light',
        serviceIds: ['two-step', 'inspect'],
        chips: 0,
        addOnIds: [],
        travelBand: 50,
        discount: { kind: 'percent', percentBp: 1_000 },
      },
      'hatchback',
    );
    // two-step 65,000 × 0.9 = 58,500; inspection 2,000 × 0.9 = 1,800 (not taxed).
    expect(q.result.linesMinor).toBe(60_300);
    expect(q.result.discountMinor).toBe(6_030);
    // Discount spread 5,850 / 180; tax 8 % of 52,650 = 4,212, travel 8 % of 5,000 = 400.
    expect(q.result.taxMinor).toBe(4_612);
    expect(q.result.subtotalMinor).toBe(60_300 - 6_030 + 5_000);
    expect(q.result.totalMinor).toBe(59_270 + 4_612);
    expect(q.result.depositMinor).toBe(10_000);
    // Hatchback 11.69 m² × 25 = 292.25, + 20 min for the inspection = 312.25 → 313 min.
    expect(q.labour.totalMin).toBe(313);
  });

  it('stops beyond the furthest travel band, saying so', () => {
    const q = priceFromSettings(
      settings,
      'USD',
      {
        sizeClass: 'small',
        condition: 'light',
        serviceIds: ['wash'],
        chips: 0,
        addOnIds: [],
        distanceKm: 60,
      },
      'van',
    );
    expect(q.result.ok).toBe(false);
    expect(q.result.reasons.map((r) => r.code)).toContain('beyond-travel-bands');
  });

  it('names the choice that is not in the settings', () => {
    const bad = () =>
      priceFromSettings(
        settings,
        'USD',
        {
          sizeClass: 'small',
          condition: 'light',
          serviceIds: ['wash', 'wax'],
          chips: 0,
          addOnIds: [],
        },
        'sedan',
      );
    expect(bad).toThrow(expect.objectContaining({ field: 'inputs.serviceIds.1', rule: 'one-of' }));
    try {
      bad();
    } catch (e) {
      expect(isInputError(e)).toBe(true);
    }
  });

  it('refuses a band and a distance together, and a band that is not one of the settings', () => {
    const base = { sizeClass: 'small', condition: 'light', serviceIds: [], chips: 1, addOnIds: [] };
    expect(() =>
      priceFromSettings(settings, 'USD', { ...base, travelBand: 25, distanceKm: 3 }, 'sedan'),
    ).toThrow(expect.objectContaining({ field: 'inputs.travelBand', rule: 'consistent' }));
    expect(() => priceFromSettings(settings, 'USD', { ...base, travelBand: 30 }, 'sedan')).toThrow(
      expect.objectContaining({ field: 'inputs.travelBand', rule: 'one-of' }),
    );
  });

  it('has no hourly rate for a quote of no labour', () => {
    const q = priceFromSettings(
      { ...settings, chipLabourMinutes: 0 },
      'USD',
      { sizeClass: 'small', condition: 'light', serviceIds: [], chips: 2, addOnIds: [] },
      'sedan',
    );
    expect(q.labour.totalMin).toBe(0);
    expect(q.effectiveHourlyMinor).toBeNull();
    expect(q.result.subtotalMinor).toBe(3_000);
  });

  it('reads basis points as the exact decimal percent', () => {
    expect(bpPercent(825)).toBe('8.25');
    expect(bpPercent(5)).toBe('0.05');
    expect(bpPercent(10_000)).toBe('100.00');
  });
});
