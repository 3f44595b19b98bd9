/** Tasks of the work schedule: list filters, edits, completion and skipping; shared by the server and the client. */
import { z } from 'zod';
import type { SprayApplicationInput } from './spray-records';
import { IdSchema, IsoDateSchema, PageQuerySchema, type PageDto, type PageQuery } from './common';
import { TASK_STATUSES, type FieldBucket, type Progress, type TaskQuantity, type TaskQuantityUsed, type TaskStatus, type TaskWarning, type UnitWorkStatus } from '../domain/tasks';
import type { Caution } from '../domain/cautions';

export const TaskListQuerySchema = z
  .object({
    propertyId: IdSchema.optional(),
    assigneeId: z.union([IdSchema, z.literal('none')]).optional(),
    unitId: IdSchema.optional(),
    status: z.enum(TASK_STATUSES).optional(),
    /** Tasks whose dates (or, unscheduled, whose window) touch [from, to]. */
    from: IsoDateSchema.optional(),
    to: IsoDateSchema.optional(),
    /** `true` adds each task's unit outline (the field sheet's sketches); lists carry none otherwise. */
    geometry: z.enum(['true', 'false'], { message: 'geometry must be true or false' }).optional(),
  })
  .extend(PageQuerySchema.shape)
  .refine((q) => !q.from || !q.to || q.from <= q.to, { message: '"from" must not come after "to"', path: ['to'] });
/** A task list filter; the page members may be left out (the server's defaults apply). */
export type TaskListQuery = Omit<z.infer<typeof TaskListQuerySchema>, 'limit' | 'offset'> & Partial<PageQuery>;

export const TaskUpdateSchema = z
  .object({
    assigneeId: IdSchema.nullable().optional(),
    startDate: IsoDateSchema.nullable().optional(),
    endDate: IsoDateSchema.nullable().optional(),
    notes: z.string().trim().max(4000).nullable().optional(),
  })
  .strict()
  .refine((b) => Object.keys(b).length > 0, { message: 'send at least one of assigneeId, startDate, endDate, notes' })
  .refine((b) => !b.startDate || !b.endDate || b.startDate <= b.endDate, { message: 'the end date must not come before the start date', path: ['endDate'] });
export type TaskUpdateInput = z.infer<typeof TaskUpdateSchema>;

/** The most tasks one "assign selected" may change at once (a season's work on a large property). */
export const TASK_ASSIGN_MAX = 200;

/** Several tasks given to one person (or back to nobody) at once, from the timeline's selection. */
export const TaskAssignSchema = z
  .object({
    taskIds: z
      .array(IdSchema, { error: 'taskIds: list the tasks to assign' })
      .min(1, { message: 'taskIds: select at least one task' })
      .max(TASK_ASSIGN_MAX, { message: `taskIds: assign at most ${TASK_ASSIGN_MAX} tasks at once` })
      .refine((ids) => new Set(ids).size === ids.length, { message: 'taskIds: list each task once' }),
    assigneeId: IdSchema.nullable(),
  })
  .strict();
export type TaskAssignInput = z.infer<typeof TaskAssignSchema>;

export const QuantityUsedSchema = z.object({
  key: z.string().trim().min(1).max(120),
  label: z.string().trim().min(1).max(200),
  amount: z.number().min(0, { message: 'must be zero or more' }).max(1_000_000),
  unit: z.string().trim().max(40),
});

/** A JSON array in a multipart text field. */
export const jsonField = <T extends z.ZodType>(schema: T) =>
  z
    .string()
    .transform((text, ctx) => {
      try {
        return JSON.parse(text) as unknown;
      } catch {
        ctx.addIssue({ code: 'custom', message: 'must be JSON' });
        return z.NEVER;
      }
    })
    .pipe(schema);

/** The fields of a completion (multipart text fields; numbers arrive as strings). */
export const TaskCompleteSchema = z.object({
  doneOn: IsoDateSchema,
  notes: z.string().trim().max(4000).optional().transform((v) => (v ? v : null)),
  hours: z.union([z.literal(''), z.coerce.number().min(0, { message: 'must be zero or more' }).max(200, { message: 'must be at most 200 hours' })]).optional().transform((v) => (v === '' || v === undefined ? null : v)),
  quantitiesUsed: jsonField(z.array(QuantityUsedSchema).max(50)).optional(),
});
export type TaskCompleteInput = z.output<typeof TaskCompleteSchema> & { spray?: SprayApplicationInput };

export const TaskSkipSchema = z.object({ reason: z.string().trim().min(3, { message: 'say why in a few words' }).max(1000) });

/** The idempotency key header of a completion: made once per completion on the phone. */
export { IDEMPOTENCY_HEADER } from '../domain/tasks';
export const IdempotencyKeySchema = z.string().trim().min(8, { message: 'must be at least 8 characters' }).max(200).regex(/^[A-Za-z0-9_.:-]+$/, { message: 'may hold letters, digits and - _ . : only' });

export interface TaskPhotoDto {
  id: number;
  url: string;
  takenAt: string | null;
  latitude: number | null;
  longitude: number | null;
  createdAt: string;
}

/** A task as the API answers it. Crew members get no cost (costCents is null for them). */
export interface TaskDto {
  id: number;
  propertyId: number;
  propertyName: string;
  unitId: number | null;
  unitName: string;
  unitKind: string | null;
  prescriptionId: number | null;
  proposalId: number | null;
  stepKey: string;
  name: string;
  kind: string;
  practiceName: string;
  dependsOn: string[];
  earliest: string;
  latest: string;
  startDate: string | null;
  endDate: string | null;
  status: TaskStatus;
  assigneeId: number | null;
  assigneeName: string | null;
  quantities: TaskQuantity[];
  cautions: Caution[];
  costCents: number | null;
  doneOn: string | null;
  completedAt: string | null;
  completedByName: string | null;
  notes: string | null;
  hours: number | null;
  quantitiesUsed: TaskQuantityUsed[];
  skipReason: string | null;
  invoiceId: number | null;
  photos: TaskPhotoDto[];
  bucket: FieldBucket;
  /** [lon, lat] of a point inside the unit, for the phone's maps app. */
  location: [number, number] | null;
  warnings: TaskWarning[];
}

export interface TaskListDto {
  tasks: TaskDto[];
  warnings: TaskWarning[];
  /** The tasks matching the filter in all (`tasks` holds `limit` of them from `offset`). */
  page?: PageDto;
}

export interface UnitProgressDto extends Progress {
  unitId: number;
  unitName: string;
  unitKind: string;
  status: UnitWorkStatus;
}

export interface PropertyProgressDto {
  propertyId: number;
  propertyName: string;
  /** Staff setting: e-mail the client when all of a unit's tasks are finished. */
  notifyClientOnUnitDone?: boolean;
  plan: Progress;
  units: UnitProgressDto[];
}

export interface CalendarFeedDto {
  id: number;
  createdAt: string;
  lastUsedAt: string | null;
  /** Only in the answer that creates it; afterwards the URL cannot be shown again. */
  url?: string;
}
