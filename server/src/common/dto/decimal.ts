import {
  buildMessage,
  isNumber,
  type IsNumberOptions,
  ValidateBy,
  type ValidationOptions,
} from 'class-validator';

/** Decimal places of a finite number in its shortest form: 2.5 → 1, 1e-7 → 7, 1.5e-7 → 8. */
export function decimalPlaces(n: number): number {
  if (!Number.isFinite(n) || Number.isInteger(n)) return 0;
  const [mantissa = '', exponent = '0'] = n.toString().toLowerCase().split('e');
  const fraction = mantissa.split('.')[1]?.length ?? 0;
  return Math.max(0, fraction - Number(exponent));
}

/**
 * class-validator's `IsNumber` with `maxDecimalPlaces`, minus its crash: its own check reads
 * the digits after a "." that a number written with an exponent (1e-7, 3e-323) does not have,
 * and throws — a 500 instead of a refusal. Same rule name (`isNumber`) and options.
 */
export function IsDecimalNumber(
  options: IsNumberOptions & { maxDecimalPlaces: number },
  validationOptions?: ValidationOptions,
): PropertyDecorator {
  const { maxDecimalPlaces, ...rest } = options;
  return ValidateBy(
    {
      name: 'isNumber',
      constraints: [options],
      validator: {
        validate: (value: unknown) =>
          isNumber(value, rest) && decimalPlaces(value) <= maxDecimalPlaces,
        defaultMessage: buildMessage(
          (each) => `${each}$property must be a number conforming to the specified constraints`,
          validationOptions,
        ),
      },
    },
    validationOptions,
  );
}
