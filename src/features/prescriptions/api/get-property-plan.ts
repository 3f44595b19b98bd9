import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { UnitDto } from '../../../../shared/schemas/unit';
import { prescriptionKeys } from './keys';

/** GET /api/properties/:id: the shared query options (src/lib/resources/property.ts). */
export { getPropertyQueryOptions, useProperty } from '../../../lib/resources/property';

/** GET /api/properties/:id/units. */
export const getPropertyUnitsQueryOptions = (propertyId: number) =>
  queryOptions({ queryKey: prescriptionKeys.units(propertyId), queryFn: ({ signal }) => getData<UnitDto[]>(`/api/properties/${propertyId}/units`, signal) });

/** A property's units. */
export const usePropertyUnits = (propertyId: number) => useQuery(getPropertyUnitsQueryOptions(propertyId));
