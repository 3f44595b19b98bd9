/** The "Mark done" form's schema: the shared completion schema, with quantities as a list rather than the multipart JSON text. */
import { z } from 'zod';
import { QuantityUsedSchema, TaskCompleteSchema } from '../../../../shared/schemas/task';
import type { TaskQuantity } from '../../../../shared/domain/tasks';
import { PHOTO_LIMITS } from '../../../../shared/limits';
import type { CompletionFields } from './completion-queue';

export const CompleteFormSchema = TaskCompleteSchema.extend({
  quantitiesUsed: z.array(QuantityUsedSchema.extend({ amount: z.number({ error: 'enter a number (0 if none was used)' }).min(0, { message: 'must be zero or more' }).max(1_000_000) })).max(50),
});
export type CompleteFormInput = z.input<typeof CompleteFormSchema>;
export type CompleteFormOutput = z.output<typeof CompleteFormSchema>;

/** The form's starting values: today, and what the prescription says to apply. */
export function completeFormDefaults(quantities: readonly TaskQuantity[], today: string): CompleteFormInput {
  return { doneOn: today, notes: '', hours: '', quantitiesUsed: quantities.map((q) => ({ key: q.key, label: q.label, amount: q.amount, unit: q.unit })) };
}

/** The queued fields of a validated form. */
export function completionFields(values: CompleteFormOutput): CompletionFields {
  return { doneOn: values.doneOn, notes: values.notes ?? '', hours: values.hours === null ? '' : String(values.hours), quantitiesUsed: values.quantitiesUsed };
}

/** What is wrong with a set of photos before they go (count and size; the server checks their content). Null when fine. */
export function photoProblem(files: readonly { name: string; size: number }[]): string | null {
  if (files.length > PHOTO_LIMITS.perCompletion) return `Attach at most ${PHOTO_LIMITS.perCompletion} photos; remove ${files.length - PHOTO_LIMITS.perCompletion}.`;
  const big = files.find((f) => f.size > PHOTO_LIMITS.maxBytes);
  if (big) return `“${big.name}” is larger than ${PHOTO_LIMITS.maxBytes / (1024 * 1024)} MB; take it again at a lower resolution or leave it out.`;
  return null;
}
