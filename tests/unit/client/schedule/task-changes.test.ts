import { describe, expect, it } from 'vitest';
import { taskChanges } from '../../../../src/features/schedule/lib/task-changes';
import { TaskUpdateSchema } from '../../../../shared/schemas/task';

const saved = { assigneeId: null, startDate: null, endDate: null, notes: null };

describe('taskChanges (what the schedule panel sends on Save)', () => {
  it('sends a crew member and a note picked before the first Save, by value', () => {
    const input = taskChanges(saved, { assigneeId: 7, startDate: null, endDate: null, notes: 'Gate code 2231' });
    expect(input).toEqual({ assigneeId: 7, notes: 'Gate code 2231' });
    expect(TaskUpdateSchema.parse(input)).toEqual(input);
  });

  it('sends nothing when every field is as saved, blank boxes counting as none', () => {
    expect(taskChanges({ ...saved, assigneeId: 3, notes: 'Bring the seeder' }, { assigneeId: 3, startDate: '' as never, endDate: undefined, notes: '  Bring the seeder ' })).toEqual({});
  });

  it('clears a crew member, a date and a note back to none', () => {
    expect(taskChanges({ assigneeId: 3, startDate: '2026-09-01', endDate: '2026-09-02', notes: 'x' }, { assigneeId: null, startDate: '2026-09-01', endDate: null, notes: '' })).toEqual({
      assigneeId: null,
      endDate: null,
      notes: null,
    });
  });
});
