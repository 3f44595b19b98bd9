/**
 * The plan map's undo stack: the last saved operations and how to reverse each. Pure data; the
 * page runs the reversing requests. Re-creating a deleted unit gives it a new id, so the older
 * entries that name the old id are rewritten to the new one.
 */
import type { MultiPolygon, Polygon } from 'geojson';
import type { UnitCreateInput, UnitUpdateInput } from '../../../../shared/schemas/unit';

export type UndoOp =
  /** A unit was created: undo deletes it. */
  | { type: 'create'; unitId: number; name: string }
  /** A unit was changed: undo writes the previous values back. */
  | { type: 'update'; unitId: number; name: string; before: UnitUpdateInput }
  /** A unit was deleted: undo creates it again. */
  | { type: 'delete'; unitId: number; name: string; unit: UnitCreateInput }
  /** Several units were created at once (an import): undo deletes them all. */
  | { type: 'create-many'; unitIds: number[] }
  /** The boundary was replaced: undo puts the previous one back (null: there was none). */
  | { type: 'boundary'; before: Polygon | MultiPolygon | null };

/** How many operations the stack keeps. */
export const UNDO_LIMIT = 50;

/** The stack with the operation on top, the oldest dropped beyond the limit. */
export function pushUndo(stack: readonly UndoOp[], op: UndoOp, limit = UNDO_LIMIT): UndoOp[] {
  const next = [...stack, op];
  return next.length > limit ? next.slice(next.length - limit) : next;
}

/** The stack with every mention of a unit id replaced (after a deleted unit was created again). */
export function remapUnitId(stack: readonly UndoOp[], oldId: number, newId: number): UndoOp[] {
  return stack.map((op) => {
    if (op.type === 'create-many') return op.unitIds.includes(oldId) ? { ...op, unitIds: op.unitIds.map((id) => (id === oldId ? newId : id)) } : op;
    if (op.type === 'boundary') return op;
    return op.unitId === oldId ? { ...op, unitId: newId } : op;
  });
}

/** What Undo would do, for the button's title: "Undo: create Food plot 3". */
export function describeUndo(op: UndoOp | undefined): string {
  if (!op) return 'Nothing to undo';
  switch (op.type) {
    case 'create':
      return `Undo: add ${op.name}`;
    case 'update':
      return `Undo: change to ${op.name}`;
    case 'delete':
      return `Undo: delete ${op.name}`;
    case 'create-many':
      return `Undo: import of ${op.unitIds.length} units`;
    case 'boundary':
      return 'Undo: boundary change';
  }
}
