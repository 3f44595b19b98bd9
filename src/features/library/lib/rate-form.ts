/** The rate row's form: RateCreateSchema with the price and minimum typed in dollars and sent as cents. */
import { z } from 'zod';
import { RateCreateSchema } from '../../../../shared/schemas/library';
import { BASIS_UNITS, type RateBasis } from '../../../../shared/domain/service-rates';
import { dollarsField, centsToDollarsText } from './material-forms';
import type { RateDto } from './types';

/** The minimum charge: an empty box is no minimum (sent as 0 so that a saved minimum can be removed). */
const minimumField = z
  .string()
  .trim()
  .transform((text) => (text === '' ? '0' : text))
  .pipe(dollarsField('Minimum charge', RateCreateSchema.shape.minimumCents.unwrap()));

export const RateFormSchema = RateCreateSchema.extend({
  unitPriceCents: dollarsField('Price', RateCreateSchema.shape.unitPriceCents),
  minimumCents: minimumField,
});

export const RATE_FORM_FIELDS = ['name', 'category', 'basis', 'unitPriceCents', 'minimumCents'];

export const CATEGORY_LABELS = { labor: 'Labor', equipment: 'Equipment', fees: 'Fees' } as const;
export const BASIS_LABELS: Record<RateBasis, string> = { 'per-acre': 'per acre', 'per-hour': 'per hour', 'per-each': 'each', 'per-100-ft': 'per 100 ft' };

/** The row's starting values. */
export function rateFormDefaults(rate?: RateDto): z.input<typeof RateFormSchema> {
  return {
    name: rate?.name ?? '',
    category: rate?.category ?? 'labor',
    basis: rate?.basis ?? 'per-hour',
    unitPriceCents: centsToDollarsText(rate?.unitPriceCents),
    minimumCents: rate?.minimumCents ? centsToDollarsText(rate.minimumCents) : '',
  };
}

/** "$48.00 / hour". */
export const unitOf = (basis: RateBasis): string => BASIS_UNITS[basis];
