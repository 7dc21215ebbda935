import { describe, expect, it } from 'vitest';
import { GaugeKind, Substrate, checkGaugeOnSubstrate } from './substrate';

describe('gauge on substrate (ASTM D7091-22 for metal, ASTM D6132 ultrasonic for plastic/composite)', () => {
  it.each<[GaugeKind, Substrate, string]>([
    ['magnetic', 'steel', 'valid'],
    ['magnetic-eddy', 'steel', 'valid'],
    ['eddy-current', 'aluminium', 'valid'],
    ['magnetic-eddy', 'aluminium', 'valid'],
    ['ultrasonic', 'plastic', 'valid'],
    ['ultrasonic', 'composite', 'valid'],
    ['magnetic', 'plastic', 'not-valid'],
    ['eddy-current', 'plastic', 'not-valid'],
    ['magnetic-eddy', 'composite', 'not-valid'],
    ['magnetic', 'aluminium', 'not-valid'],
    ['eddy-current', 'steel', 'not-valid'],
    ['magnetic', 'unknown', 'unknown'],
  ])('%s gauge on %s → %s', (gauge, substrate, validity) => {
    expect(checkGaugeOnSubstrate(gauge, substrate).validity).toBe(validity);
  });

  it('says plainly why a metal gauge on a plastic bumper is not a reading', () => {
    const check = checkGaugeOnSubstrate('magnetic', 'plastic');
    expect(check.reasons[0]).toMatchObject({ code: 'metal-gauge-on-non-metal', severity: 'stop' });
    expect(check.reasons[0]?.message).toContain('Use an ultrasonic gauge');
  });

  it('refuses unknown gauges and substrates', () => {
    expect(() => checkGaugeOnSubstrate('laser' as GaugeKind, 'steel')).toThrow(
      expect.objectContaining({ field: 'gauge' }),
    );
    expect(() => checkGaugeOnSubstrate('magnetic', 'wood' as Substrate)).toThrow(
      expect.objectContaining({ field: 'substrate', rule: 'one-of' }),
    );
  });
});
