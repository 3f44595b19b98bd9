import { describe, expect, it } from 'vitest';
import { describeUndo, pushUndo, remapUnitId, UNDO_LIMIT, type UndoOp } from '../../../../src/features/plan-map/lib/undo-stack';

const point = { type: 'Point' as const, coordinates: [-90.9, 43.27] };

describe('the plan map undo stack', () => {
  it('keeps the newest operations up to its limit', () => {
    let stack: UndoOp[] = [];
    for (let i = 1; i <= UNDO_LIMIT + 5; i += 1) stack = pushUndo(stack, { type: 'create', unitId: i, name: `Unit ${i}` });
    expect(stack).toHaveLength(UNDO_LIMIT);
    // The five oldest were dropped: the bottom is unit 6, the top the last pushed (common practice, no source).
    expect(stack[0]).toMatchObject({ unitId: 6 });
    expect(stack[stack.length - 1]).toMatchObject({ unitId: UNDO_LIMIT + 5 });
  });

  it('rewrites older entries to the new id when a deleted unit is created again', () => {
    const stack: UndoOp[] = [
      { type: 'create', unitId: 5, name: 'Stand 1' },
      { type: 'update', unitId: 5, name: 'Stand 1', before: { geometry: point } },
      { type: 'create-many', unitIds: [4, 5, 6] },
      { type: 'update', unitId: 7, name: 'Other', before: { name: 'Old' } },
      { type: 'boundary', before: null },
    ];
    const next = remapUnitId(stack, 5, 42);
    expect(next[0]).toMatchObject({ unitId: 42 });
    expect(next[1]).toMatchObject({ unitId: 42 });
    expect(next[2]).toEqual({ type: 'create-many', unitIds: [4, 42, 6] });
    expect(next[3]).toBe(stack[3]);
    expect(next[4]).toBe(stack[4]);
  });

  it('says what the next undo would do', () => {
    expect(describeUndo(undefined)).toBe('Nothing to undo');
    expect(describeUndo({ type: 'create', unitId: 1, name: 'Food plot 3' })).toBe('Undo: add Food plot 3');
    expect(describeUndo({ type: 'delete', unitId: 1, name: 'Pond', unit: { kind: 'water', name: 'Pond', geometry: point } })).toBe('Undo: delete Pond');
    expect(describeUndo({ type: 'create-many', unitIds: [1, 2, 3] })).toBe('Undo: import of 3 units');
  });
});
