import { taxMinor } from '@panelpass/shared';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  formatBp,
  formatMoney,
  moneyOrNull,
  parseDecimalNumber,
  parseMoney,
  parsePercentBp,
  type Typed,
} from './typedNumbers';

const value = <T>(t: Typed<T>): T | string => (t.ok ? t.value : `problem: ${t.problem}`);

describe('money typed in major units becomes exact minor units', () => {
  it('reads 19.99 as 1999 and amounts whose float product drifts exactly', () => {
    // 19.99 × 100, 4.35 × 100 and 1.15 × 100 are 1998.9999…, 434.99999… and 114.99999… in
    // binary floating point; the digits typed must be the cents kept.
    expect(value(parseMoney('19.99', 'USD'))).toBe(1999);
    expect(value(parseMoney('4.35', 'USD'))).toBe(435);
    expect(value(parseMoney('1.15', 'USD'))).toBe(115);
    expect(value(parseMoney('0.07', 'USD'))).toBe(7);
  });

  it('0.1 and 0.2 add up to exactly 0.30', () => {
    expect(0.1 + 0.2).not.toBe(0.3); // the trap this avoids
    const a = parseMoney('0.1', 'USD');
    const b = parseMoney('0.2', 'USD');
    expect(a.ok && b.ok && a.value + b.value).toBe(30);
    expect(formatMoney(30, 'USD')).toBe('0.30');
    expect(value(parseMoney(formatMoney(30, 'USD'), 'USD'))).toBe(30);
  });

  it('takes a comma for the decimals or for thousands, as written', () => {
    expect(value(parseMoney('19,99', 'EUR'))).toBe(1999);
    expect(value(parseMoney('0,5', 'EUR'))).toBe(50);
    expect(value(parseMoney('1,250', 'USD'))).toBe(125_000);
    expect(value(parseMoney('1,250.50', 'USD'))).toBe(125_050);
    expect(value(parseMoney('1.250,50', 'EUR'))).toBe(125_050);
    expect(value(parseMoney('1 250,50', 'EUR'))).toBe(125_050);
    expect(value(parseMoney('12,34,5', 'USD'))).toMatch(/^problem: An amount in USD/);
  });

  it("takes the currency's own mark and spaces around it", () => {
    expect(value(parseMoney('$19.99', 'USD'))).toBe(1999);
    expect(value(parseMoney(' 19.99 USD ', 'USD'))).toBe(1999);
    expect(value(parseMoney('€7', 'EUR'))).toBe(700);
  });

  it('refuses more decimals than the currency has, rather than rounding them away', () => {
    expect(value(parseMoney('1.005', 'USD'))).toBe('problem: At most 2 decimals, like 19.99.');
    expect(value(parseMoney('1500', 'JPY'))).toBe(1500);
    expect(value(parseMoney('1500.5', 'JPY'))).toBe('problem: Whole JPY only, like 1999.');
  });

  it('refuses empty, negative, words and amounts beyond the limit, in words', () => {
    expect(value(parseMoney('', 'USD'))).toBe('problem: Enter an amount, like 19.99.');
    expect(value(parseMoney('-5', 'USD'))).toBe('problem: An amount cannot be below zero.');
    expect(value(parseMoney('ten', 'USD'))).toMatch(/^problem: An amount in USD/);
    expect(value(parseMoney('1000000.00', 'USD'))).toBe(100_000_000);
    expect(value(parseMoney('1000000.01', 'USD'))).toBe('problem: At most 1000000.00 USD.');
  });

  it('any amount in cents survives being shown and read back', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 100_000_000 }), (cents) => {
        expect(value(parseMoney(formatMoney(cents, 'USD'), 'USD'))).toBe(cents);
      }),
    );
  });

  it('shows minor units with the currency digits and no thousands marks', () => {
    expect(formatMoney(1999, 'USD')).toBe('19.99');
    expect(formatMoney(5, 'USD')).toBe('0.05');
    expect(formatMoney(123_456_700, 'USD')).toBe('1234567.00');
    expect(formatMoney(1999, 'JPY')).toBe('1999');
  });
});

describe('amounts typed at handover and on a job (a form that words its own problem)', () => {
  it('reads money as minor units and refuses anything else', () => {
    expect(moneyOrNull('45', 'USD')).toBe(4500);
    expect(moneyOrNull('1,045.5', 'USD')).toBe(104_550);
    expect(moneyOrNull('0.05', 'USD')).toBe(5);
    expect(moneyOrNull('4.555', 'USD')).toBeNull();
    expect(moneyOrNull('-3', 'USD')).toBeNull();
    expect(moneyOrNull('', 'USD')).toBeNull();
    expect(formatMoney(104_550, 'USD')).toBe('1045.50');
    expect(formatMoney(5, 'USD')).toBe('0.05');
  });
});

describe('percentages become whole basis points', () => {
  it('reads 8.25, 8,25 and 8.25 % as 825, exactly', () => {
    expect(value(parsePercentBp('8.25'))).toBe(825);
    expect(value(parsePercentBp('8,25'))).toBe(825);
    expect(value(parsePercentBp('8.25 %'))).toBe(825);
    expect(value(parsePercentBp('0.29'))).toBe(29); // 0.29 × 100 is 28.999… in floats
    expect(value(parsePercentBp('100'))).toBe(10_000);
  });

  it('refuses more than two decimals, over 100 % and words', () => {
    const words = 'problem: A percentage from 0 to 100, like 8.25 (two decimals at most).';
    expect(value(parsePercentBp('8.255'))).toBe(words);
    expect(value(parsePercentBp('100.01'))).toBe(words);
    expect(value(parsePercentBp('-1'))).toBe(words);
    expect(value(parsePercentBp(''))).toBe(words);
  });

  it('shows basis points as the percentage typed, and the tax of shared agrees with it', () => {
    expect(formatBp(825)).toBe('8.25');
    expect(formatBp(800)).toBe('8');
    expect(formatBp(850)).toBe('8.5');
    expect(formatBp(5)).toBe('0.05');
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000 }), (bp) => {
        expect(value(parsePercentBp(formatBp(bp)))).toBe(bp);
        // 10 000.00 at bp basis points is exactly bp × 100 cents in shared's pricing.
        expect(taxMinor(1_000_000, formatBp(bp))).toBe(bp * 100);
      }),
    );
  });
});

describe('plain decimals keep the rule the server checks', () => {
  const factor = { min: 0.01, max: 20, decimals: 4, what: 'A factor', like: '1.15' };
  it('takes a dot or a comma, within range and precision', () => {
    expect(value(parseDecimalNumber('1,15', factor))).toBe(1.15);
    expect(value(parseDecimalNumber('1.2500', factor))).toBe(1.25);
    expect(value(parseDecimalNumber('1.23456', factor))).toBe(
      'problem: A factor from 0.01 to 20, like 1.15 (4 decimals at most).',
    );
    expect(value(parseDecimalNumber('0', factor))).toMatch(/^problem: A factor from 0.01 to 20/);
    expect(
      value(
        parseDecimalNumber('-63.5', {
          min: -180,
          max: 180,
          decimals: 7,
          what: 'A longitude',
          like: '1',
        }),
      ),
    ).toBe(-63.5);
    expect(
      value(parseDecimalNumber('6.5', { min: 1, max: 60, decimals: 0, what: 'Months', like: '6' })),
    ).toBe('problem: Months from 1 to 60, like 6 (a whole number).');
  });
});
