/** Rolling a plan into the next season: the request, a change's decision and the answer's shape. */
import { z } from 'zod';
import type { SeasonPlan } from '../domain/next-season';

export const SeasonRollSchema = z.object({
  season: z.number({ error: 'season: enter the year to plan, e.g. 2027' }).int({ message: 'season: a whole year, e.g. 2027' }).min(2000, { message: 'season must be 2000 or later' }).max(2100, { message: 'season must be 2100 or earlier' }),
});

export const SeasonChangeDecisionSchema = z.object({ decision: z.enum(['accepted', 'rejected', 'proposed'], { error: 'decision must be accepted, rejected or proposed' }) });
export const SeasonChangeParamsSchema = z.object({
  id: z.string().regex(/^\d{1,9}$/, { message: 'id must be a number' }).transform(Number),
  changeId: z.string().regex(/^\d{1,9}-[a-z-]{1,20}$/, { message: 'changeId names one change of the draft, e.g. 12-reseed' }),
});

export interface SeasonDraftDto {
  id: number;
  propertyId: number;
  season: number;
  status: 'draft' | 'written';
  plan: SeasonPlan;
  prescriptionIds: number[];
  proposalId: number | null;
}

export const SeasonDraftDtoSchema = z.looseObject({
  id: z.number().int(),
  propertyId: z.number().int(),
  season: z.number().int(),
  status: z.enum(['draft', 'written']),
  plan: z.looseObject({ season: z.number().int(), units: z.array(z.unknown()), changes: z.array(z.looseObject({ id: z.string(), kind: z.string(), reason: z.string(), decision: z.string() })) }),
  proposalId: z.number().int().nullable(),
});
