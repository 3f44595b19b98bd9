import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { fieldKeys } from './keys';
import type { FieldTask } from './get-my-tasks';

/** Skips a task with the reason the crew gives. */
export const skipTask = async ({ id, reason }: { id: number; reason: string }) => (await api.post<{ data: FieldTask }>(`/api/tasks/${id}/skip`, { reason })).data;

/** Skips a task, then refreshes the task lists. */
export function useSkipTask() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: skipTask,
    onSuccess: (task) => {
      qc.setQueryData(fieldKeys.task(task.id), task);
      return qc.invalidateQueries({ queryKey: fieldKeys.tasks });
    },
  });
}
