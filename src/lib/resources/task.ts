/**
 * The one query-options module of GET /api/tasks/:id, shared by the schedule and the field sheet
 * (and the field task's route loader): one key, one fetcher, one answer type.
 * It lives in src/lib because features never import each other (lint zones).
 */
import { queryOptions } from '@tanstack/react-query';
import type { Geometry } from 'geojson';
import { getData } from '../api-client';
import type { TaskDto } from '../../../shared/schemas/task';

/** A task as GET /api/tasks/:id answers it: the shared task answer, plus the unit's outline when asked for. */
export type TaskDetail = TaskDto & { unitGeometry?: Geometry | null };

/** Query keys of one task (under ['tasks'], so a write that refreshes task lists refreshes it too). */
export const taskKeys = {
  detail: (taskId: number) => ['tasks', 'detail', taskId] as const,
};

/** GET /api/tasks/:id: one task with its photos and completion. */
export const getTask = (taskId: number, signal?: AbortSignal) => getData<TaskDetail>(`/api/tasks/${taskId}`, signal);

/** The query options of one task, for hooks and loaders alike. */
export const getTaskQueryOptions = (taskId: number) => queryOptions({ queryKey: taskKeys.detail(taskId), queryFn: ({ signal }) => getTask(taskId, signal) });
