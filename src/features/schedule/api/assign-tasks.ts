import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { TaskAssignInput, TaskDto } from '../../../../shared/schemas/task';
import { scheduleKeys } from './keys';

/** POST /api/tasks/assign: several tasks to one person (or to nobody), all or nothing. */
export const assignTasks = (input: TaskAssignInput) => api.post<{ data: TaskDto[] }>('/api/tasks/assign', input).then((r) => r.data);

/** Assigns the selected tasks, then refreshes every task list and each task. */
export function useAssignTasks() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: assignTasks,
    onSuccess: (tasks) => {
      for (const t of tasks) qc.setQueryData(scheduleKeys.detail(t.id), t);
      void qc.invalidateQueries({ queryKey: scheduleKeys.all });
    },
  });
}
