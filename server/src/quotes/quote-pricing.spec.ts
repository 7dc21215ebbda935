import { defaultSettings } from '../businesses/default-settings';
import { bpPercent, priceFromSettings } from './quote-pricing';

describe('quote pricing from settings', () => {
  it('reads basis points as the exact decimal percent shared expects', () => {
    expect(bpPercent(825)).toBe('8.25');
    expect(bpPercent(5)).toBe('0.05');
    expect(bpPercent(2_000)).toBe('20.00');
    expect(bpPercent(10_000)).toBe('100.00');
  });

  it('prices a quote of the default settings, its lines adding up to the subtotal', () => {
    const priced = priceFromSettings(
      defaultSettings(),
      'USD',
      {
        sizeClass: 'large',
        condition: 'moderate',
        serviceIds: ['wash', 'one-step'],
        chips: 3,
        addOnIds: ['trim'],
        travelBand: 25,
        discount: { kind: 'fixed', amountMinor: 1_000 },
      },
      'sedan',
    );
    const sum = priced.lines.reduce((a, l) => a + l.amountMinor, 0);
    expect(sum).toBe(priced.result.subtotalMinor);
    expect(priced.lines.map((l) => l.kind)).toEqual([
      'service',
      'service',
      'per-chip',
      'add-on',
      'travel',
      'discount',
    ]);
    expect(priced.labourHours).toBeGreaterThan(0);
  });

  it('names the input when an id is not in the settings', () => {
    expect(() =>
      priceFromSettings(
        defaultSettings(),
        'USD',
        { sizeClass: 'huge', condition: 'light', serviceIds: [], chips: 0, addOnIds: [] },
        'van',
      ),
    ).toThrow(
      expect.objectContaining({
        response: expect.objectContaining({
          details: [expect.objectContaining({ field: 'inputs.sizeClass' })],
        }),
      }),
    );
  });
});
