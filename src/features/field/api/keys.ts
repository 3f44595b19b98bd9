/** Query keys of the field sheet (tasks share the ['tasks'] prefix with the schedule, so a write refreshes both). */
import { taskKeys } from '../../../lib/resources/task';
export const fieldKeys = {
  tasks: ['tasks'] as const,
  mine: ['tasks', 'mine'] as const,
  task: taskKeys.detail,
  feeds: ['calendar-feeds'] as const,
};
