import { IsNumber, validateSync } from 'class-validator';
import { decimalPlaces, IsDecimalNumber } from './decimal';

class Sample {
  @IsDecimalNumber({ maxDecimalPlaces: 2 }, { message: 'amount must have at most 2 decimals' })
  amount: unknown;
}

class Library {
  @IsNumber({ maxDecimalPlaces: 2 })
  amount: unknown;
}

const check = (amount: unknown) =>
  validateSync(Object.assign(new Sample(), { amount })).map((e) => e.constraints);

describe('decimalPlaces', () => {
  it.each([
    [0, 0],
    [12, 0],
    [2.5, 1],
    [-0.25, 2],
    [1e-7, 7],
    [1.5e-7, 8],
    [3e-323, 323],
    [1e21, 0],
  ])('%p has %p', (n, places) => {
    expect(decimalPlaces(n)).toBe(places);
  });
});

describe('IsDecimalNumber', () => {
  it('refuses a number written with an exponent, where the library rule throws', () => {
    expect(() => validateSync(Object.assign(new Library(), { amount: 3e-323 }))).toThrow(TypeError);
    expect(check(3e-323)).toEqual([{ isNumber: 'amount must have at most 2 decimals' }]);
    expect(check(1e-7)).toHaveLength(1);
  });

  it('keeps the rule: up to the places allowed, finite numbers only', () => {
    expect(check(12.34)).toEqual([]);
    expect(check(-7)).toEqual([]);
    expect(check(12.345)).toHaveLength(1);
    expect(check(Number.NaN)).toHaveLength(1);
    expect(check(Infinity)).toHaveLength(1);
    expect(check('12')).toHaveLength(1);
  });
});
