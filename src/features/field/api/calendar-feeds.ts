import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, getData } from '../../../lib/api-client';
import type { CalendarFeedDto } from '../../../../shared/schemas/task';
import { fieldKeys } from './keys';

/** The signed-in worker's active calendar feeds (their URLs are not shown again). */
export const getCalendarFeedsQueryOptions = () => queryOptions({ queryKey: fieldKeys.feeds, queryFn: ({ signal }) => getData<CalendarFeedDto[]>('/api/calendar-feeds', signal) });
export const useCalendarFeeds = () => useQuery(getCalendarFeedsQueryOptions());

/** Makes a new private feed; the answer carries its URL, once. */
export function useCreateCalendarFeed() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async () => (await api.post<{ data: CalendarFeedDto }>('/api/calendar-feeds')).data,
    onSuccess: () => qc.invalidateQueries({ queryKey: fieldKeys.feeds }),
  });
}

/** Revokes a feed: calendar apps holding its URL get nothing more. */
export function useRevokeCalendarFeed() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api.delete<void>(`/api/calendar-feeds/${id}`),
    onSuccess: () => qc.invalidateQueries({ queryKey: fieldKeys.feeds }),
  });
}
