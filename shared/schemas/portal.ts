/** What the client portal reads: the client's properties, one property's plan in plain words, and its progress. */
import { z } from 'zod';
import { TASK_STATUSES } from '../domain/tasks';

const CautionSchema = z.object({ id: z.string(), title: z.string(), text: z.string() });

export const PortalPropertyRowSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  acres: z.number().nullable(),
  county: z.string().nullable(),
  state: z.string().nullable(),
  objectives: z.string().nullable(),
  unitCount: z.number().int(),
  /** Done as a share of the season's tasks by cost weight, 0–100; null when no work is scheduled. */
  percentDone: z.number().nullable(),
});
export type PortalPropertyRow = z.infer<typeof PortalPropertyRowSchema>;

export const PortalPropertiesSchema = z.object({
  client: z.object({ id: z.number().int(), name: z.string(), portalUploadsAllowed: z.boolean(), portalObservationsAllowed: z.boolean().optional() }),
  firm: z.object({ name: z.string(), email: z.string().nullable(), phone: z.string().nullable() }),
  properties: z.array(PortalPropertyRowSchema),
});
export type PortalProperties = z.infer<typeof PortalPropertiesSchema>;

/** Progress without money: counts and percentages only (clients see progress by cost as a percentage). */
export const PortalProgressSchema = z.object({
  total: z.number().int(),
  done: z.number().int(),
  skipped: z.number().int(),
  open: z.number().int(),
  percentByCount: z.number(),
  percentByCost: z.number(),
});
export type PortalProgress = z.infer<typeof PortalProgressSchema>;

export const PortalPrescriptionSchema = z.object({
  id: z.number().int(),
  practiceName: z.string(),
  year: z.number().int(),
  /** Plain-language what, why and when. */
  summary: z.string(),
  windowStart: z.string().nullable(),
  windowEnd: z.string().nullable(),
  targetDate: z.string().nullable(),
  cautionIds: z.array(z.string()),
});

export const PortalUnitSchema = z.object({
  id: z.number().int(),
  kind: z.string(),
  family: z.enum(['area', 'line', 'point']),
  name: z.string(),
  geometry: z.record(z.string(), z.unknown()),
  acres: z.number().nullable(),
  lengthFt: z.number().nullable(),
  prescriptions: z.array(PortalPrescriptionSchema),
  workStatus: z.enum(['no-work', 'not-started', 'in-progress', 'done']),
  progress: PortalProgressSchema.nullable(),
});
export type PortalUnit = z.infer<typeof PortalUnitSchema>;

export const PortalTaskSchema = z.object({
  id: z.number().int(),
  unitId: z.number().int().nullable(),
  unitName: z.string(),
  name: z.string(),
  practiceName: z.string(),
  status: z.enum(TASK_STATUSES),
  earliest: z.string(),
  latest: z.string(),
  startDate: z.string().nullable(),
  endDate: z.string().nullable(),
  doneOn: z.string().nullable(),
  photos: z.array(z.object({ id: z.number().int(), url: z.string(), takenAt: z.string().nullable() })),
});
export type PortalTask = z.infer<typeof PortalTaskSchema>;

export const PortalPropertyDetailSchema = z.object({
  property: z.object({
    id: z.number().int(),
    name: z.string(),
    acres: z.number().nullable(),
    county: z.string().nullable(),
    state: z.string().nullable(),
    objectives: z.string().nullable(),
    boundary: z.record(z.string(), z.unknown()).nullable(),
  }),
  units: z.array(PortalUnitSchema),
  shareByKind: z.array(z.object({ kind: z.string(), label: z.string(), acres: z.number(), pctOfProperty: z.number() })),
  cautions: z.array(CautionSchema),
  progress: PortalProgressSchema,
  tasks: z.array(PortalTaskSchema),
});
export type PortalPropertyDetail = z.infer<typeof PortalPropertyDetailSchema>;
