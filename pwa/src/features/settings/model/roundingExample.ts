import {
  currencyDigits,
  fraction,
  fractionText,
  roundFraction,
  type RoundingMode,
} from '@panelpass/shared';

/** One amount's tax at a rate, exactly and rounded each way (shared's rounding). */
export interface RoundingExample {
  amountMinor: number;
  /** The exact tax in major units, as a decimal ("1.105"). */
  exactTax: string;
  halfUpMinor: number;
  halfEvenMinor: number;
  /**
   * `differs`: the two modes give different tax on this amount; `half-agrees`: the tax lands
   * exactly on half a minor unit but both modes round it the same way; `never-half`: at this
   * rate no amount's tax ever lands exactly on half a minor unit, so the modes always agree.
   */
  kind: 'differs' | 'half-agrees' | 'never-half';
}

const FROM_MINOR = 1_000; // search from 10.00 of a two-decimal currency
const SPAN = 40_000;

function exampleAt(amountMinor: number, rateBp: number, digits: number): RoundingExample {
  const exactMinor = fraction(BigInt(amountMinor) * BigInt(rateBp), 10_000n);
  const exactMajor = fraction(exactMinor.num, exactMinor.den * 10n ** BigInt(digits));
  return {
    amountMinor,
    exactTax: fractionText(exactMajor),
    halfUpMinor: Number(roundFraction(exactMinor, 'half-up')),
    halfEvenMinor: Number(roundFraction(exactMinor, 'half-even')),
    kind: 'never-half',
  };
}

/**
 * A worked example of the rounding modes at the business's own tax rate: the first amount
 * from 10.00 up whose tax is exactly half a minor unit over an even one, so half-up and
 * half-even part ways; failing that, one whose tax is exactly a half at all; failing that
 * (at 8 %, no amount ever lands on a half), an ordinary amount.
 */
export function roundingExample(rateBp: number, currency: string): RoundingExample {
  const digits = currencyDigits(currency);
  const rate = BigInt(rateBp);
  let half: number | null = null;
  if (rateBp > 0) {
    for (let a = FROM_MINOR; a < FROM_MINOR + SPAN; a += 1) {
      const taxTimes10k = BigInt(a) * rate;
      if (taxTimes10k % 20_000n === 5_000n)
        return { ...exampleAt(a, rateBp, digits), kind: 'differs' };
      if (half === null && taxTimes10k % 10_000n === 5_000n) half = a;
    }
  }
  if (half !== null) return { ...exampleAt(half, rateBp, digits), kind: 'half-agrees' };
  return exampleAt(1_234, rateBp, digits);
}

/** The one-line explanation of each rounding mode. */
export const ROUNDING_WORDS: Record<RoundingMode, { title: string; line: string }> = {
  'half-up': {
    title: 'Half up',
    line: 'Half a cent or more goes up to the next cent; less than half goes down.',
  },
  'half-even': {
    title: 'Half to even',
    line: 'Exactly half a cent goes to whichever cent is even; anything else to the nearest cent.',
  },
};
