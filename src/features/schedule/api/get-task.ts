import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { TaskDto } from '../../../../shared/schemas/task';
import { scheduleKeys } from './keys';

/** GET /api/tasks/:id: one task with its photos and completion. */
export const getTask = (taskId: number, signal?: AbortSignal) => getData<TaskDto>(`/api/tasks/${taskId}`, signal);

export const getTaskQueryOptions = (taskId: number) => queryOptions({ queryKey: scheduleKeys.detail(taskId), queryFn: ({ signal }) => getTask(taskId, signal) });

/** One task (disabled while no task is chosen). */
export const useTask = (taskId: number | null) => useQuery({ ...getTaskQueryOptions(taskId ?? 0), enabled: taskId !== null });
