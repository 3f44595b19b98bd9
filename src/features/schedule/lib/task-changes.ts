import type { TaskDto, TaskUpdateInput } from '../../../../shared/schemas/task';

type Editable = Pick<TaskDto, 'assigneeId' | 'startDate' | 'endDate' | 'notes'>;

/** Blank text and undefined mean "none" on both sides, so an untouched empty box is no change. */
const norm = <T,>(v: T | '' | undefined | null): T | null => (v === '' || v === undefined || v === null ? null : v);
const text = (v: string | null | undefined) => {
  const t = (v ?? '').trim();
  return t === '' ? null : t;
};

/**
 * The fields of the scheduling form that differ from the saved task, as the PATCH body. Compared by
 * value (not by the form library's dirty flags, which are only kept once something reads them), so
 * the first Save sends every change, the note included.
 */
export function taskChanges(saved: Editable, values: Partial<Editable>): TaskUpdateInput {
  const out: TaskUpdateInput = {};
  const assigneeId = norm(values.assigneeId);
  if (assigneeId !== norm(saved.assigneeId)) out.assigneeId = assigneeId;
  const startDate = norm(values.startDate);
  if (startDate !== norm(saved.startDate)) out.startDate = startDate;
  const endDate = norm(values.endDate);
  if (endDate !== norm(saved.endDate)) out.endDate = endDate;
  const notes = text(values.notes);
  if (notes !== text(saved.notes)) out.notes = notes;
  return out;
}
