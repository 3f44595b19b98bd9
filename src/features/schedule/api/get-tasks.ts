import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { TaskListDto, TaskListQuery } from '../../../../shared/schemas/task';
import { scheduleKeys } from './keys';

/** The query string of a task list filter, without empty members. */
export function taskQueryString(query: TaskListQuery): string {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(query)) if (v !== undefined && v !== null && v !== '') params.set(k, String(v));
  const text = params.toString();
  return text ? `?${text}` : '';
}

/** GET /api/tasks: the firm's tasks matching the filter, with the schedule's warnings. */
export const getTasks = (query: TaskListQuery, signal?: AbortSignal) => getData<TaskListDto>(`/api/tasks${taskQueryString(query)}`, signal);

export const getTasksQueryOptions = (query: TaskListQuery) =>
  queryOptions({ queryKey: scheduleKeys.list(query), queryFn: ({ signal }) => getTasks(query, signal), placeholderData: keepPreviousData });

/** Tasks for a filter; the previous answer stays on screen while a new filter loads. */
export const useTasks = (query: TaskListQuery, enabled = true) => useQuery({ ...getTasksQueryOptions(query), enabled });
