import { useEffect, useMemo, useRef, type RefObject } from 'react';
import { bboxOf } from '../../../../shared/domain/geometry';
import type { HomeArea } from '../../../../shared/schemas/firm';
import type { PlanMapController } from '../lib/plan-map-controller';
import type { ColourBy } from '../lib/plan-layers';
import type { PlanMapData } from './use-plan-map-data';

/**
 * Hands the page's data to the map controller whenever it changes: units, colours, photo points,
 * snap targets, boundary and graticule, overlays (visible ones), imagery tiles; keeps the search
 * box and chips clear when fitting; and fits the view once per property — on the boundary, else
 * the units, else the firm's home area (a new property opens where the firm works).
 */
export function useMapSync(controller: PlanMapController | null, propertyId: number, data: PlanMapData, colourBy: ColourBy, chipsRef: RefObject<HTMLDivElement | null>) {
  const { collections, photoPoints, boundary, boundaryBox, unitList, overlays, firm, property, units } = data;
  useEffect(() => controller?.setColourBy(colourBy), [controller, colourBy]);
  useEffect(() => controller?.setPhotoPoints(photoPoints), [controller, photoPoints]);
  useEffect(() => controller?.setUnits(collections), [controller, collections]);
  // New corners snap to the boundary's corners and to other units' corners.
  useEffect(() => controller?.setSnapTargets([...(boundary ? [boundary] : []), ...unitList.map((u) => u.geometry)]), [controller, boundary, unitList]);
  // Without a boundary the graticule is laid around the units instead.
  const unitsBox = useMemo(() => (boundaryBox ? null : bboxOf(unitList.map((u) => u.geometry))), [boundaryBox, unitList]);
  const gridKey = JSON.stringify(boundaryBox ?? unitsBox);
  const gridBox = useMemo(() => JSON.parse(gridKey) as ReturnType<typeof bboxOf>, [gridKey]);
  useEffect(() => controller?.setBoundary(boundary, gridBox), [controller, boundary, gridBox]);

  // Keep the search box and the chips clear when fitting the view.
  useEffect(() => {
    const el = chipsRef.current;
    if (!controller || !el) return;
    const observer = new ResizeObserver(() => controller.setInsetTop(el.offsetTop + el.offsetHeight + 8));
    observer.observe(el);
    controller.setInsetTop(el.offsetTop + el.offsetHeight + 8);
    return () => observer.disconnect();
  }, [controller, chipsRef]);

  // Fit once per property, when the boundary (or, without one, the units; without those, the home area) first arrive.
  const homeArea: HomeArea | null = firm.data?.settings.homeArea ?? null;
  const fitted = useRef<number | null>(null);
  useEffect(() => {
    if (!controller || fitted.current === propertyId || !property.data || !units.data || firm.isPending) return;
    const box = boundaryBox ?? bboxOf(units.data.map((u) => u.geometry)) ?? homeArea?.bbox ?? null;
    controller.fitTo(box);
    fitted.current = propertyId;
  }, [controller, propertyId, property.data, units.data, boundaryBox, homeArea, firm.isPending]);

  const visibleOverlays = useMemo(() => (overlays.data ?? []).filter((o) => o.visible), [overlays.data]);
  useEffect(() => controller?.setOverlays(visibleOverlays), [controller, visibleOverlays]);
  const tileTemplate = firm.data?.settings.tileUrlTemplate ?? null;
  const tileAttribution = firm.data?.settings.tileAttribution ?? null;
  useEffect(() => controller?.setTiles(tileTemplate, tileAttribution), [controller, tileTemplate, tileAttribution]);
  return { tileTemplate, homeArea };
}
