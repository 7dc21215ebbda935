import { ValidateIf } from 'class-validator';

/**
 * For change commands (last write wins per field): a field left out is not changed, and a
 * null is refused by the field's own rules. (`@IsOptional()` and `PartialType` would let a
 * null through to a NOT NULL column.)
 */
export const LeaveOut = () => ValidateIf((_: object, v: unknown) => v !== undefined);
