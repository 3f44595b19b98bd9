/**
 * The landowner's plan map: the plan-map feature's layers, symbols and offline style in a read-only
 * MapLibre map (pan and zoom only, no drawing tools). A lazy chunk: maplibre loads only on the pages
 * that show a map.
 */
import { useEffect, useRef, useState } from 'react';
import { LngLatBounds, Map as MapLibreMap, NavigationControl } from 'maplibre-gl';
import type { Geometry, MultiPolygon, Polygon } from 'geojson';
import { bboxOf } from '../../../../shared/domain/geometry';
import { kindFamily, type UnitKind } from '../../../../shared/domain/unit-kinds';
import type { PortalPropertyDetail } from '../../../../shared/schemas/portal';
import { offlineStyle } from '../../../features/plan-map/lib/map-style';
import { addPlanLayers, setBoundaryData, setUnitData } from '../../../features/plan-map/lib/plan-layers';
import { addBaseLayer } from '../../../features/plan-map/lib/base-layer';
import { kindsPresent, unitsToCollections, type MapUnit } from '../../../features/plan-map/lib/unit-features';
import { LegendList } from '../../../features/plan-map/components/legend-list';
import '../../../features/plan-map/lib/maplibre-worker';

/** Read-only plan map with its legend. */
export default function PortalPlanMap({ detail }: { detail: PortalPropertyDetail }) {
  const holder = useRef<HTMLDivElement>(null);
  const [failed, setFailed] = useState<string | null>(null);
  const units: MapUnit[] = detail.units.map((u) => ({ id: u.id, kind: u.kind as UnitKind, family: kindFamily(u.kind as UnitKind), name: u.name, geometry: u.geometry as unknown as Geometry, acres: u.acres, lengthFt: u.lengthFt }));
  const boundary = detail.property.boundary as unknown as Polygon | MultiPolygon | null;
  const kinds = kindsPresent(units);

  useEffect(() => {
    if (!holder.current) return;
    const box = bboxOf(boundary ? [boundary] : units.map((u) => u.geometry));
    let map: MapLibreMap | null = null;
    try {
      map = new MapLibreMap({ container: holder.current, style: offlineStyle(), attributionControl: false, dragRotate: false, pitchWithRotate: false, cooperativeGestures: true, fadeDuration: 0 });
    } catch (err) {
      setFailed((err as Error).message || 'This browser cannot draw the map (WebGL is off).');
      return;
    }
    map.addControl(new NavigationControl({ showCompass: false }), 'top-right');
    map.on('error', (e) => setFailed(e.error?.message ?? 'The map could not be drawn.'));
    map.once('load', () => {
      if (!map) return;
      addPlanLayers(map, { labels: true });
      addBaseLayer(map, 'boundary-fill');
      setBoundaryData(map, boundary, box as [number, number, number, number] | null);
      setUnitData(map, unitsToCollections(units));
      if (box) map.fitBounds(new LngLatBounds([box[0], box[1]], [box[2], box[3]]), { padding: 24, animate: false, maxZoom: 18 });
      // The canvas is a keyboard stop (arrows pan, + and − zoom): name it for screen readers.
      map.getCanvas().setAttribute('aria-label', `Plan map of ${detail.property.name}. Arrow keys pan, plus and minus zoom.`);
      map.once('idle', () => holder.current?.setAttribute('data-ready', 'true'));
    });
    return () => map?.remove();
    // The map is made once per property answer.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [detail]);

  return (
    <figure className="flex flex-col gap-2">
      {failed ? (
        <p role="alert" className="rounded border border-clay/40 bg-clay/5 px-3 py-2 text-sm">
          The map could not be shown: {failed} The units are listed below.
        </p>
      ) : null}
      <div ref={holder} className="h-72 w-full overflow-hidden rounded-md border border-rule bg-paper sm:h-96" data-testid="portal-plan-map" />
      <figcaption>
        <h3 className="mb-1 text-sm font-bold">Legend</h3>
        <LegendList kinds={kinds} hasBoundary={!!boundary} className="grid grid-cols-2 gap-x-4 text-sm sm:grid-cols-3" />
      </figcaption>
    </figure>
  );
}
