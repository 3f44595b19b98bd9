/**
 * How task and unit work statuses look in the client: labels and colours from DESIGN.md's tokens,
 * shared by the schedule, the property page and the plan map's "work status" colouring.
 */
import type { TaskStatus, UnitWorkStatus } from '../../shared/domain/tasks';

export const UNIT_WORK_STATUSES: readonly UnitWorkStatus[] = ['no-work', 'not-started', 'in-progress', 'done'];

/** A unit's work status on the plan map and in the ledger: no work grey (rule/slate), not started clay, under way ochre, done moss. */
export const UNIT_STATUS_STYLES: Record<UnitWorkStatus, { label: string; fill: string; stroke: string; fillOpacity: number }> = {
  'no-work': { label: 'No work planned', fill: '#D9D3C3', stroke: '#5B6770', fillOpacity: 0.35 },
  'not-started': { label: 'Not started', fill: '#B5562B', stroke: '#8E3F2A', fillOpacity: 0.35 },
  'in-progress': { label: 'Under way', fill: '#C99A2E', stroke: '#8A6A1F', fillOpacity: 0.55 },
  done: { label: 'Done', fill: '#3F6B3A', stroke: '#2E5029', fillOpacity: 0.7 },
};

export const TASK_STATUS_LABELS: Record<TaskStatus, string> = { planned: 'Planned', scheduled: 'Scheduled', done: 'Done', skipped: 'Skipped' };

// Each pair meets WCAG AA for small text: slate on card 5.7, white on sky 4.7, white on moss 6.2, slate on card.
export const TASK_STATUS_CLASSES: Record<TaskStatus, string> = {
  planned: 'border-slate bg-card text-slate',
  scheduled: 'border-sky bg-sky text-white',
  done: 'border-moss bg-moss text-white',
  skipped: 'border-dashed border-slate bg-rule/40 text-slate',
};
