/** The "Mark done" form's schema: the shared completion schema, with quantities as a list rather than the multipart JSON text. */
import { z } from 'zod';
import { QuantityUsedSchema, TaskCompleteSchema } from '../../../../shared/schemas/task';
import type { TaskQuantity } from '../../../../shared/domain/tasks';
import { PHOTO_LIMITS } from '../../../../shared/limits';
import type { CompletionFields } from './completion-queue';
import { SprayApplicationSchema } from '../../../../shared/schemas/spray-records';
import { isHerbicideTask, SPRAY_AMOUNT_UNITS, type SprayAmountUnit } from '../../../../shared/domain/spray-records';

export const CompleteFormSchema = TaskCompleteSchema.extend({
  quantitiesUsed: z.array(QuantityUsedSchema.extend({ amount: z.number({ error: 'enter a number (0 if none was used)' }).min(0, { message: 'must be zero or more' }).max(1_000_000) })).max(50),
  /** A herbicide step's spray record, as an object here (sent as JSON text). */
  spray: SprayApplicationSchema.optional(),
});
export type CompleteFormInput = z.input<typeof CompleteFormSchema>;
export type CompleteFormOutput = z.output<typeof CompleteFormSchema>;

/** The form's starting values: today, and what the prescription says to apply; a herbicide step starts its spray record from the planned products. */
export function completeFormDefaults(quantities: readonly TaskQuantity[], today: string, task?: { kind: string; cautions?: readonly { id: string }[]; unitName?: string }): CompleteFormInput {
  const base: CompleteFormInput = { doneOn: today, notes: '', hours: '', quantitiesUsed: quantities.map((q) => ({ key: q.key, label: q.label, amount: q.amount, unit: q.unit })) };
  if (!task || !isHerbicideTask(task)) return base;
  const products = quantities
    .filter((q) => q.rateText !== '')
    .map((q) => ({ materialKey: q.key, amount: q.amount, unit: (SPRAY_AMOUNT_UNITS as readonly string[]).includes(q.unit) ? (q.unit as SprayAmountUnit) : 'gal' }));
  return { ...base, spray: { products, cropOrSite: task.unitName ?? '', areaTreatedAcres: Number.NaN, windMph: Number.NaN, windDirection: 'calm', airTempF: Number.NaN, applicatorName: '', applicatorCertNo: '' } };
}

/** The queued fields of a validated form. */
export function completionFields(values: CompleteFormOutput): CompletionFields {
  return { doneOn: values.doneOn, notes: values.notes ?? '', hours: values.hours === null ? '' : String(values.hours), quantitiesUsed: values.quantitiesUsed, ...(values.spray ? { spray: values.spray } : {}) };
}

/** What is wrong with a set of photos before they go (count and size; the server checks their content). Null when fine. */
export function photoProblem(files: readonly { name: string; size: number }[]): string | null {
  if (files.length > PHOTO_LIMITS.perCompletion) return `Attach at most ${PHOTO_LIMITS.perCompletion} photos; remove ${files.length - PHOTO_LIMITS.perCompletion}.`;
  const big = files.find((f) => f.size > PHOTO_LIMITS.maxBytes);
  if (big) return `“${big.name}” is larger than ${PHOTO_LIMITS.maxBytes / (1024 * 1024)} MB; take it again at a lower resolution or leave it out.`;
  return null;
}
