import { HttpStatus } from '@nestjs/common';
import {
  BASIS,
  checkCureProduct,
  reason,
  type CureProduct,
  type MaskingTape,
  type Reason,
  type SolventProduct,
} from '@panelpass/shared';
import { plainToInstance } from 'class-transformer';
import { validateSync, type ValidationError } from 'class-validator';
import { AppException } from '../common/app.exception';
import type { JsonObject } from '../database/synced.entity';
import { fromShared } from '../workspace/field';
import { PROPERTIES_BY_KIND, type ProductKind } from './dto/product.dto';
import type { Product } from './product.entity';

function flatten(
  errors: ValidationError[],
  prefix: string,
): { field: string; rules: Record<string, string> }[] {
  return errors.flatMap((e) => {
    const field = `${prefix}.${e.property}`;
    const own = e.constraints ? [{ field, rules: e.constraints }] : [];
    return [...own, ...flatten(e.children ?? [], field)];
  });
}

/**
 * Checks a product's properties against its kind (class-validator DTOs per kind) and
 * returns the clean object. `{}` means "not entered" and is always accepted.
 */
export function checkProperties(kind: ProductKind, raw: object | undefined): JsonObject {
  if (raw === undefined || Object.keys(raw).length === 0) return {};
  const dto = plainToInstance(PROPERTIES_BY_KIND[kind], raw);
  const errors = validateSync(dto, { whitelist: true, forbidNonWhitelisted: true });
  if (errors.length) {
    const details = flatten(errors, 'properties');
    throw new AppException(
      HttpStatus.BAD_REQUEST,
      'validation-failed',
      `properties of a ${kind}: ${details.flatMap((d) => Object.values(d.rules)).join('; ')}`,
      details,
    );
  }
  const clean = JSON.parse(JSON.stringify(dto)) as JsonObject;
  if (kind === 'touch-up' || kind === 'protection') {
    fromShared(() => checkCureProduct(clean as unknown as CureProduct, 'properties'));
  }
  return clean;
}

/**
 * Our own conservative default for a solvent whose data sheet dwell was not entered: three
 * minutes at 20 °C (many spot solvents state 3–5 minutes; the shorter end errs towards
 * flushing early). Shortened further for heat and sun by shared `flushBy`.
 */
export const DEFAULT_SOLVENT: SolventProduct = { maxDwellMin: 3 };

/**
 * Our own conservative default for tape whose clean-removal window was not entered: one day
 * (the data sheets of many automotive tapes state longer; the same day is always safe).
 */
export const DEFAULT_TAPE: MaskingTape = { cleanRemovalDays: 1 };

const has = (p: Product | null | undefined, key: string): boolean =>
  !!p && typeof p.properties === 'object' && p.properties !== null && key in p.properties;

/** The dwell properties of a solvent, or the default with a reason saying so. */
export function solventProperties(product: Product | null | undefined): {
  product: SolventProduct;
  reasons: Reason<'solvent-dwell-default'>[];
} {
  if (product && has(product, 'maxDwellMin')) {
    return { product: product.properties as unknown as SolventProduct, reasons: [] };
  }
  return {
    product: DEFAULT_SOLVENT,
    reasons: [
      reason(
        'solvent-dwell-default',
        'warn',
        `${product ? `"${product.name}" has` : 'No product named, so there is'} no maximum dwell entered: ${DEFAULT_SOLVENT.maxDwellMin} min was used. Enter the dwell from the product's data sheet on the Shelf.`,
        BASIS.ourOwnRule,
      ),
    ],
  };
}

/** The clean-removal window of a tape, or the default with a reason saying so. */
export function tapeProperties(product: Product | null | undefined): {
  tape: MaskingTape;
  reasons: Reason<'tape-window-default'>[];
} {
  if (product && has(product, 'cleanRemovalDays')) {
    return { tape: product.properties as unknown as MaskingTape, reasons: [] };
  }
  return {
    tape: DEFAULT_TAPE,
    reasons: [
      reason(
        'tape-window-default',
        'warn',
        `${product ? `"${product.name}" has` : 'No tape named, so there is'} no clean-removal window entered: remove it within ${DEFAULT_TAPE.cleanRemovalDays} day. Enter the window from the tape's data sheet on the Shelf.`,
        BASIS.ourOwnRule,
      ),
    ],
  };
}

/** The cure properties of a touch-up paint or coating; null when none were entered. */
export function cureProperties(product: Product | null | undefined): CureProduct | null {
  return product && has(product, 'flashMinAtRef')
    ? (product.properties as unknown as CureProduct)
    : null;
}
