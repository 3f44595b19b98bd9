/** Spray records: what the crew enters when completing a herbicide step, the export query and the answer's shape. */
import { z } from 'zod';
import { IdSchema, IsoDateSchema } from './common';
import { jsonField, TaskCompleteSchema } from './task';
import { SPRAY_AMOUNT_UNITS, WIND_DIRECTIONS } from '../domain/spray-records';

const text = (field: string, what: string, max: number) =>
  z.string({ error: `${field}: ${what}` }).trim().min(1, { message: `${field}: ${what}` }).max(max, { message: `${field}: at most ${max} characters` });

/** One product applied: its library key, the total amount used and (when the library lacks it) its EPA registration number. */
export const SprayProductInputSchema = z.object({
  materialKey: text('materialKey', 'pick the product from the task', 80),
  amount: z.number({ error: 'amount: enter the total amount of product applied' }).positive({ message: 'amount: the total amount applied must be more than zero' }).max(100_000, { message: 'amount: at most 100,000' }),
  unit: z.enum(SPRAY_AMOUNT_UNITS, { error: `unit must be one of ${SPRAY_AMOUNT_UNITS.join(', ')}` }),
  epaRegNo: z
    .string()
    .trim()
    .regex(/^\d{1,7}-\d{1,7}(-\d{1,7})?$/, { message: 'epaRegNo: write the EPA Reg. No. as on the label, e.g. 524-475' })
    .optional(),
});

/** The spray record of a herbicide step's completion (a JSON text field of the completion form). */
export const SprayApplicationSchema = z.object({
  products: z.array(SprayProductInputSchema).min(1, { message: 'products: name at least one product applied' }).max(10),
  cropOrSite: text('cropOrSite', 'name the crop or site treated, e.g. "food plot before seeding"', 120),
  areaTreatedAcres: z.number({ error: 'areaTreatedAcres: enter the acres treated' }).positive({ message: 'areaTreatedAcres: the area treated must be more than zero' }).max(10_000, { message: 'areaTreatedAcres: at most 10,000 acres' }),
  windMph: z.number({ error: 'windMph: enter the wind speed in mph' }).min(0, { message: 'windMph cannot be negative' }).max(60, { message: 'windMph: at most 60 mph' }),
  windDirection: z.enum(WIND_DIRECTIONS, { error: `windDirection must be one of ${WIND_DIRECTIONS.join(', ')}` }),
  airTempF: z.number({ error: 'airTempF: enter the air temperature in °F' }).min(-40, { message: 'airTempF: at least −40 °F' }).max(130, { message: 'airTempF: at most 130 °F' }),
  applicatorName: text('applicatorName', 'name the person who applied it', 120),
  applicatorCertNo: z.string().trim().max(60, { message: 'applicatorCertNo: at most 60 characters' }).nullish().transform((v) => (v ? v : null)),
});
export type SprayApplicationInput = z.output<typeof SprayApplicationSchema>;

export const SPRAY_RECORD_FORMATS = ['json', 'csv', 'pdf'] as const;

export const SprayRecordQuerySchema = z.object({
  season: z.coerce.number({ error: 'season: give a year, e.g. 2026' }).int({ message: 'season: give a year, e.g. 2026' }).min(2000, { message: 'season: a year from 2000 on' }).max(2100, { message: 'season: a year up to 2100' }),
  propertyId: IdSchema.optional(),
  format: z.enum(SPRAY_RECORD_FORMATS, { error: 'format must be json, csv or pdf' }).default('json'),
});
export type SprayRecordQuery = z.output<typeof SprayRecordQuerySchema>;

export const SprayRecordDtoSchema = z.object({
  id: z.number(),
  taskId: z.number().nullable(),
  propertyId: z.number().nullable(),
  unitId: z.number().nullable(),
  appliedOn: IsoDateSchema,
  keepUntil: IsoDateSchema,
  propertyName: z.string(),
  unitName: z.string(),
  latitude: z.number().nullable(),
  longitude: z.number().nullable(),
  cropOrSite: z.string(),
  areaTreated: z.number(),
  areaUnit: z.string(),
  productName: z.string(),
  epaRegNo: z.string().nullable(),
  restrictedUse: z.boolean(),
  amount: z.number(),
  amountUnit: z.string(),
  applicatorName: z.string(),
  applicatorCertNo: z.string().nullable(),
  windMph: z.number(),
  windDirection: z.string(),
  airTempF: z.number(),
});
export type SprayRecordDto = z.infer<typeof SprayRecordDtoSchema>;

export const SprayRecordListSchema = z.object({ season: z.number(), caution: z.string(), records: z.array(SprayRecordDtoSchema) });
export type SprayRecordList = z.infer<typeof SprayRecordListSchema>;

/** A task completion's fields with a herbicide step's spray record as JSON text (the server's completion body). */
export const TaskCompleteWithSpraySchema = TaskCompleteSchema.extend({ spray: jsonField(SprayApplicationSchema).optional() });
