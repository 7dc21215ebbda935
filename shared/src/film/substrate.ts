// Is a gauge reading valid on this panel's substrate?
//
// ASTM D7091-22: magnetic gauges measure non-magnetic coatings on steel (ferrous);
// eddy-current gauges measure non-conductive coatings on non-ferrous metal (aluminium).
// On plastic and composite panels neither works: those need an ultrasonic gauge
// (ASTM D6132). A magnetic or eddy-current number logged on a plastic bumper is not a
// film thickness and must not be used.
import { oneOf } from '../internal/validate';
import { Reason, reason } from '../reasons';

export type Substrate = 'steel' | 'aluminium' | 'plastic' | 'composite' | 'unknown';
export const SUBSTRATES: readonly Substrate[] = [
  'steel',
  'aluminium',
  'plastic',
  'composite',
  'unknown',
];

/** `magnetic-eddy` is a combined gauge that picks its mode on metal. */
export type GaugeKind = 'magnetic' | 'eddy-current' | 'magnetic-eddy' | 'ultrasonic';
export const GAUGE_KINDS: readonly GaugeKind[] = [
  'magnetic',
  'eddy-current',
  'magnetic-eddy',
  'ultrasonic',
];

export type GaugeValidity = 'valid' | 'not-valid' | 'unknown';

export type SubstrateReasonCode =
  | 'magnetic-gauge-needs-steel'
  | 'eddy-current-gauge-needs-non-ferrous-metal'
  | 'metal-gauge-on-non-metal'
  | 'ultrasonic-on-metal'
  | 'substrate-unknown';

export interface GaugeCheck {
  readonly validity: GaugeValidity;
  readonly reasons: readonly Reason<SubstrateReasonCode>[];
}

const D7091 = 'ASTM D7091';
const D6132 = 'ASTM D6132';

export function checkGaugeOnSubstrate(gauge: GaugeKind, substrate: Substrate): GaugeCheck {
  const g = oneOf('gauge', gauge, GAUGE_KINDS);
  const s = oneOf('substrate', substrate, SUBSTRATES);
  if (s === 'unknown') {
    return {
      validity: 'unknown',
      reasons: [
        reason(
          'substrate-unknown',
          'warn',
          "Panel substrate not set: the reading can't be checked. A magnet sticks to steel, not to aluminium or plastic.",
        ),
      ],
    };
  }
  const metal = s === 'steel' || s === 'aluminium';
  if (g === 'ultrasonic') {
    return metal
      ? {
          validity: 'valid',
          reasons: [
            reason(
              'ultrasonic-on-metal',
              'info',
              'Ultrasonic reading on metal: a magnetic or eddy-current gauge is the usual check here.',
              D7091,
            ),
          ],
        }
      : { validity: 'valid', reasons: [] };
  }
  if (!metal) {
    return {
      validity: 'not-valid',
      reasons: [
        reason(
          'metal-gauge-on-non-metal',
          'stop',
          `A ${g === 'magnetic' ? 'magnetic' : g === 'eddy-current' ? 'eddy-current' : 'magnetic/eddy-current'} gauge can't measure paint on ${s}: this reading is not valid. Use an ultrasonic gauge.`,
          `${D7091}; ${D6132}`,
        ),
      ],
    };
  }
  if (g === 'magnetic' && s === 'aluminium') {
    return {
      validity: 'not-valid',
      reasons: [
        reason(
          'magnetic-gauge-needs-steel',
          'stop',
          'A magnetic gauge only measures on steel; this panel is aluminium. Use an eddy-current gauge.',
          D7091,
        ),
      ],
    };
  }
  if (g === 'eddy-current' && s === 'steel') {
    return {
      validity: 'not-valid',
      reasons: [
        reason(
          'eddy-current-gauge-needs-non-ferrous-metal',
          'stop',
          'An eddy-current gauge measures on aluminium and other non-ferrous metal; this panel is steel. Use a magnetic gauge.',
          D7091,
        ),
      ],
    };
  }
  return { validity: 'valid', reasons: [] };
}
