/**
 * Form schemas for materials, one per kind: the matching branch of MaterialCreateSchema with its
 * money fields typed in dollars (text) and sent as integer cents, so the form's output is exactly
 * what the API takes.
 */
import { z } from 'zod';
import { MaterialCreateSchema, type MaterialDto, type MaterialKind } from '../../../../shared/schemas/library';
import { DomainValidationError } from '../../../../shared/domain/errors';
import { parseDollarsToCents } from '../../../../shared/domain/money';
import { formatGrade } from '../../../../shared/domain/fertilizer';

const [SeedBranch, LimeBranch, FertilizerBranch, HerbicideBranch, OtherBranch] = MaterialCreateSchema.options;

/** A dollar amount typed as text ("1,234.56", "$75") and checked as the cents field it becomes. */
export function dollarsField(label: string, cents: z.ZodType<number, number>) {
  return z
    .string({ message: `Enter the ${label.toLowerCase()} in dollars` })
    .trim()
    .min(1, { message: `Enter the ${label.toLowerCase()} in dollars` })
    .transform((text, ctx) => {
      try {
        return parseDollarsToCents(text, label);
      } catch (error) {
        ctx.addIssue({ code: 'custom', message: error instanceof DomainValidationError ? error.message : `${label} is not a dollar amount.` });
        return z.NEVER;
      }
    })
    .pipe(cents);
}

const [LimePerTon, LimeBag] = LimeBranch.shape.pricing.options;
const [SprayPerGal, SprayContainer] = HerbicideBranch.shape.pricing.options;

export const SeedFormSchema = SeedBranch.extend({ packagePriceCents: dollarsField('Package price', SeedBranch.shape.packagePriceCents) });
export const LimeFormSchema = LimeBranch.extend({
  pricing: z.discriminatedUnion('basis', [
    LimePerTon.extend({ pricePerTonCents: dollarsField('Price per ton', LimePerTon.shape.pricePerTonCents) }),
    LimeBag.extend({ bagPriceCents: dollarsField('Bag price', LimeBag.shape.bagPriceCents) }),
  ]),
});
export const FertilizerFormSchema = FertilizerBranch.extend({ bagPriceCents: dollarsField('Bag price', FertilizerBranch.shape.bagPriceCents) });
export const HerbicideFormSchema = HerbicideBranch.extend({
  pricing: z.discriminatedUnion('basis', [
    SprayPerGal.extend({ pricePerGalCents: dollarsField('Price per gallon', SprayPerGal.shape.pricePerGalCents) }),
    SprayContainer.extend({ containerPriceCents: dollarsField('Container price', SprayContainer.shape.containerPriceCents) }),
  ]),
});
export const OtherFormSchema = OtherBranch.extend({ packPriceCents: dollarsField('Pack price', OtherBranch.shape.packPriceCents) });

/** Every field name a kind's form has, for placing server errors (`details[].path`) beside them. */
export const MATERIAL_FORM_FIELDS: Record<MaterialKind, string[]> = {
  seed: ['name', 'species', 'purityPct', 'germinationPct', 'dormantPct', 'rateLbPerAcre', 'packageSizeLb', 'packagePriceCents'],
  lime: ['name', 'enmLbPerTon', 'pricing.basis', 'pricing.pricePerTonCents', 'pricing.bagSizeLb', 'pricing.bagPriceCents', 'pricing'],
  fertilizer: ['name', 'grade', 'bagSizeLb', 'bagPriceCents'],
  herbicide: ['name', 'activeIngredient', 'lbAiPerGal', 'restrictedUse', 'adjuvant', 'rateLbAiPerAcre', 'carrierGpa', 'plantBackDays', 'epaRegNo', 'pricing.basis', 'pricing.pricePerGalCents', 'pricing.containerSizeGal', 'pricing.containerPriceCents', 'pricing'],
  other: ['name', 'itemLabel', 'packSize', 'packLabel', 'packPriceCents'],
};

/** Integer cents as the dollars a person types ("32.00"). */
export function centsToDollarsText(cents: number | undefined): string {
  if (cents === undefined) return '';
  const abs = Math.abs(cents);
  return `${cents < 0 ? '-' : ''}${Math.floor(abs / 100)}.${String(abs % 100).padStart(2, '0')}`;
}

/** A number box's value as the schema takes it: empty → undefined, otherwise the number (NaN for text, which the schema refuses). */
export const numberOrUndefined = (value: unknown): number | undefined => {
  if (value === '' || value === null || value === undefined) return undefined;
  if (typeof value === 'number') return value;
  const text = String(value).trim().replace(/,/g, '');
  return text === '' ? undefined : Number(text);
};

/** The form's starting values for a kind, from an existing material or blank. */
export function materialFormDefaults(kind: MaterialKind, m?: MaterialDto): Record<string, unknown> {
  switch (kind) {
    case 'seed': {
      const s = m?.type === 'seed' ? m : undefined;
      return { kind, name: s?.name ?? '', species: s?.species ?? '', purityPct: s?.purityPct, germinationPct: s?.germinationPct, dormantPct: s?.dormantPct, rateLbPerAcre: m?.rateLbPerAcre, packageSizeLb: s?.packageSizeLb, packagePriceCents: centsToDollarsText(s?.packagePriceCents) };
    }
    case 'lime': {
      const l = m?.type === 'lime' ? m : undefined;
      const pricing = l?.pricing.basis === 'bag' ? { basis: 'bag', bagSizeLb: l.pricing.bagSizeLb, bagPriceCents: centsToDollarsText(l.pricing.bagPriceCents) } : { basis: 'per-ton', pricePerTonCents: centsToDollarsText(l?.pricing.basis === 'per-ton' ? l.pricing.pricePerTonCents : undefined) };
      return { kind, name: l?.name ?? '', enmLbPerTon: l?.enmLbPerTon, pricing };
    }
    case 'fertilizer': {
      const f = m?.type === 'fertilizer' ? m : undefined;
      return { kind, name: f?.name ?? '', grade: f ? formatGrade(f.grade) : '', bagSizeLb: f?.bagSizeLb, bagPriceCents: centsToDollarsText(f?.bagPriceCents) };
    }
    case 'herbicide': {
      const h = m?.type === 'herbicide' || m?.type === 'adjuvant' ? m : undefined;
      const pricing =
        h?.pricing.basis === 'per-gal'
          ? { basis: 'per-gal', pricePerGalCents: centsToDollarsText(h.pricing.pricePerGalCents) }
          : { basis: 'container', containerSizeGal: h?.pricing.basis === 'container' ? h.pricing.containerSizeGal : undefined, containerPriceCents: centsToDollarsText(h?.pricing.basis === 'container' ? h.pricing.containerPriceCents : undefined) };
      return { kind, name: h?.name ?? '', activeIngredient: h?.activeIngredient ?? '', lbAiPerGal: h?.lbAiPerGal, restrictedUse: h?.restrictedUse ?? false, adjuvant: h?.type === 'adjuvant', rateLbAiPerAcre: m?.rateLbAiPerAcre, carrierGpa: m?.carrierGpa, plantBackDays: h?.type === 'herbicide' ? h.plantBackDays : undefined, epaRegNo: h?.epaRegNo ?? '', pricing };
    }
    case 'other': {
      const o = m?.type === 'item' ? m : undefined;
      return { kind, name: o?.name ?? '', itemLabel: o?.itemLabel ?? '', packSize: o?.packSize, packLabel: o?.packLabel ?? '', packPriceCents: centsToDollarsText(o?.packPriceCents) };
    }
  }
}
