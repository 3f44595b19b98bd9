import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { PlotStatusDto } from '../../../../shared/schemas/checks';
import { checksKeys } from './keys';

/** GET /api/properties/:id/plot-statuses: the latest check status of each checked unit. */
export const getPlotStatuses = (propertyId: number, signal?: AbortSignal) => getData<PlotStatusDto[]>(`/api/properties/${propertyId}/plot-statuses`, signal);

export const getPlotStatusesQueryOptions = (propertyId: number) =>
  queryOptions({ queryKey: checksKeys.plotStatuses(propertyId), queryFn: ({ signal }) => getPlotStatuses(propertyId, signal) });

/** The plot statuses of a property (staff, or the client who owns it). */
export const usePlotStatuses = (propertyId: number) => useQuery({ ...getPlotStatusesQueryOptions(propertyId), enabled: propertyId > 0 });
