/** Soil tests of a unit: the body the server validates, the lab-CSV import and the answer's shape. */
import { z } from 'zod';
import { IsoDateSchema } from './common';
import { LIMITS } from '../limits';
import { BUFFER_METHODS, PH_MAX, PH_MIN, SOIL_LAB_METHODS, type BufferMethod, type LimeMethod, type LimeRecommendationResult, type NutrientRecommendation } from '../domain/soil-tests';
import { SOIL_CSV_FIELDS } from '../domain/soil-csv';

const ph = (field: string) =>
  z
    .number({ error: `${field}: enter the pH from the lab report` })
    .min(PH_MIN, { message: `${field} must lie between ${PH_MIN} and ${PH_MAX}` })
    .max(PH_MAX, { message: `${field} must lie between ${PH_MIN} and ${PH_MAX}` });

const ppm = (field: string) => z.number({ error: `${field}: enter parts per million` }).min(0, { message: `${field} cannot be negative` }).max(10_000, { message: `${field} cannot be more than 10,000 ppm` });

export const SoilTestCreateSchema = z
  .object({
    sampledOn: IsoDateSchema,
    lab: z.string({ error: 'lab: name the laboratory' }).trim().min(1, { message: 'lab: name the laboratory' }).max(LIMITS.nameMax, { message: `lab: at most ${LIMITS.nameMax} characters` }),
    ph: ph('ph'),
    bufferPh: ph('bufferPh').nullish(),
    bufferMethod: z.enum(BUFFER_METHODS, { error: `bufferMethod must be one of ${BUFFER_METHODS.join(', ')}` }).nullish(),
    /** The extractant the P and K were read with: Bray P1 + ammonium acetate (the default) or Mehlich-3 (converted before the Tri-State rules). */
    labMethod: z.enum(SOIL_LAB_METHODS, { error: `labMethod must be one of ${SOIL_LAB_METHODS.join(', ')} (Bray P1 with ammonium-acetate K, or Mehlich-3)` }).nullish(),
    pPpm: ppm('pPpm').nullish(),
    kPpm: ppm('kPpm').nullish(),
    organicMatterPct: z.number({ error: 'organicMatterPct: enter a percentage' }).min(0, { message: 'organicMatterPct cannot be negative' }).max(100, { message: 'organicMatterPct cannot be above 100 %' }).nullish(),
    cec: z.number({ error: 'cec: enter meq/100 g' }).min(0, { message: 'cec cannot be negative' }).max(200, { message: 'cec cannot be more than 200 meq/100 g' }).nullish(),
    /** The lab's own ENM recommendation, lb ENM/acre (University of Missouri reports carry it). */
    enmLbPerAcre: z.number({ error: 'enmLbPerAcre: enter lb ENM per acre' }).min(0, { message: 'enmLbPerAcre cannot be negative' }).max(40_000, { message: 'enmLbPerAcre cannot be more than 40,000' }).nullish(),
  })
  .refine((b) => !b.bufferMethod || (b.bufferPh !== null && b.bufferPh !== undefined), { message: 'bufferPh: give the buffer pH read with that buffer method', path: ['bufferPh'] });
export type SoilTestCreateValues = z.output<typeof SoilTestCreateSchema>;

/** Most rows one lab CSV may hold. */
export const SOIL_CSV_MAX_ROWS = 500;
export const SOIL_CSV_MAX_CHARS = 200_000;

/** A lab's results as CSV text with a header row: unit, sampledOn, lab, ph, bufferPh, bufferMethod, labMethod, pPpm, kPpm, organicMatterPct, cec, enmLbPerAcre. */
export const SoilTestImportSchema = z.object({
  csv: z.string({ error: 'csv: paste the lab’s CSV text' }).min(1, { message: 'csv: paste the lab’s CSV text' }).max(SOIL_CSV_MAX_CHARS, { message: `csv: at most ${SOIL_CSV_MAX_CHARS.toLocaleString('en-US')} characters` }),
  /** Which of the file's columns holds each field; left out, columns are matched by their header names. */
  columns: z.partialRecord(z.enum(SOIL_CSV_FIELDS, { error: `columns: the fields are ${SOIL_CSV_FIELDS.join(', ')}` }), z.string().max(200, { message: 'columns: a column name of at most 200 characters' })).optional(),
});
export type SoilTestImportInput = z.output<typeof SoilTestImportSchema>;

/** One row the import refused: the file's row number (the header is row 1), the field and what to change. */
export interface SoilCsvRowProblem {
  row: number;
  field: string;
  message: string;
}

/** What the firm's state method needs to work a unit's soil test in the browser (`GET /api/properties/:id/soil-test-context`). */
export interface SoilTestContextDto {
  method: LimeMethod;
  methodLabel: string;
  /** The buffers the method reads; any other is refused. */
  buffers: readonly BufferMethod[];
  retestYears: number;
  units: { unitId: number; name: string; cropGroup: string; targetPh: number; limeEnmLbPerTon: number }[];
}

export interface SoilTestDto {
  id: number;
  unitId: number;
  unitName: string;
  propertyId: number;
  sampledOn: string;
  lab: string;
  ph: number;
  bufferPh: number | null;
  bufferMethod: string | null;
  /** The extractant of P and K ('bray-nh4oac' or 'mehlich-3'). */
  labMethod: string;
  pPpm: number | null;
  kPpm: number | null;
  organicMatterPct: number | null;
  cec: number | null;
  enmLbPerAcre: number | null;
  cropGroup: string;
  lime: LimeRecommendationResult;
  nutrients: NutrientRecommendation;
  retestDue: string;
  /** The prescription the recommendation was written into, once applied. */
  appliedPrescriptionId: number | null;
}

export const SoilTestDtoSchema = z.looseObject({
  id: z.number().int(),
  unitId: z.number().int(),
  sampledOn: IsoDateSchema,
  ph: z.number(),
  lime: z.looseObject({ method: z.string(), tonsPerAcre: z.number(), source: z.string() }),
  nutrients: z.looseObject({ p2o5LbPerAcre: z.number(), k2oLbPerAcre: z.number(), source: z.string() }),
  retestDue: IsoDateSchema,
});
