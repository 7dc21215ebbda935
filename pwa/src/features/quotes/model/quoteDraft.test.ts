import { describe, expect, it } from 'vitest';
import { priceFromSettings, type PricingSettings } from '@panelpass/shared';
import { distanceFromBase, draftOfQuote, newDraft, priceDraft, readDraft } from './quoteDraft';
import { moneyOrNull, parsePercentBp } from '../../settings/model/typedNumbers';

// Invented demo settings.
const settings: PricingSettings = {
  services: [
    {
      id: 'wash',
      name: 'Hand wash',
      priceMinor: 6_000,
      labourMinutes: 4,
      labourPer: 'm2',
      step: 'wash',
    },
  ],
  sizeClasses: [
    { id: 'small', name: 'Small', factor: 0.9 },
    { id: 'medium', name: 'Medium', factor: 1 },
  ],
  conditions: [
    { id: 'heavy', name: 'Heavy', factor: 1.35 },
    { id: 'light', name: 'Light', factor: 1 },
  ],
  chipPriceMinor: 1_500,
  chipLabourMinutes: 10,
  addOns: [],
  travel: {
    bands: [
      { upToKm: 10, feeMinor: 0 },
      { upToKm: 25, feeMinor: 2_500 },
    ],
    taxable: true,
  },
  tax: { rateBp: 800, basis: 'per-invoice', rounding: 'half-up' },
  deposit: { kind: 'none' },
};

const ready = () => ({
  ...newDraft(settings, { customerId: 'c1', vehicleId: 'v1', distanceKm: 18.2 }),
  serviceIds: ['wash'],
});

describe('the quote form', () => {
  it('starts at the factor-1 size, the lightest condition, and the distance when it is known', () => {
    const d = newDraft(settings, { distanceKm: 18.2 });
    expect([d.sizeClass, d.condition, d.travel]).toEqual(['medium', 'light', 'distance']);
    expect(newDraft(settings, { distanceKm: null }).travel).toBe('band:10');
  });

  it('reads money in the currency’s minor units and percentages as basis points, refusing the rest', () => {
    expect(moneyOrNull('25', 'USD')).toBe(2_500);
    expect(moneyOrNull('25.5', 'USD')).toBe(2_550);
    expect(moneyOrNull('0,75', 'EUR')).toBe(75);
    expect(moneyOrNull('25.555', 'USD')).toBeNull();
    expect(moneyOrNull('1200', 'JPY')).toBe(1_200);
    expect(moneyOrNull('-3', 'USD')).toBeNull();
    const bp = (text: string) => {
      const read = parsePercentBp(text);
      return read.ok ? read.value : null;
    };
    expect(bp('12.5')).toBe(1_250);
    expect(bp('100')).toBe(10_000);
    expect(bp('100.01')).toBeNull();
    expect(bp('ten')).toBeNull();
  });

  it('says what is wrong, field by field, and gives no inputs until it is right', () => {
    const r = readDraft(
      {
        ...ready(),
        customerId: '',
        chips: '2.5',
        discountKind: 'fixed',
        discount: 'abc',
        visitDay: '2025-05-06',
      },
      'USD',
      18.2,
    );
    expect(r.inputs).toBeNull();
    expect(Object.keys(r.problems).sort()).toEqual(['chips', 'customerId', 'discount', 'visit']);
  });

  it('turns a right form into the server’s inputs, the offered visit in ISO', () => {
    const r = readDraft(
      {
        ...ready(),
        chips: '3',
        discountKind: 'percent',
        discount: '10',
        visitDay: '2025-05-06',
        visitFrom: '09:00',
        visitTo: '13:30',
        notes: '  Sap on the roof ',
      },
      'USD',
      18.2,
    );
    expect(r.inputs).toEqual({
      sizeClass: 'medium',
      condition: 'light',
      serviceIds: ['wash'],
      chips: 3,
      addOnIds: [],
      distanceKm: 18.2,
      discount: { kind: 'percent', percentBp: 1_000 },
      notes: 'Sap on the roof',
      windowStart: new Date('2025-05-06T09:00').toISOString(),
      windowEnd: new Date('2025-05-06T13:30').toISOString(),
    });
    // And back: the saved quote opens in the same form.
    const again = draftOfQuote(
      { customerId: 'c1', vehicleId: 'v1', inputs: r.inputs as unknown as Record<string, unknown> },
      settings,
      'USD',
    );
    expect(readDraft(again, 'USD', 18.2).inputs).toEqual(r.inputs);
  });

  it('prices the form with shared priceFromSettings, or says why it cannot', () => {
    const { inputs } = readDraft({ ...ready(), chips: '2' }, 'USD', 18.2);
    const shown = priceDraft(settings, 'USD', inputs, 'sedan');
    const shared = priceFromSettings(settings, 'USD', inputs!, 'sedan');
    expect(shown.kind === 'priced' && shown.quote.result.totalMinor).toBe(shared.result.totalMinor);
    // 6,000 + 2 × 1,500 + travel 2,500 (18.2 km), + 8 % = 12,420.
    expect(shared.result.totalMinor).toBe(12_420);
    const far = readDraft(ready(), 'USD', 40).inputs;
    expect(priceDraft(settings, 'USD', far, 'sedan')).toMatchObject({
      kind: 'not-priced',
      words: expect.stringContaining('beyond your furthest travel band'),
    });
    expect(priceDraft(settings, 'USD', inputs, null).kind).toBe('not-priced');
  });

  it('measures the straight-line distance from the base to one decimal, when both are known', () => {
    // One degree of latitude on the IUGG mean sphere: 6371.0088 × π / 180 = 111.195 km.
    expect(distanceFromBase({ lat: 44, lng: -124 }, { lat: 45, lng: -124 })).toBe(111.2);
    expect(distanceFromBase(null, { lat: 45, lng: -124 })).toBeNull();
    expect(distanceFromBase({ lat: 44, lng: -124 }, { lat: null, lng: null })).toBeNull();
  });
});
