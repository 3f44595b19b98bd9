/** Seasons side by side (portal and staff): the query and the answer's shape. */
import { z } from 'zod';
import type { SeasonComparison } from '../domain/season-comparison';

/** `?season=2026` shows 2026 against 2025; without it, the latest season with any record. */
export const SeasonComparisonQuerySchema = z.object({
  season: z
    .string()
    .regex(/^\d{4}$/, { message: 'season must be a four-digit year, e.g. 2026' })
    .transform(Number)
    .refine((y) => y >= 2000 && y <= 2100, { message: 'season must lie between 2000 and 2100' })
    .optional(),
});
export type SeasonComparisonQuery = z.output<typeof SeasonComparisonQuerySchema>;

export type SeasonComparisonDto = SeasonComparison & { propertyId: number; propertyName: string };

const CellSchema = z.looseObject({
  status: z.string().nullable(),
  checks: z.array(z.string()),
  soilPh: z.number().nullable(),
  tasksDone: z.number().int(),
  tasksTotal: z.number().int(),
  workDone: z.array(z.string()),
});

/** The answer's shape, for integration tests and the client. */
export const SeasonComparisonDtoSchema = z.looseObject({
  propertyId: z.number().int(),
  propertyName: z.string(),
  season: z.number().int(),
  previousSeason: z.number().int(),
  rows: z.array(
    z.looseObject({ unitId: z.number().int(), unitName: z.string(), kind: z.string(), acres: z.number().nullable(), previous: CellSchema, current: CellSchema, phChange: z.number().nullable() }),
  ),
});
