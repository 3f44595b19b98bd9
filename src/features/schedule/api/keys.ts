/** Query keys of the schedule, hierarchical so that ['tasks'] invalidates every list and detail. */
import { taskKeys } from '../../../lib/resources/task';
import type { TaskListQuery } from '../../../../shared/schemas/task';

export const scheduleKeys = {
  all: ['tasks'] as const,
  list: (query: TaskListQuery) => ['tasks', 'list', query] as const,
  detail: taskKeys.detail,
  progress: (propertyId: number) => ['progress', { propertyId }] as const,
};
