/**
 * The observations layer on a MapLibre map: points with our kind symbols, clustered where dense
 * (MapLibre's GeoJSON source clustering), with a panel to filter by kind and to step through the
 * weeks or months with a slider. Give it the map (or null while it loads) and the property.
 */
import { useEffect, useMemo, useState } from 'react';
import type { GeoJSONSource, Map as MapLibreMap } from 'maplibre-gl';
import type { FeatureCollection, Point } from 'geojson';
import { OBSERVATION_KINDS, OBSERVATION_KIND_STYLES, type ObservationKind } from '../../../../shared/domain/observations';
import { todayIn } from '../../../../shared/domain/clock';
import type { ObservationDto } from '../../../../shared/schemas/observation';
import { useObservations } from '../api/get-observations';
import { kindBadgeSvg } from '../lib/kind-symbols';
import { inBucket, rangeBuckets, type RangeMode } from '../lib/time-range';
import { KindSymbol } from './kind-symbol';

const SOURCE = 'observations';
const CLUSTER_COLOUR = '#3F5B3A';

/** Rasterises each kind's badge once (no sprite file): image id → pixels at twice the display size. */
async function drawKindImages(): Promise<Map<string, ImageData>> {
  const drawn = new Map<string, ImageData>();
  await Promise.all(
    OBSERVATION_KINDS.map(async (kind) => {
      const img = new Image(32, 32);
      img.src = `data:image/svg+xml;charset=utf-8,${encodeURIComponent(kindBadgeSvg(kind, OBSERVATION_KIND_STYLES[kind].colour, 32))}`;
      await img.decode();
      const canvas = document.createElement('canvas');
      canvas.width = 64;
      canvas.height = 64;
      const ctx = canvas.getContext('2d');
      if (!ctx) return;
      ctx.drawImage(img, 0, 0, 64, 64);
      drawn.set(`observation-${kind}`, ctx.getImageData(0, 0, 64, 64));
    }),
  );
  return drawn;
}

/** Puts the drawn badges on the map (map.addImage), once per map. */
function addKindImages(map: MapLibreMap, images: Map<string, ImageData>): void {
  for (const [id, data] of images) if (!map.hasImage(id)) map.addImage(id, data, { pixelRatio: 2 });
}

function ensureLayers(map: MapLibreMap): void {
  if (map.getSource(SOURCE)) return;
  map.addSource(SOURCE, { type: 'geojson', data: { type: 'FeatureCollection', features: [] }, cluster: true, clusterRadius: 40, clusterMaxZoom: 17 });
  map.addLayer({ id: 'observation-clusters', type: 'circle', source: SOURCE, filter: ['has', 'point_count'], paint: { 'circle-color': CLUSTER_COLOUR, 'circle-opacity': 0.85, 'circle-stroke-color': '#FFFFFF', 'circle-stroke-width': 2, 'circle-radius': ['step', ['get', 'point_count'], 14, 10, 18, 30, 24] } });
  map.addLayer({ id: 'observation-cluster-count', type: 'symbol', source: SOURCE, filter: ['has', 'point_count'], layout: { 'text-field': ['get', 'point_count_abbreviated'], 'text-font': ['sans-serif'], 'text-size': 12, 'text-allow-overlap': true }, paint: { 'text-color': '#FFFFFF' } });
  map.addLayer({ id: 'observation-points', type: 'symbol', source: SOURCE, filter: ['!', ['has', 'point_count']], layout: { 'icon-image': ['concat', 'observation-', ['get', 'kind']], 'icon-allow-overlap': true, 'icon-size': 1 } });
}

/** Observations as GeoJSON points with their kind and day. */
export function observationFeatures(list: readonly ObservationDto[]): FeatureCollection<Point> {
  return { type: 'FeatureCollection', features: list.map((o) => ({ type: 'Feature', id: o.id, geometry: { type: 'Point', coordinates: o.position }, properties: { id: o.id, kind: o.kind, unitName: o.unitName ?? '' } })) };
}

export function ObservationsLayer({ map, propertyId, zone = Intl.DateTimeFormat().resolvedOptions().timeZone }: { map: MapLibreMap | null; propertyId: number; zone?: string }) {
  const observations = useObservations(propertyId, {}, Number.isInteger(propertyId) && propertyId > 0);
  const [kinds, setKinds] = useState<Set<ObservationKind>>(() => new Set(OBSERVATION_KINDS));
  const [mode, setMode] = useState<RangeMode>('all');
  const [index, setIndex] = useState(0);
  const [shownOnMap, setShownOnMap] = useState(true);
  const [ready, setReady] = useState(false);

  const dated = useMemo(() => (observations.data ?? []).map((o) => ({ o, day: todayIn(zone, new Date(o.observedAt)) })), [observations.data, zone]);
  const buckets = useMemo(() => (mode === 'all' ? [] : rangeBuckets(dated.map((d) => d.day), mode)), [dated, mode]);
  const bucket = mode === 'all' ? null : (buckets[Math.min(index, buckets.length - 1)] ?? null);
  const shown = useMemo(() => dated.filter((d) => kinds.has(d.o.kind) && inBucket(d.day, bucket)).map((d) => d.o), [dated, kinds, bucket]);

  useEffect(() => {
    if (!map) return;
    let cancelled = false;
    let images: Map<string, ImageData> | null = null;
    // The map may have fired 'load' already while isStyleLoaded() is still false (tiles or another
    // layer's source loading): try at once, then again on each render event until the source is in.
    const attempt = () => {
      if (cancelled || !images) return;
      try {
        addKindImages(map, images);
        ensureLayers(map);
      } catch {
        return; // "Style is not done loading": the next event tries again.
      }
      stop();
      setReady(true);
    };
    const events = ['load', 'styledata', 'idle'] as const;
    const stop = () => events.forEach((e) => map.off(e, attempt));
    events.forEach((e) => map.on(e, attempt));
    void drawKindImages().then((drawn) => {
      images = drawn;
      attempt();
    });
    return () => {
      cancelled = true;
      stop();
    };
  }, [map]);

  useEffect(() => {
    if (!map || !ready) return;
    (map.getSource(SOURCE) as GeoJSONSource | undefined)?.setData(observationFeatures(shownOnMap ? shown : []));
  }, [map, ready, shown, shownOnMap]);

  if (!observations.data || observations.data.length === 0) return null;
  const toggle = (k: ObservationKind) =>
    setKinds((prev) => {
      const next = new Set(prev);
      if (next.has(k)) next.delete(k);
      else next.add(k);
      return next;
    });
  const present = OBSERVATION_KINDS.filter((k) => dated.some((d) => d.o.kind === k));
  return (
    <section aria-label="Observations" data-observations-shown={shownOnMap ? shown.length : 0} className="pointer-events-auto flex max-w-[22rem] flex-col gap-2 rounded border border-rule bg-card/95 p-2 text-xs shadow-sm">
      <div className="flex items-center justify-between gap-2">
        <label className="flex items-center gap-1 font-semibold">
          <input type="checkbox" checked={shownOnMap} onChange={(e) => setShownOnMap(e.target.checked)} /> Observations ({shown.length})
        </label>
        <select aria-label="Time range" value={mode} onChange={(e) => { setMode(e.target.value as RangeMode); setIndex(0); }} className="rounded border border-rule bg-card px-1 py-0.5">
          <option value="all">All dates</option>
          <option value="week">By week</option>
          <option value="month">By month</option>
        </select>
      </div>
      {mode !== 'all' && buckets.length ? (
        <label className="flex flex-col gap-1">
          <span className="font-semibold">{bucket?.label}</span>
          <input type="range" aria-label={mode === 'week' ? 'Week' : 'Month'} min={0} max={buckets.length - 1} value={Math.min(index, buckets.length - 1)} onChange={(e) => setIndex(Number(e.target.value))} />
        </label>
      ) : null}
      <div className="flex flex-wrap gap-1" role="group" aria-label="Kinds of sign">
        {present.map((k) => (
          <button key={k} type="button" aria-pressed={kinds.has(k)} onClick={() => toggle(k)} className={`flex items-center gap-1 rounded border px-1.5 py-0.5 ${kinds.has(k) ? 'border-rule bg-card' : 'border-transparent opacity-40'}`}>
            <span style={{ color: OBSERVATION_KIND_STYLES[k].colour }}>
              <KindSymbol kind={k} className="h-4 w-4" />
            </span>
            {OBSERVATION_KIND_STYLES[k].label}
          </button>
        ))}
      </div>
    </section>
  );
}
