import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { PrescriptionDto } from '../lib/types';
import { prescriptionKeys } from './keys';

/** GET /api/units/:id/prescriptions. */
export const getUnitPrescriptions = (unitId: number, signal?: AbortSignal) => getData<PrescriptionDto[]>(`/api/units/${unitId}/prescriptions`, signal);

export const getUnitPrescriptionsQueryOptions = (unitId: number) =>
  queryOptions({ queryKey: prescriptionKeys.unit(unitId), queryFn: ({ signal }) => getUnitPrescriptions(unitId, signal) });

/** A unit's prescriptions, oldest first. */
export const useUnitPrescriptions = (unitId: number) => useQuery(getUnitPrescriptionsQueryOptions(unitId));
