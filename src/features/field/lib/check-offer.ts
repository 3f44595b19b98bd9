/** Where the field sheet offers establishment and browse checks (kept apart from the queue so the task page stays small). */

/** Unit kinds that are sown, and step kinds that sow: where the field sheet offers checks. */
const SEEDED_UNIT_KINDS = new Set(['food-plot', 'cover-planting']);
const SEEDING_STEP_KINDS = new Set(['seed', 'plant']);

/** Whether a task's unit is a seeded one the crew may check from the field sheet. */
export function offersChecks(task: { unitId: number | null; unitKind: string | null; kind: string }): boolean {
  if (task.unitId === null) return false;
  return SEEDED_UNIT_KINDS.has(task.unitKind ?? '') || SEEDING_STEP_KINDS.has(task.kind);
}
