import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { PlanSummary } from '../../../../shared/schemas/unit';
import { planMapKeys } from './keys';

/** GET /api/properties/:id/plan: acres by kind and the plan warnings. */
export const getPlan = (propertyId: number, signal?: AbortSignal) => getData<PlanSummary>(`/api/properties/${propertyId}/plan`, signal);

export const getPlanQueryOptions = (propertyId: number) =>
  queryOptions({ queryKey: planMapKeys.plan(propertyId), queryFn: ({ signal }) => getPlan(propertyId, signal) });

/** The plan summary of a property. */
export const usePlan = (propertyId: number) => useQuery(getPlanQueryOptions(propertyId));
