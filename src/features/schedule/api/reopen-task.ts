import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { TaskDto } from '../../../../shared/schemas/task';
import { scheduleKeys } from './keys';

/** POST /api/tasks/:id/reopen: a done or skipped task back on the schedule. */
export const reopenTask = (taskId: number) => api.post<{ data: TaskDto }>(`/api/tasks/${taskId}/reopen`).then((r) => r.data);

/** Reopens a task, then refreshes the lists, the task and its property's progress. */
export function useReopenTask() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: reopenTask,
    onSuccess: (task) => {
      qc.setQueryData(scheduleKeys.detail(task.id), task);
      void qc.invalidateQueries({ queryKey: scheduleKeys.all });
      void qc.invalidateQueries({ queryKey: scheduleKeys.progress(task.propertyId) });
    },
  });
}
