import { useQuery } from '@tanstack/react-query';
import { getTaskQueryOptions } from '../../../lib/resources/task';

/** One task: the shared query options of GET /api/tasks/:id (src/lib/resources/task.ts). */
export { getTask, getTaskQueryOptions } from '../../../lib/resources/task';

/** One task (disabled while no task is chosen). */
export const useTask = (taskId: number | null) => useQuery({ ...getTaskQueryOptions(taskId ?? 0), enabled: taskId !== null });
