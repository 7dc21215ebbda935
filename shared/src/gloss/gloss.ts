// Gloss: which geometry to measure at, the haze index, and the improvement before/after.
//
// ISO 2813:2014 / ASTM D523: measure at 60° first; above 70 GU use 20° (high gloss);
// below 10 GU use 85° (low gloss); exactly 10 or 70 stays at 60°. 100 GU is polished
// black glass (n = 1.567).
// ASTM D4039: haze index H = G60 − G20, valid only for high-gloss finishes (G60 > 70).
import { InputError } from '../errors';
import { nonNegative } from '../internal/validate';
import { Reason, reason } from '../reasons';
import { fixed } from '../internal/format';

export type GlossGeometry = 20 | 60 | 85;

export type GeometryReasonCode = 'high-gloss-use-20' | 'low-gloss-use-85' | 'mid-gloss-stay-60';

export interface GeometryChoice {
  readonly geometryDeg: GlossGeometry;
  readonly reasons: readonly Reason<GeometryReasonCode>[];
}

const ISO_2813 = 'ISO 2813 / ASTM D523';

/** Which geometry to use, from the first reading at 60°. */
export function chooseGeometry(g60Gu: number): GeometryChoice {
  const g60 = nonNegative('g60Gu', g60Gu);
  if (g60 > 70) {
    return {
      geometryDeg: 20,
      reasons: [
        reason(
          'high-gloss-use-20',
          'info',
          `60° reads ${fixed(g60, 1)} GU, above 70: measure at 20°.`,
          ISO_2813,
        ),
      ],
    };
  }
  if (g60 < 10) {
    return {
      geometryDeg: 85,
      reasons: [
        reason(
          'low-gloss-use-85',
          'info',
          `60° reads ${fixed(g60, 1)} GU, below 10: measure at 85°.`,
          ISO_2813,
        ),
      ],
    };
  }
  return {
    geometryDeg: 60,
    reasons: [
      reason(
        'mid-gloss-stay-60',
        'info',
        `60° reads ${fixed(g60, 1)} GU, within 10–70: stay at 60°.`,
        ISO_2813,
      ),
    ],
  };
}

export type HazeReasonCode = 'haze-needs-high-gloss';

export interface HazeResult {
  readonly valid: boolean;
  /** G60 − G20 (GU); null when not valid. */
  readonly hazeIndex: number | null;
  readonly reasons: readonly Reason<HazeReasonCode>[];
}

export function hazeIndex(g60Gu: number, g20Gu: number): HazeResult {
  const g60 = nonNegative('g60Gu', g60Gu);
  const g20 = nonNegative('g20Gu', g20Gu);
  if (!(g60 > 70)) {
    return {
      valid: false,
      hazeIndex: null,
      reasons: [
        reason(
          'haze-needs-high-gloss',
          'info',
          `Haze index needs a high-gloss finish (60° above 70 GU); this reads ${fixed(g60, 1)} GU.`,
          'ASTM D4039',
        ),
      ],
    };
  }
  return { valid: true, hazeIndex: g60 - g20, reasons: [] };
}

/** One gloss-meter reading; a three-angle meter fills all three. */
export interface GlossReading {
  readonly g20Gu?: number;
  readonly g60Gu: number;
  readonly g85Gu?: number;
}

export type ImprovementReasonCode = 'compared-at-60' | 'gloss-lower-after' | HazeReasonCode;

export interface GlossImprovement {
  readonly geometryDeg: GlossGeometry;
  readonly beforeGu: number;
  readonly afterGu: number;
  readonly absoluteGu: number;
  /** Change relative to before (%); null when before is 0. */
  readonly percent: number | null;
  /** Haze index before and after and their change (negative = less haze); null where not valid. */
  readonly haze: {
    readonly before: number | null;
    readonly after: number | null;
    readonly change: number | null;
  };
  readonly reasons: readonly Reason<ImprovementReasonCode>[];
}

function atGeometry(r: GlossReading, g: GlossGeometry): number | undefined {
  return g === 20 ? r.g20Gu : g === 85 ? r.g85Gu : r.g60Gu;
}

/**
 * Improvement from before to after correction, at the geometry ISO 2813 gives for the
 * glossier of the two 60° readings (both must have it), else at 60°.
 */
export function glossImprovement(before: GlossReading, after: GlossReading): GlossImprovement {
  const check = (r: GlossReading, name: string) => {
    nonNegative(`${name}.g60Gu`, r.g60Gu);
    if (r.g20Gu !== undefined) nonNegative(`${name}.g20Gu`, r.g20Gu);
    if (r.g85Gu !== undefined) nonNegative(`${name}.g85Gu`, r.g85Gu);
  };
  if (typeof before !== 'object' || before === null)
    throw new InputError('before', 'finite', 'before is missing');
  if (typeof after !== 'object' || after === null)
    throw new InputError('after', 'finite', 'after is missing');
  check(before, 'before');
  check(after, 'after');
  const reasons: Reason<ImprovementReasonCode>[] = [];
  const preferred = chooseGeometry(Math.max(before.g60Gu, after.g60Gu)).geometryDeg;
  let geometryDeg: GlossGeometry = preferred;
  let beforeGu = atGeometry(before, preferred);
  let afterGu = atGeometry(after, preferred);
  if (beforeGu === undefined || afterGu === undefined) {
    geometryDeg = 60;
    beforeGu = before.g60Gu;
    afterGu = after.g60Gu;
    reasons.push(
      reason(
        'compared-at-60',
        'info',
        `ISO 2813 would compare at ${preferred}°, but both readings don't have it: compared at 60°.`,
        ISO_2813,
      ),
    );
  }
  const absoluteGu = afterGu - beforeGu;
  const percent = beforeGu === 0 ? null : (absoluteGu / beforeGu) * 100;
  if (absoluteGu < 0) {
    reasons.push(
      reason(
        'gloss-lower-after',
        'warn',
        `Gloss is ${fixed(-absoluteGu, 1)} GU lower after than before at ${geometryDeg}°.`,
      ),
    );
  }
  const hazeOf = (r: GlossReading) =>
    r.g20Gu === undefined ? null : hazeIndex(r.g60Gu, r.g20Gu).hazeIndex;
  const hBefore = hazeOf(before);
  const hAfter = hazeOf(after);
  return {
    geometryDeg,
    beforeGu,
    afterGu,
    absoluteGu,
    percent,
    haze: {
      before: hBefore,
      after: hAfter,
      change: hBefore === null || hAfter === null ? null : hAfter - hBefore,
    },
    reasons,
  };
}
