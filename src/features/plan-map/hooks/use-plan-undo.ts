import { useCallback, useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { createUnit } from '../api/create-unit';
import { deleteUnit } from '../api/delete-unit';
import { updateUnit } from '../api/update-unit';
import { applyUnitChanges } from '../api/get-units';
import { applyProperty, updatePropertyBoundary } from '../api/update-property-boundary';
import { describeUndo, pushUndo, remapUnitId, type UndoOp } from '../lib/undo-stack';

/**
 * The plan map's undo: remembers the last saved operations and reverses the latest with the
 * matching request (create → delete, change → previous values, delete → create again, boundary →
 * previous boundary).
 */
export function usePlanUndo(propertyId: number, hooks: { onUnitGone?: (unitId: number) => void; onUnitBack?: (unitId: number) => void } = {}) {
  const qc = useQueryClient();
  const [stack, setStack] = useState<UndoOp[]>([]);
  const stackRef = useRef<UndoOp[]>([]);
  const [busy, setBusy] = useState(false);
  const busyRef = useRef(false);
  const hooksRef = useRef(hooks);
  hooksRef.current = hooks;

  const commit = (next: UndoOp[]) => {
    stackRef.current = next;
    setStack(next);
  };

  const record = useCallback((op: UndoOp) => commit(pushUndo(stackRef.current, op)), []);

  const undo = useCallback(async (): Promise<string | null> => {
    const op = stackRef.current[stackRef.current.length - 1];
    if (!op || busyRef.current) return null;
    busyRef.current = true;
    setBusy(true);
    const label = describeUndo(op).replace(/^Undo: /, '');
    try {
      let rest = stackRef.current.slice(0, -1);
      switch (op.type) {
        case 'create':
          await deleteUnit(op.unitId);
          applyUnitChanges(qc, propertyId, { remove: [op.unitId] });
          hooksRef.current.onUnitGone?.(op.unitId);
          break;
        case 'create-many':
          for (const id of op.unitIds) await deleteUnit(id);
          applyUnitChanges(qc, propertyId, { remove: op.unitIds });
          op.unitIds.forEach((id) => hooksRef.current.onUnitGone?.(id));
          break;
        case 'update': {
          // Undo puts back what was saved before, confirmed then if it was large.
          const unit = await updateUnit(op.unitId, { ...op.before, confirmLargeArea: true });
          applyUnitChanges(qc, propertyId, { upsert: [unit] });
          break;
        }
        case 'delete': {
          const unit = await createUnit(propertyId, { ...op.unit, confirmLargeArea: true });
          applyUnitChanges(qc, propertyId, { upsert: [unit] });
          rest = remapUnitId(rest, op.unitId, unit.id);
          hooksRef.current.onUnitBack?.(unit.id);
          break;
        }
        case 'boundary': {
          const property = await updatePropertyBoundary(propertyId, op.before, true);
          applyProperty(qc, property);
          break;
        }
      }
      commit(rest);
      return label;
    } finally {
      busyRef.current = false;
      setBusy(false);
    }
  }, [qc, propertyId]);

  return { record, undo, busy, canUndo: stack.length > 0, title: describeUndo(stack[stack.length - 1]) };
}
