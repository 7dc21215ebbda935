import { HttpStatus } from '@nestjs/common';
import {
  type BodyStyle,
  isInputError,
  priceFromSettings as priceWithShared,
  type SettingsQuote,
} from '@panelpass/shared';
import type { BusinessSettingsDto } from '../businesses/dto/business-settings.dto';
import { AppException } from '../common/app.exception';
import type { QuoteInputsDto } from './dto/quote.dto';

// The quote is priced by `priceFromSettings` of @panelpass/shared — the same function the
// phone prices it with while the owner builds it — so the stored totals are the ones the
// owner saw. This file only turns its refusals into the API's 400 naming the field.

export { bpPercent } from '@panelpass/shared';

export type PricedQuote = SettingsQuote;

function invalid(field: string, message: string): AppException {
  return new AppException(HttpStatus.BAD_REQUEST, 'validation-failed', message, [
    { field, rules: { known: message } },
  ]);
}

/** Prices a quote with @panelpass/shared; bad settings or inputs become a 400 naming the field. */
export function priceFromSettings(
  settings: BusinessSettingsDto,
  currency: string,
  inputs: QuoteInputsDto,
  bodyStyle: BodyStyle,
): PricedQuote {
  let priced: SettingsQuote;
  try {
    priced = priceWithShared(settings, currency, inputs, bodyStyle);
  } catch (e) {
    if (isInputError(e)) {
      throw invalid(e.field.startsWith('inputs.') ? e.field : `pricing.${e.field}`, e.message);
    }
    throw e;
  }
  if (!priced.result.ok) {
    const stop = priced.result.reasons.find((r) => r.severity === 'stop');
    throw invalid('inputs.distanceKm', stop?.message ?? 'This quote cannot be priced');
  }
  return priced;
}
