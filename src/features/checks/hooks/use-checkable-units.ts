import { useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { UnitDto } from '../../../../shared/schemas/unit';
import { KIND_STYLES } from '../../../../shared/domain/unit-kinds';

const CHECKABLE: readonly string[] = ['food-plot', 'cover-planting', 'timber', 'bedding-area'];

/** The area units of a property that can carry checks (plantings, plots, timber), by name. */
export function useCheckableUnits(propertyId: number): { id: number; name: string }[] {
  const units = useQuery({
    queryKey: ['checks', 'checkable-units', { propertyId }],
    queryFn: ({ signal }) => getData<UnitDto[]>(`/api/properties/${propertyId}/units`, signal),
    enabled: propertyId > 0,
    staleTime: 60_000,
  });
  return (units.data ?? [])
    .filter((u) => KIND_STYLES[u.kind].family === 'area' && CHECKABLE.includes(u.kind))
    .map((u) => ({ id: u.id, name: u.name }))
    .sort((a, b) => a.name.localeCompare(b.name));
}
