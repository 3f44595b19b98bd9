import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { PrescriptionDto } from '../lib/types';
import { prescriptionKeys } from './keys';

/** GET /api/properties/:id/prescriptions. */
export const getPropertyPrescriptions = (propertyId: number, signal?: AbortSignal) => getData<PrescriptionDto[]>(`/api/properties/${propertyId}/prescriptions`, signal);

export const getPropertyPrescriptionsQueryOptions = (propertyId: number) =>
  queryOptions({ queryKey: prescriptionKeys.forProperty(propertyId), queryFn: ({ signal }) => getPropertyPrescriptions(propertyId, signal) });

/** Every prescription on a property, by unit. */
export const usePropertyPrescriptions = (propertyId: number) => useQuery(getPropertyPrescriptionsQueryOptions(propertyId));
