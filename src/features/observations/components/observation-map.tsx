/**
 * A map of a property's observations on its own (the property page and the portal's Results): the
 * boundary on plain paper, the observations layer with its kind filter and time slider, and — when
 * `onTap` is given — a tap that hands its position to the log form. A lazy chunk (MapLibre).
 */
import { useEffect, useRef, useState } from 'react';
import { Map as MapLibreMap, type LngLatBoundsLike } from 'maplibre-gl';
import type { MultiPolygon, Polygon, Position } from 'geojson';
import '../lib/maplibre-worker';
import { useObservations } from '../api/get-observations';
import { ObservationsLayer } from './observations-layer';

const PAPER = '#F4F1E8';
const INK = '#1F2A24';

function extend(box: [number, number, number, number] | null, p: Position): [number, number, number, number] {
  if (!box) return [p[0], p[1], p[0], p[1]];
  return [Math.min(box[0], p[0]), Math.min(box[1], p[1]), Math.max(box[2], p[0]), Math.max(box[3], p[1])];
}

export default function ObservationMap({ propertyId, boundary, onTap, heightClass = 'h-80' }: { propertyId: number; boundary?: Polygon | MultiPolygon | null; onTap?: (p: { lon: number; lat: number }) => void; heightClass?: string }) {
  const ref = useRef<HTMLDivElement>(null);
  const [map, setMap] = useState<MapLibreMap | null>(null);
  const [tapped, setTapped] = useState<{ lon: number; lat: number } | null>(null);
  const observations = useObservations(propertyId);
  const tapRef = useRef(onTap);
  tapRef.current = onTap;

  useEffect(() => {
    if (!ref.current) return;
    const m = new MapLibreMap({
      container: ref.current,
      style: { version: 8, sources: {}, layers: [{ id: 'paper', type: 'background', paint: { 'background-color': PAPER } }] },
      center: [-90, 43],
      zoom: 13,
      attributionControl: false,
    });
    m.on('click', (e) => {
      if (!tapRef.current) return;
      // A tap on a cluster or a symbol still counts as a position for a new sign.
      const p = { lon: e.lngLat.lng, lat: e.lngLat.lat };
      setTapped(p);
      tapRef.current(p);
    });
    m.once('load', () => setMap(m));
    return () => {
      setMap(null);
      m.remove();
    };
  }, []);

  useEffect(() => {
    if (!map) return;
    const data = boundary ? { type: 'Feature' as const, geometry: boundary, properties: {} } : { type: 'FeatureCollection' as const, features: [] };
    const source = map.getSource('boundary') as { setData?: (d: unknown) => void } | undefined;
    if (source?.setData) source.setData(data);
    else {
      map.addSource('boundary', { type: 'geojson', data });
      map.addLayer({ id: 'boundary-line', type: 'line', source: 'boundary', paint: { 'line-color': INK, 'line-width': 2 } });
    }
  }, [map, boundary]);

  useEffect(() => {
    if (!map) return;
    let box: [number, number, number, number] | null = null;
    const rings = boundary ? (boundary.type === 'Polygon' ? [boundary.coordinates] : boundary.coordinates) : [];
    for (const poly of rings) for (const p of poly[0] ?? []) box = extend(box, p);
    for (const o of observations.data ?? []) box = extend(box, o.position);
    if (box) map.fitBounds(box as LngLatBoundsLike, { padding: 40, duration: 0, maxZoom: 17 });
  }, [map, boundary, observations.data]);

  useEffect(() => {
    if (!map) return;
    const data = tapped ? { type: 'Feature' as const, geometry: { type: 'Point' as const, coordinates: [tapped.lon, tapped.lat] }, properties: {} } : { type: 'FeatureCollection' as const, features: [] };
    const source = map.getSource('tapped') as { setData?: (d: unknown) => void } | undefined;
    if (source?.setData) source.setData(data);
    else {
      map.addSource('tapped', { type: 'geojson', data });
      map.addLayer({ id: 'tapped', type: 'circle', source: 'tapped', paint: { 'circle-radius': 7, 'circle-color': '#FFFFFF', 'circle-stroke-color': INK, 'circle-stroke-width': 3 } });
    }
  }, [map, tapped]);

  return (
    <div className={`relative w-full overflow-hidden rounded border border-rule ${heightClass}`}>
      <div ref={ref} className="absolute inset-0 h-full w-full" data-testid="observation-map" />
      <div className="absolute bottom-3 left-3 z-10">
        <ObservationsLayer map={map} propertyId={propertyId} />
      </div>
      {onTap ? <p className="pointer-events-none absolute right-2 top-2 rounded bg-card/90 px-2 py-0.5 text-xs text-slate">Tap the map to place a new sign</p> : null}
    </div>
  );
}
