import { useQuery, useQueryClient } from '@tanstack/react-query';
import { getTaskQueryOptions } from '../../../lib/resources/task';
import { fieldKeys } from './keys';
import type { FieldTask } from './get-my-tasks';

/** One task: the shared query options of GET /api/tasks/:id (src/lib/resources/task.ts). */
export { getTask, getTaskQueryOptions } from '../../../lib/resources/task';

/** One task; starts from the list's copy (already on the phone), so it shows with no signal. */
export function useTask(id: number) {
  const qc = useQueryClient();
  return useQuery({
    ...getTaskQueryOptions(id),
    enabled: id > 0,
    initialData: () => qc.getQueryData<{ tasks: FieldTask[] }>(fieldKeys.mine)?.tasks.find((t) => t.id === id),
    initialDataUpdatedAt: () => qc.getQueryState(fieldKeys.mine)?.dataUpdatedAt,
  });
}
