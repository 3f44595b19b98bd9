import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { TaskDto, TaskUpdateInput } from '../../../../shared/schemas/task';
import { scheduleKeys } from './keys';

/** PATCH /api/tasks/:id: assign, move or annotate a task. */
export const updateTask = (taskId: number, input: TaskUpdateInput) => api.patch<{ data: TaskDto }>(`/api/tasks/${taskId}`, input).then((r) => r.data);

/** Saves a task's crew member, dates or notes, then refreshes every task list, the task and its property's progress. */
export function useUpdateTask() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ taskId, input }: { taskId: number; input: TaskUpdateInput }) => updateTask(taskId, input),
    onSuccess: (task) => {
      qc.setQueryData(scheduleKeys.detail(task.id), task);
      void qc.invalidateQueries({ queryKey: scheduleKeys.all });
      void qc.invalidateQueries({ queryKey: scheduleKeys.progress(task.propertyId) });
    },
  });
}
