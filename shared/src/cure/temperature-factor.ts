// How much longer (or shorter) a flash or cure takes away from the data sheet's
// reference temperature.
//
// Q10 rule (common coatings practice): t₂ = t₁ · Q10^((T₁ − T₂)/10); with Q10 = 2 a cure
// that takes 60 min at 20 °C takes 120 min at 10 °C and 30 min at 30 °C.
// Arrhenius form, for comparison: t₂ = t₁ · exp[(Ea/R)(1/T₂ − 1/T₁)] (T in kelvin); with
// Ea ≈ 50 kJ/mol it gives ≈ ×1.97 per 10 °C around 20–30 °C.
import { finite, inRange, positive } from '../internal/validate';

export const DEFAULT_Q10 = 2;
/** Molar gas constant (J mol⁻¹ K⁻¹), exact since the 2019 SI redefinition. */
export const GAS_CONSTANT_J_PER_MOL_K = 8.314462618;
export const DEFAULT_ACTIVATION_ENERGY_J_PER_MOL = 50_000;
const KELVIN_OFFSET = 273.15;

/** Q10 must make colder slower, and stay in a plausible range. */
export function checkQ10(q10: unknown, field = 'q10'): number {
  return inRange(field, q10, 1, 10);
}

/**
 * Multiplier on a data-sheet time at `refC` for work at `tempC` (Q10 rule):
 * 2 at 10 °C below the reference with Q10 = 2, 0.5 at 10 °C above.
 */
export function q10TimeFactor(tempC: number, refC: number, q10: number = DEFAULT_Q10): number {
  const t = finite('tempC', tempC);
  const ref = finite('refC', refC);
  const q = checkQ10(q10);
  return Math.pow(q, (ref - t) / 10);
}

/** Multiplier on a data-sheet time at `refC` for work at `tempC` (Arrhenius form). */
export function arrheniusTimeFactor(
  tempC: number,
  refC: number,
  activationEnergyJPerMol: number = DEFAULT_ACTIVATION_ENERGY_J_PER_MOL,
): number {
  const tK = inRange('tempC', tempC, -KELVIN_OFFSET, 1000, { minExclusive: true }) + KELVIN_OFFSET;
  const refK = inRange('refC', refC, -KELVIN_OFFSET, 1000, { minExclusive: true }) + KELVIN_OFFSET;
  const ea = positive('activationEnergyJPerMol', activationEnergyJPerMol);
  return Math.exp((ea / GAS_CONSTANT_J_PER_MOL_K) * (1 / tK - 1 / refK));
}
