import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { fieldBucket, plannedOrScheduled, progressByUnit, progressOf, splitCents, stepCostCents, taskWarnings, unitWorkStatus, weekStart, type ScheduledTask } from '../../shared/domain/tasks';

const task = (over: Partial<ScheduledTask> & { id: number }): ScheduledTask => ({
  prescriptionId: 1,
  stepKey: `s${over.id}`,
  name: `Step ${over.id}`,
  unitName: 'North plot',
  status: 'planned',
  earliest: '2026-08-01',
  latest: '2026-08-31',
  startDate: null,
  endDate: null,
  dependsOn: [],
  ...over,
});

describe('splitting cents', () => {
  it('splits by largest remainder: 100 cents in three equal parts is 34, 33, 33', () => {
    // Hamilton's largest-remainder method (common practice for splitting money, no source).
    expect(splitCents(100, [1, 1, 1])).toEqual([34, 33, 33]);
    // 1001 × (1, 2, 2)/5 = 200.2, 400.4, 400.4: the spare cent goes to the first largest remainder.
    expect(splitCents(1001, [1, 2, 2])).toEqual([200, 401, 400]);
    expect(splitCents(500, [0, 0])).toEqual([500, 0]);
  });

  it('always adds up to the whole and never goes negative (property test)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000_000 }), fc.array(fc.integer({ min: 0, max: 1000 }), { minLength: 1, maxLength: 12 }), (total, weights) => {
        const parts = splitCents(total, weights);
        expect(parts.reduce((a, b) => a + b, 0)).toBe(total);
        expect(parts.every((p) => Number.isInteger(p) && p >= 0)).toBe(true);
      }),
    );
  });

  it('gives each step its own lines and splits pooled lines between their steps', () => {
    const lines = [
      { stepKeys: ['seed'], amountCents: 10_000 },
      { stepKeys: ['prep', 'seed'], amountCents: 1_001 },
      { stepKeys: ['spray'], amountCents: 2_500 },
    ] as never;
    const cost = stepCostCents({ lines }, ['prep', 'seed', 'spray']);
    expect(cost).toEqual({ prep: 501, seed: 10_500, spray: 2_500 });
    expect(Object.values(cost).reduce((a, b) => a + b, 0)).toBe(13_501);
  });
});

describe('schedule warnings', () => {
  it('flags a missed window, a closing window and dates outside the window', () => {
    const w = taskWarnings(
      [
        task({ id: 1, latest: '2026-07-31', earliest: '2026-07-01' }),
        task({ id: 2, latest: '2026-08-05' }),
        task({ id: 3, startDate: '2026-09-10' }),
        task({ id: 4, latest: '2026-07-31', earliest: '2026-07-01', status: 'done' }),
      ],
      '2026-08-01',
    );
    expect(w.map((x) => [x.taskId, x.code])).toEqual([
      [1, 'window-missed'],
      [2, 'window-closing'],
      [3, 'outside-window'],
    ]);
    expect(w[0].message).toMatch(/closed on Jul 31, 2026/);
  });

  it('flags a step set before the step it depends on, or while that step has no date', () => {
    const prep = task({ id: 1, stepKey: 'prep', startDate: '2026-08-20', endDate: '2026-08-21' });
    const seed = task({ id: 2, stepKey: 'seed', dependsOn: ['prep'], startDate: '2026-08-15' });
    expect(taskWarnings([prep, seed], '2026-08-01').filter((x) => x.code === 'before-dependency').map((x) => x.taskId)).toEqual([2]);
    const later = task({ id: 2, stepKey: 'seed', dependsOn: ['prep'], startDate: '2026-08-22' });
    expect(taskWarnings([prep, later], '2026-08-01').some((x) => x.code === 'before-dependency')).toBe(false);
    const undated = task({ id: 1, stepKey: 'prep' });
    expect(taskWarnings([undated, later], '2026-08-01').find((x) => x.code === 'before-dependency')?.message).toMatch(/has no date yet/);
    // A skipped dependency is no obstacle; a done one counts from the day it was done.
    expect(taskWarnings([{ ...prep, status: 'skipped' }, seed], '2026-08-01').some((x) => x.code === 'before-dependency')).toBe(false);
    expect(taskWarnings([{ ...prep, status: 'done', doneOn: '2026-08-10' }, seed], '2026-08-01').some((x) => x.code === 'before-dependency')).toBe(false);
  });
});

describe('the crew’s week', () => {
  it('starts weeks on Monday (ISO 8601)', () => {
    // 2026-12-02 is a Wednesday; 2026-12-06 a Sunday; 2026-12-07 a Monday (checked against a printed calendar, from memory).
    expect(weekStart('2026-12-02')).toBe('2026-11-30');
    expect(weekStart('2026-12-06')).toBe('2026-11-30');
    expect(weekStart('2026-12-07')).toBe('2026-12-07');
  });

  it('sorts tasks into overdue, this week, upcoming and finished', () => {
    const today = '2026-12-02';
    expect(fieldBucket(task({ id: 1, startDate: '2026-11-29', endDate: '2026-11-29', earliest: '2026-10-01', latest: '2026-12-31' }), today)).toBe('overdue');
    expect(fieldBucket(task({ id: 2, startDate: '2026-12-06', earliest: '2026-10-01', latest: '2026-12-31' }), today)).toBe('this-week');
    expect(fieldBucket(task({ id: 3, startDate: '2026-12-07', earliest: '2026-10-01', latest: '2026-12-31' }), today)).toBe('upcoming');
    expect(fieldBucket(task({ id: 4, earliest: '2026-10-01', latest: '2026-11-30' }), today)).toBe('overdue');
    expect(fieldBucket(task({ id: 5, status: 'done', startDate: '2026-11-01' }), today)).toBe('finished');
  });
});

describe('progress', () => {
  it('counts done tasks by count and by cost; skipped tasks leave both sides', () => {
    const p = progressOf([
      { status: 'done', costCents: 30_000, unitId: 1 },
      { status: 'planned', costCents: 10_000, unitId: 1 },
      { status: 'scheduled', costCents: 10_000, unitId: 2 },
      { status: 'skipped', costCents: 50_000, unitId: 2 },
    ]);
    expect(p).toMatchObject({ total: 4, done: 1, skipped: 1, open: 2, percentByCount: 33.3, doneCostCents: 30_000, totalCostCents: 50_000, percentByCost: 60 });
    expect(progressOf([])).toMatchObject({ percentByCount: 0, percentByCost: 0 });
  });

  it('gives each unit a work status', () => {
    expect(unitWorkStatus([])).toBe('no-work');
    expect(unitWorkStatus([{ status: 'planned' }, { status: 'scheduled' }])).toBe('not-started');
    expect(unitWorkStatus([{ status: 'done' }, { status: 'scheduled' }])).toBe('in-progress');
    expect(unitWorkStatus([{ status: 'done' }, { status: 'skipped' }])).toBe('done');
    const byUnit = progressByUnit([
      { status: 'done', costCents: 1, unitId: 7 },
      { status: 'planned', costCents: 1, unitId: 8 },
      { status: 'done', costCents: 1, unitId: null },
    ]);
    expect([...byUnit.keys()]).toEqual([7, 8]);
    expect(byUnit.get(7)?.status).toBe('done');
  });

  it('schedules a task once it has both a crew member and a date', () => {
    expect(plannedOrScheduled(3, '2026-08-01')).toBe('scheduled');
    expect(plannedOrScheduled(null, '2026-08-01')).toBe('planned');
    expect(plannedOrScheduled(3, null)).toBe('planned');
  });
});
