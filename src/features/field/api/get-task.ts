import { queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import { fieldKeys } from './keys';
import type { FieldTask } from './get-my-tasks';

/** One task with the unit's geometry and photos. */
export const getTask = (id: number, signal?: AbortSignal) => getData<FieldTask>(`/api/tasks/${id}`, signal);

export const getTaskQueryOptions = (id: number) => queryOptions({ queryKey: fieldKeys.task(id), queryFn: ({ signal }) => getTask(id, signal) });

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
