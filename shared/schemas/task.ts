/** Tasks of the work schedule: list filters, edits, completion and skipping; shared by the server and the client. */
import { z } from 'zod';
import type { SprayApplicationInput } from './spray-records';
import { IdSchema, IsoDateSchema, LIST_PAGE, PageLimitSchema, PageQuerySchema, type PageDto, type PageQuery } from './common';
import { TASK_STATUSES, type FieldBucket, type Progress, type TaskQuantity, type TaskQuantityUsed, type TaskWarning, type UnitWorkStatus } from '../domain/tasks';
import type { Caution } from '../domain/cautions';

/**
 * The task list's page when the address does not say: 50 tasks (about 40 KB of JSON), so a
 * consultant's week answers in about the same time however many tasks the firm holds; the total says
 * how many more there are ("Show more" asks for a longer page). The schedule's timeline asks for
 * `timelineLimit` a page explicitly (its bars need more of the twelve weeks at once); the field sheet
 * asks for its whole list.
 */
export const TASK_PAGE = { defaultLimit: 50, timelineLimit: 100 } as const;

/**
 * The week list's page, by day: `perDay` tasks of each day (and of the week's unscheduled group) —
 * about one screen for the whole week — with every day's own total, so a day is never cut silently.
 * "Show more" raises it by `step`; `max` keeps a whole week of days (8 groups) within one list page.
 */
export const WEEK_PAGE = { perDay: 3, step: 10, max: Math.floor(LIST_PAGE.maxLimit / 8) } as const;

/** The per-day page of the week list after `pages` presses of "Show more" (1 = the first page). */
export const weekPerDay = (pages: number): number => Math.min(WEEK_PAGE.max, WEEK_PAGE.perDay + WEEK_PAGE.step * Math.max(0, pages - 1));

/** The list `limit` that holds `perDay` tasks of each of the week's eight groups (seven days and the unscheduled). */
export const weekLimit = (perDay: number): number => Math.min(LIST_PAGE.maxLimit, 8 * perDay);

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
    /**
     * The week list's page by day: at most this many tasks of each day from `from` on (a task is
     * counted on its first day in the range) and of the unscheduled ones; the answer's `groups` give
     * each day's total. Needs `from`.
     */
    perDay: z.coerce
      .number()
      .int({ message: 'perDay must be a whole number' })
      .min(1, { message: 'perDay must be at least 1' })
      .max(WEEK_PAGE.max, { message: `perDay must be at most ${WEEK_PAGE.max}` })
      .optional(),
  })
  .extend({ ...PageQuerySchema.shape, limit: PageLimitSchema.default(TASK_PAGE.defaultLimit) })
  .refine((q) => !q.from || !q.to || q.from <= q.to, { message: '"from" must not come after "to"', path: ['to'] })
  .refine((q) => q.perDay === undefined || q.from !== undefined, { message: 'perDay needs "from": the days are counted from it', path: ['perDay'] });
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

export const TaskPhotoDtoSchema = z.object({
  id: z.number().int(),
  url: z.string(),
  takenAt: z.string().nullable(),
  latitude: z.number().nullable(),
  longitude: z.number().nullable(),
  createdAt: z.string(),
});
export type TaskPhotoDto = z.infer<typeof TaskPhotoDtoSchema>;

const objects = <T>() => z.array(z.custom<T>((v) => typeof v === 'object' && v !== null));
const nullableString = z.string().nullable();

/** A task as the API answers it. Crew members get no cost (costCents is null for them). */
export const TaskDtoSchema = z.object({
  id: z.number().int(),
  propertyId: z.number().int(),
  propertyName: z.string(),
  unitId: z.number().int().nullable(),
  unitName: z.string(),
  unitKind: nullableString,
  prescriptionId: z.number().int().nullable(),
  proposalId: z.number().int().nullable(),
  stepKey: z.string(),
  name: z.string(),
  kind: z.string(),
  practiceName: z.string(),
  dependsOn: z.array(z.string()),
  earliest: z.string(),
  latest: z.string(),
  startDate: nullableString,
  endDate: nullableString,
  status: z.enum(TASK_STATUSES),
  assigneeId: z.number().int().nullable(),
  assigneeName: nullableString,
  quantities: objects<TaskQuantity>(),
  cautions: objects<Caution>(),
  costCents: z.number().int().nullable(),
  doneOn: nullableString,
  completedAt: nullableString,
  completedByName: nullableString,
  notes: nullableString,
  hours: z.number().nullable(),
  quantitiesUsed: objects<TaskQuantityUsed>(),
  skipReason: nullableString,
  invoiceId: z.number().int().nullable(),
  photos: z.array(TaskPhotoDtoSchema),
  bucket: z.custom<FieldBucket>((v) => typeof v === 'string'),
  /** [lon, lat] of a point inside the unit, for the phone's maps app. */
  location: z.tuple([z.number(), z.number()]).nullable(),
  warnings: objects<TaskWarning>(),
});
export type TaskDto = z.infer<typeof TaskDtoSchema>;

export const TaskListDtoSchema = z.object({
  tasks: z.array(TaskDtoSchema),
  warnings: objects<TaskWarning>(),
  /** The tasks matching the filter in all (`tasks` holds `limit` of them from `offset`). */
  page: z.custom<PageDto>((v) => typeof v === 'object' && v !== null).optional(),
  /** With `perDay`: every day (and null, the unscheduled) that has a matching task, with how many it has in all. */
  groups: z.array(z.object({ date: IsoDateSchema.nullable(), total: z.number().int().min(1) })).optional(),
});
export type TaskListDto = z.infer<typeof TaskListDtoSchema>;

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
