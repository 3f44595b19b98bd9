/**
 * The practice library over the API: materials (flat, with a `kind`), service rates, practices,
 * and prescriptions. Materials convert to the domain's MaterialDefinition (shared/domain/practice.ts).
 */
import { RATE_CATEGORIES } from '../domain/service-rates';
import { z } from 'zod';
import { IsoDateSchema } from './common';
import { LIMITS } from '../limits';
import { UNIT_KINDS } from '../domain/unit-kinds';
import { WINDOW_KEYS } from '../domain/planting-windows';
import { CAUTION_IDS } from '../domain/cautions';
import { EPA_REG_NO_PATTERN, PLANT_BACK_MAX_DAYS, type MaterialDefinition, type PracticeDefinition } from '../domain/practice';

const name = z.string().trim().min(1, { message: 'enter a name' }).max(LIMITS.nameMax);
const cents = (label: string) => z.number({ message: `${label} must be a number of cents` }).int({ message: `${label} must be whole cents` }).min(0, { message: `${label} cannot be negative` }).max(100_000_000, { message: `${label} looks too large` });
const pct = (label: string) => z.number({ message: `${label} must be a number` }).min(0, { message: `${label} must be between 0 and 100` }).max(100, { message: `${label} must be between 0 and 100` });
const positive = (label: string, max: number, unit: string) =>
  z.number({ message: `${label} must be a number` }).positive({ message: `${label} must be more than 0` }).max(max, { message: `${label} above ${max} ${unit} is not plausible` });

export const MATERIAL_KINDS = ['seed', 'lime', 'fertilizer', 'herbicide', 'other'] as const;
export type MaterialKind = (typeof MATERIAL_KINDS)[number];

const GradeSchema = z
  .union([
    z.string().regex(/^\s*\d+(\.\d+)?\s*-\s*\d+(\.\d+)?\s*-\s*\d+(\.\d+)?\s*$/, { message: 'write the grade as N-P-K, like 13-13-13' }).transform((s) => {
      const [n, p, k] = s.split('-').map((x) => Number(x.trim()));
      return { nPct: n, p2o5Pct: p, k2oPct: k };
    }),
    z.object({ nPct: pct('N'), p2o5Pct: pct('P2O5'), k2oPct: pct('K2O') }),
  ])
  .refine((g) => g.nPct + g.p2o5Pct + g.k2oPct <= 100, { message: 'the grade’s N + P2O5 + K2O cannot add up to more than 100 %' })
  .refine((g) => g.nPct + g.p2o5Pct + g.k2oPct > 0, { message: 'the grade must contain some nutrient' });

const SprayPricingSchema = z.discriminatedUnion('basis', [
  z.object({ basis: z.literal('per-gal'), pricePerGalCents: cents('Price per gallon') }),
  z.object({ basis: z.literal('container'), containerSizeGal: positive('Container size', 500, 'gal'), containerPriceCents: cents('Container price') }),
]);

const LimePricingSchema = z.discriminatedUnion('basis', [
  z.object({ basis: z.literal('per-ton'), pricePerTonCents: cents('Price per ton') }),
  z.object({ basis: z.literal('bag'), bagSizeLb: positive('Bag size', 4000, 'lb'), bagPriceCents: cents('Bag price') }),
]);

/** A label's plant-back interval in whole days ≥ 0; a label in months is entered as months × 30. */
export const PlantBackDaysSchema = z
  .number({ message: 'Plant-back interval (plantBackDays) must be a number of days, like 120; a label in months is months × 30' })
  .int({ message: 'Plant-back interval (plantBackDays) must be a whole number of days; a label in months is months × 30' })
  .min(0, { message: 'Plant-back interval (plantBackDays) cannot be negative: enter 0 days when the label allows seeding at once' })
  .max(PLANT_BACK_MAX_DAYS, { message: `Plant-back interval (plantBackDays) above ${PLANT_BACK_MAX_DAYS} days is not plausible: enter it in days` });

export const MaterialCreateSchema = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('seed'),
    name,
    species: z.string().trim().min(1, { message: 'enter the species' }).max(80),
    purityPct: pct('Purity'),
    germinationPct: pct('Germination'),
    dormantPct: pct('Dormant seed').optional(),
    /** The firm's usual pure-stand rate for the species, broadcast. */
    rateLbPerAcre: positive('Seeding rate', 300, 'lb/acre').optional(),
    packageSizeLb: positive('Package size', 5000, 'lb'),
    packagePriceCents: cents('Package price'),
  }),
  z.object({ kind: z.literal('lime'), name, enmLbPerTon: positive('ENM guarantee', 4000, 'lb ENM/ton').optional(), pricing: LimePricingSchema }),
  z.object({ kind: z.literal('fertilizer'), name, grade: GradeSchema, bagSizeLb: positive('Bag size', 4000, 'lb'), bagPriceCents: cents('Bag price') }),
  z.object({
    kind: z.literal('herbicide'),
    name,
    activeIngredient: z.string().trim().min(1, { message: 'enter the active ingredient and its concentration' }).max(200),
    lbAiPerGal: positive('Concentration', 12, 'lb a.i./gal').optional(),
    restrictedUse: z.boolean().default(false),
    /** EPA Reg. No. from the label (spray records). */
    epaRegNo: z.string().trim().regex(EPA_REG_NO_PATTERN, { message: 'EPA Reg. No. (epaRegNo): write it as on the label, e.g. 524-475 or 524-475-123' }).optional(),
    adjuvant: z.boolean().default(false),
    /** Label rate the firm usually uses, lb a.i. per acre. */
    rateLbAiPerAcre: positive('Rate', 20, 'lb a.i./acre').optional(),
    /** Spray volume (carrier), gallons per acre. */
    carrierGpa: positive('Carrier volume', 100, 'gal/acre').optional(),
    /** Plant-back interval from the label: days from application until the follow crop may be seeded. */
    plantBackDays: PlantBackDaysSchema.optional(),
    pricing: SprayPricingSchema,
  }),
  z.object({
    kind: z.literal('other'),
    name,
    itemLabel: z.string().trim().min(1).max(40),
    packSize: z.number().int({ message: 'Pack size must be a whole number' }).min(1, { message: 'Pack size must be at least 1' }).max(100_000),
    packLabel: z.string().trim().min(1).max(60),
    packPriceCents: cents('Pack price'),
  }),
]);
export type MaterialCreateInput = z.infer<typeof MaterialCreateSchema>;

/** A material over the API: its id, key and kind, and every field of its definition. */
export type MaterialDto = MaterialDefinition & { id: number; kind: MaterialKind; plantBackDays?: number; rateLbPerAcre?: number; rateLbAiPerAcre?: number; carrierGpa?: number; archived: boolean; updatedAt: string };

export const RateCreateSchema = z.object({
  name,
  category: z.enum(RATE_CATEGORIES),
  basis: z.enum(['per-acre', 'per-hour', 'per-each', 'per-100-ft']),
  unitPriceCents: cents('Price'),
  minimumCents: cents('Minimum charge').optional(),
});
export type RateCreateInput = z.infer<typeof RateCreateSchema>;
export const RateUpdateSchema = RateCreateSchema.partial().extend({ minimumCents: cents('Minimum charge').nullish() });

const StepTimingSchema = z.object({ offsetEarliestDays: z.number().int().min(-1000).max(1000), offsetLatestDays: z.number().int().min(-1000).max(1000), source: z.string().max(300) });
const StepSchema = z.object({
  key: z.string().trim().min(1).max(60),
  kind: z.enum(['soil-test', 'inspect', 'spray', 'mow', 'lime', 'fertilize', 'till', 'seed', 'cultipack', 'plant', 'chainsaw', 'hinge-cut', 'burn', 'firebreak', 'post-signs', 'clear', 'build', 'scent', 'water-work', 'tree-stand']),
  name: z.string().trim().min(1).max(120),
  dependsOn: z.array(z.string()).max(20).optional(),
  timing: StepTimingSchema.optional(),
  application: z.record(z.string(), z.unknown()).optional(),
  services: z.array(z.object({ rateKey: z.string(), productivity: z.record(z.string(), z.number().nonnegative()).optional(), quantity: z.number().nonnegative().optional() })).max(20).optional(),
  cautions: z.array(z.enum(CAUTION_IDS)).optional(),
});

export const PracticeCreateSchema = z.object({
  name,
  description: z.string().trim().max(LIMITS.textMax).default(''),
  unitKinds: z.array(z.enum(UNIT_KINDS)).min(1, { message: 'choose at least one kind of unit the practice fits' }),
  measure: z.enum(['acres', 'feet', 'each']),
  windowKey: z.enum(WINDOW_KEYS),
  anchorStepKey: z.string().min(1),
  summary: z.object({ action: z.string().min(1).max(40), subject: z.string().min(1).max(120), subjectPlural: z.string().max(120).optional(), purpose: z.string().min(1).max(300) }),
  steps: z.array(StepSchema).min(1, { message: 'a practice needs at least one step' }).max(40),
});
export type PracticeCreateInput = z.infer<typeof PracticeCreateSchema>;
export const PracticeUpdateSchema = PracticeCreateSchema.partial();

export type PracticeDto = PracticeDefinition & {
  id: number;
  cautions: { id: string; title: string; text: string }[];
  updatedAt: string;
};

const SprayRateSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('product'), amountPerAcre: positive('Product rate', 2560, 'per acre'), unit: z.enum(['gal', 'qt', 'pt', 'fl-oz']) }),
  z.object({ kind: z.literal('active'), lbAiPerAcre: positive('Active ingredient rate', 20, 'lb a.i./acre'), lbAiPerGal: positive('Concentration', 12, 'lb a.i./gal').optional() }),
  z.object({ kind: z.literal('solution'), pctOfSpray: positive('Solution strength', 100, '%') }),
]);

const StepParametersSchema = z.object({
  skip: z.boolean().optional(),
  materialKey: z.string().max(80).optional(),
  seedMethod: z.enum(['broadcast', 'drilled']).optional(),
  broadcastFactor: z.number().min(1, { message: 'the broadcast factor is at least 1' }).max(3).optional(),
  seedRatesLbPerAcre: z.record(z.string(), positive('Seeding rate', 300, 'lb/acre')).optional(),
  limeTonsPerAcre: z.number().min(0, { message: 'lime tons cannot be negative' }).max(10, { message: 'more than 10 tons of lime per acre is not plausible' }).optional(),
  limeEnmLbPerAcre: z.number().min(0).max(20_000).optional(),
  nLbPerAcre: z.number().min(0, { message: 'N cannot be negative' }).max(400, { message: 'more than 400 lb N per acre is not plausible' }).optional(),
  p2o5LbPerAcre: z.number().min(0).max(400).optional(),
  k2oLbPerAcre: z.number().min(0).max(400).optional(),
  gpa: positive('Spray volume', 100, 'gal/acre').optional(),
  tankGal: positive('Tank size', 2000, 'gal').optional(),
  treatedFraction: z.number().min(0).max(1).optional(),
  sprayRates: z.record(z.string(), SprayRateSchema).optional(),
  itemQuantities: z.record(z.string(), z.number().min(0).max(100_000)).optional(),
  productivity: z.record(z.string(), z.record(z.string(), z.number().nonnegative())).optional(),
});

export const PrescriptionParametersSchema = z.object({ steps: z.record(z.string(), StepParametersSchema).optional() });

const isoDate = IsoDateSchema;

export const PrescriptionCreateSchema = z.object({
  practiceId: z.number().int().positive({ message: 'choose a practice from the library' }),
  year: z.number().int().min(2000).max(2100).optional(),
  targetDate: isoDate.optional(),
  count: z.number().int().min(1).max(1000).optional(),
  notes: z.string().trim().max(LIMITS.textMax).nullish(),
  parameters: PrescriptionParametersSchema.optional(),
});
export type PrescriptionCreateInput = z.infer<typeof PrescriptionCreateSchema>;
export const PrescriptionUpdateSchema = PrescriptionCreateSchema.omit({ practiceId: true }).partial().extend({ targetDate: isoDate.nullish(), count: z.number().int().min(1).max(1000).nullish() });
