/**
 * Every computation answers with its result and the reasons behind it, in plain detailer
 * words, so the app can show "why" next to the number.
 *
 * - `stop`: the plan must not go ahead (the result's `ok` is false).
 * - `warn`: it may go ahead, but the detailer should know (a limit is near, a rule of
 *   thumb was used, a reading was missing).
 * - `info`: a note on how the answer was reached.
 *
 * `code` is a stable string the app may match on; `message` is English text for people
 * and may change wording at any time.
 */
export type Severity = 'stop' | 'warn' | 'info';

export interface Reason<Code extends string = string> {
  readonly code: Code;
  readonly severity: Severity;
  readonly message: string;
  /**
   * Where the rule comes from: a standard (e.g. `ISO 8502-4`), `common practice, no
   * published source`, `our own rule`, or the user's own setting.
   */
  readonly basis?: string;
}

/** Labels for `Reason.basis` used across the package. */
export const BASIS = {
  commonPractice: 'common practice, no published source',
  ourOwnRule: 'our own rule',
  userSetting: 'your setting',
  productSheet: "the product's data sheet",
} as const;

export function reason<Code extends string>(
  code: Code,
  severity: Severity,
  message: string,
  basis?: string,
): Reason<Code> {
  return basis === undefined ? { code, severity, message } : { code, severity, message, basis };
}

/** True when none of the reasons stops the plan. */
export function noStops(reasons: readonly Reason[]): boolean {
  return reasons.every((r) => r.severity !== 'stop');
}
