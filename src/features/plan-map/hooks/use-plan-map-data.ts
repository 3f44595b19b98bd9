import { useMemo } from 'react';
import { bboxOf } from '../../../../shared/domain/geometry';
import type { UnitWorkStatus } from '../../../../shared/domain/tasks';
import { useProperty } from '../api/get-property';
import { useUnits } from '../api/get-units';
import { usePlan } from '../api/get-plan';
import { useFirm } from '../api/get-firm';
import { useOverlays } from '../api/get-overlays';
import { kindsPresent, unitsToCollections } from '../lib/unit-features';
import type { ColourBy } from '../lib/plan-layers';

/** Work read by another feature (the schedule), handed in by the page: per-unit statuses and the crew's done tasks with photos. */
export interface PlanWorkData {
  unitStatuses?: readonly { unitId: number; status: UnitWorkStatus }[];
  doneTasks?: readonly { name: string; unitName: string; photos: readonly { id: number; latitude: number | null; longitude: number | null }[] }[];
}

/**
 * Everything the plan map page reads, and what is derived from it once per change: the units as
 * map collections, the work statuses, the crew's photo points, the boundary and its box.
 */
export function usePlanMapData(propertyId: number, colourBy: ColourBy, work: PlanWorkData) {
  const valid = Number.isInteger(propertyId) && propertyId > 0;
  const property = useProperty(propertyId);
  const units = useUnits(propertyId);
  const plan = usePlan(propertyId);
  const firm = useFirm();
  const overlays = useOverlays(propertyId);

  const unitList = useMemo(() => units.data ?? [], [units.data]);
  const boundary = property.data?.boundary ?? null;
  const statuses = useMemo(() => new Map<number, UnitWorkStatus>((work.unitStatuses ?? []).map((u) => [u.unitId, u.status])), [work.unitStatuses]);
  const collections = useMemo(() => unitsToCollections(unitList, statuses), [unitList, statuses]);
  const photoPoints = useMemo(
    () =>
      colourBy === 'status'
        ? (work.doneTasks ?? []).flatMap((t) =>
            t.photos.filter((p) => p.latitude !== null && p.longitude !== null).map((p) => ({ id: p.id, lon: p.longitude as number, lat: p.latitude as number, label: `${t.name}, ${t.unitName}` })),
          )
        : [],
    [colourBy, work.doneTasks],
  );
  const legendKinds = useMemo(() => kindsPresent(unitList), [unitList]);
  const boundaryBox = useMemo(() => (boundary ? bboxOf([boundary]) : null), [boundary]);
  return { valid, property, units, plan, firm, overlays, unitList, boundary, boundaryBox, statuses, collections, photoPoints, legendKinds };
}

export type PlanMapData = ReturnType<typeof usePlanMapData>;
