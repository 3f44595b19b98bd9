import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Geometry } from 'geojson';
import { getData } from '../../../lib/api-client';
import type { TaskDto, TaskListDto } from '../../../../shared/schemas/task';
import { fieldKeys } from './keys';

/** A task as the field sheet gets it: with the unit's geometry for the small map. */
export type FieldTask = TaskDto & { unitGeometry?: Geometry | null };

/**
 * The signed-in worker's tasks: a crew member gets only their own (the server sees to it, without
 * prices); staff opening the field sheet ask for the tasks assigned to themselves. The units'
 * outlines come only when asked (`geometry=true`), for the sketches. The sheet keeps its whole list
 * (500, the lists' usual page, not the task list's phone-sized default: LIST_PAGE and TASK_PAGE in
 * shared/schemas, which this zod-free module does not import).
 */
export const getMyTasks = (me: { id: number; role: string }, signal?: AbortSignal) =>
  getData<TaskListDto & { tasks: FieldTask[] }>(me.role === 'crew' ? '/api/tasks?geometry=true&limit=500' : `/api/tasks?assigneeId=${me.id}&geometry=true&limit=500`, signal);

export const getMyTasksQueryOptions = (me: { id: number; role: string }) => queryOptions({ queryKey: fieldKeys.mine, queryFn: ({ signal }) => getMyTasks(me, signal) });

/** The worker's tasks, refreshed every few minutes while the sheet is open. */
export const useMyTasks = (me: { id: number; role: string }, enabled = true) => useQuery({ ...getMyTasksQueryOptions(me), refetchInterval: 5 * 60_000, enabled });
