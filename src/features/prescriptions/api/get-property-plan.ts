import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { PropertyDto } from '../../../../shared/schemas/property';
import type { UnitDto } from '../../../../shared/schemas/unit';
import { prescriptionKeys } from './keys';

/** GET /api/properties/:id. */
export const getPropertyQueryOptions = (propertyId: number) =>
  queryOptions({ queryKey: prescriptionKeys.property(propertyId), queryFn: ({ signal }) => getData<PropertyDto>(`/api/properties/${propertyId}`, signal) });

/** GET /api/properties/:id/units. */
export const getPropertyUnitsQueryOptions = (propertyId: number) =>
  queryOptions({ queryKey: prescriptionKeys.units(propertyId), queryFn: ({ signal }) => getData<UnitDto[]>(`/api/properties/${propertyId}/units`, signal) });

/** A property. */
export const useProperty = (propertyId: number) => useQuery(getPropertyQueryOptions(propertyId));
/** A property's units. */
export const usePropertyUnits = (propertyId: number) => useQuery(getPropertyUnitsQueryOptions(propertyId));
