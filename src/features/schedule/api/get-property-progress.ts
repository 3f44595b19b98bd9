import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { PropertyProgressDto } from '../../../../shared/schemas/task';
import { scheduleKeys } from './keys';

/** The progress answer, with the property's e-mail setting. */
export type PropertyProgress = PropertyProgressDto & { notifyClientOnUnitDone: boolean };

/** GET /api/properties/:id/progress: the plan's and each unit's progress. */
export const getPropertyProgress = (propertyId: number, signal?: AbortSignal) => getData<PropertyProgress>(`/api/properties/${propertyId}/progress`, signal);

export const getPropertyProgressQueryOptions = (propertyId: number) =>
  queryOptions({ queryKey: scheduleKeys.progress(propertyId), queryFn: ({ signal }) => getPropertyProgress(propertyId, signal) });

/** A property's progress (disabled while `enabled` is false). */
export const usePropertyProgress = (propertyId: number, enabled = true) => useQuery({ ...getPropertyProgressQueryOptions(propertyId), enabled });
