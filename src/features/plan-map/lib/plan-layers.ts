/**
 * The plan's sources and layers on a MapLibre map: one GeoJSON source per geometry family with
 * data-driven styling by kind (a few layers for 500 units, not a layer per unit), the boundary,
 * the graticule, the import preview, image overlays and the firm's background tiles.
 */
import type { ExpressionSpecification, FilterSpecification } from '@maplibre/maplibre-gl-style-spec';
import type { GeoJSONSource, Map as MapLibreMap } from 'maplibre-gl';
import type { FeatureCollection, Geometry, MultiPolygon, Polygon } from 'geojson';
import { KIND_STYLES, UNIT_KINDS, type KindStyle, type UnitKind } from '../../../../shared/domain/unit-kinds';
import { CARD, CLAY, INK, OCHRE, RULE, SKY, graticule } from './map-style';
import { drawKindSymbols } from './symbols';
import { UNIT_STATUS_STYLES, UNIT_WORK_STATUSES } from '../../../lib/work-status';
import type { FamilyCollections } from './unit-features';

export const SOURCES = {
  graticule: 'graticule',
  boundary: 'boundary',
  area: 'units-area',
  line: 'units-line',
  point: 'units-point',
  preview: 'import-preview',
} as const;

/** The layers a click can pick a unit from, points first. */
export const UNIT_LAYERS = ['unit-point', 'unit-line', 'unit-area-fill'] as const;

const EMPTY: FeatureCollection = { type: 'FeatureCollection', features: [] };

/** A `match` on the kind property giving each kind's value of a style field. */
export function kindMatch<K extends keyof KindStyle>(field: K, fallback: KindStyle[K], kinds: readonly UnitKind[] = UNIT_KINDS): ExpressionSpecification {
  const pairs = kinds.flatMap((k) => [k, KIND_STYLES[k][field]]);
  return ['match', ['get', 'kind'], ...pairs, fallback] as unknown as ExpressionSpecification;
}

const DASHES: Record<KindStyle['dash'], number[]> = { solid: [1, 0], dashed: [3, 2], dotted: [1, 1.6] };

function dashMatch(): ExpressionSpecification {
  const pairs = UNIT_KINDS.flatMap((k) => [k, ['literal', DASHES[KIND_STYLES[k].dash]]]);
  return ['match', ['get', 'kind'], ...pairs, ['literal', DASHES.solid]] as unknown as ExpressionSpecification;
}

/** Adds the kind symbols as map images (our canvas drawings, no sprite). */
export function addKindImages(map: MapLibreMap): void {
  for (const s of drawKindSymbols(Math.max(1, Math.min(3, window.devicePixelRatio || 1)))) {
    if (!map.hasImage(s.id)) map.addImage(s.id, s.image, { pixelRatio: s.pixelRatio });
  }
}

/** Adds every plan source and layer; call once after the style has loaded. */
export function addPlanLayers(map: MapLibreMap, options: { labels?: boolean } = {}): void {
  addKindImages(map);
  for (const id of Object.values(SOURCES)) {
    if (!map.getSource(id)) map.addSource(id, { type: 'geojson', data: EMPTY, promoteId: id === SOURCES.boundary || id === SOURCES.graticule || id === SOURCES.preview ? undefined : 'id' });
  }
  map.addLayer({ id: 'graticule-line', type: 'line', source: SOURCES.graticule, paint: { 'line-color': RULE, 'line-width': 0.8, 'line-opacity': 0.7 } });
  map.addLayer({ id: 'boundary-fill', type: 'fill', source: SOURCES.boundary, paint: { 'fill-color': CARD, 'fill-opacity': 0.55 } });
  map.addLayer({
    id: 'unit-area-fill',
    type: 'fill',
    source: SOURCES.area,
    paint: { 'fill-color': kindMatch('fill', '#BDB8AA'), 'fill-opacity': kindMatch('fillOpacity', 0.5) },
  });
  map.addLayer({
    id: 'unit-area-outline',
    type: 'line',
    source: SOURCES.area,
    layout: { 'line-join': 'round' },
    paint: { 'line-color': kindMatch('stroke', '#7B776C'), 'line-width': ['interpolate', ['linear'], ['zoom'], 12, 1, 17, 2.2], 'line-dasharray': dashMatch() },
  });
  map.addLayer({ id: 'boundary-casing', type: 'line', source: SOURCES.boundary, layout: { 'line-join': 'round' }, paint: { 'line-color': CARD, 'line-width': 6, 'line-opacity': 0.85 } });
  map.addLayer({ id: 'boundary-line', type: 'line', source: SOURCES.boundary, layout: { 'line-join': 'round' }, paint: { 'line-color': INK, 'line-width': 2.4 } });
  map.addLayer({
    id: 'unit-line-casing',
    type: 'line',
    source: SOURCES.line,
    layout: { 'line-join': 'round', 'line-cap': 'round' },
    paint: { 'line-color': CARD, 'line-width': ['match', ['get', 'kind'], 'fence', 4, 6], 'line-opacity': 0.8 },
  });
  map.addLayer({
    id: 'unit-line',
    type: 'line',
    source: SOURCES.line,
    layout: { 'line-join': 'round' },
    paint: { 'line-color': kindMatch('stroke', '#5B6770'), 'line-width': ['match', ['get', 'kind'], 'fence', 1.6, 3], 'line-dasharray': dashMatch() },
  });
  if (options.labels) {
    map.addLayer({
      id: 'unit-label',
      type: 'symbol',
      source: SOURCES.area,
      minzoom: 14.5,
      layout: {
        'text-field': ['get', 'name'],
        'text-size': 12,
        'text-max-width': 8,
        'text-font': ['sans-serif'],
        'text-variable-anchor': ['center', 'top', 'bottom'],
        'text-radial-offset': 1.2,
      },
      paint: { 'text-color': INK, 'text-halo-color': CARD, 'text-halo-width': 1.4 },
    });
  }
  map.addLayer({
    id: 'unit-point',
    type: 'symbol',
    source: SOURCES.point,
    layout: {
      'icon-image': ['concat', 'browseline-', ['get', 'kind']] as unknown as ExpressionSpecification,
      'icon-allow-overlap': true,
      // Symbols always show, and labels make way for them.
      'icon-ignore-placement': false,
    },
  });
  addPreviewLayers(map);
}

function addPreviewLayers(map: MapLibreMap): void {
  const color: ExpressionSpecification = [
    'case',
    ['==', ['get', 'choice'], 'skip'],
    '#9AA3A9',
    ['==', ['get', 'choice'], 'boundary'],
    INK,
    kindMatchOn('choice', 'fill', OCHRE),
  ] as unknown as ExpressionSpecification;
  const isArea: FilterSpecification = ['==', ['geometry-type'], 'Polygon'];
  const isLine: FilterSpecification = ['==', ['geometry-type'], 'LineString'];
  const isPoint: FilterSpecification = ['==', ['geometry-type'], 'Point'];
  map.addLayer({ id: 'preview-fill', type: 'fill', source: SOURCES.preview, filter: isArea, paint: { 'fill-color': color, 'fill-opacity': ['match', ['get', 'choice'], 'skip', 0.08, 'boundary', 0.06, 0.35] } });
  map.addLayer({ id: 'preview-outline', type: 'line', source: SOURCES.preview, filter: ['any', isArea, isLine], paint: { 'line-color': ['case', ['==', ['get', 'choice'], 'skip'], '#9AA3A9', OCHRE], 'line-width': 2.5, 'line-dasharray': [2, 1.2] } });
  map.addLayer({ id: 'preview-point', type: 'circle', source: SOURCES.preview, filter: isPoint, paint: { 'circle-radius': 6, 'circle-color': color, 'circle-stroke-color': OCHRE, 'circle-stroke-width': 2.5 } });
  map.addLayer({ id: 'preview-highlight', type: 'line', source: SOURCES.preview, filter: ['all', ['any', isArea, isLine], ['==', ['get', 'highlight'], true]], paint: { 'line-color': CLAY, 'line-width': 4 } });
}

function kindMatchOn(property: string, field: 'fill' | 'stroke', fallback: string): ExpressionSpecification {
  const pairs = UNIT_KINDS.flatMap((k) => [k, KIND_STYLES[k][field]]);
  return ['match', ['get', property], ...pairs, fallback] as unknown as ExpressionSpecification;
}

function setData(map: MapLibreMap, sourceId: string, data: FeatureCollection): void {
  (map.getSource(sourceId) as GeoJSONSource | undefined)?.setData(data);
}

/** Puts the units on the map (one setData per family). */
export function setUnitData(map: MapLibreMap, collections: FamilyCollections): void {
  setData(map, SOURCES.area, collections.area);
  setData(map, SOURCES.line, collections.line);
  setData(map, SOURCES.point, collections.point);
}

/** Puts the boundary on the map and a graticule around it. */
export function setBoundaryData(map: MapLibreMap, boundary: Polygon | MultiPolygon | null, box: [number, number, number, number] | null): void {
  setData(map, SOURCES.boundary, boundary ? { type: 'FeatureCollection', features: [{ type: 'Feature', properties: {}, geometry: boundary }] } : EMPTY);
  setData(map, SOURCES.graticule, graticule(box));
}

/** Shows the features of an import preview, each with its current choice. */
export function setPreviewData(map: MapLibreMap, features: { geometry: Geometry; choice: string; highlight?: boolean }[]): void {
  setData(map, SOURCES.preview, {
    type: 'FeatureCollection',
    features: features.map((f, i) => ({ type: 'Feature', id: i, geometry: f.geometry, properties: { index: i, choice: f.choice, highlight: Boolean(f.highlight) } })),
  });
}

/** Hides one unit from the plan layers (while terra-draw shows it for editing), or none. */
export function hideUnit(map: MapLibreMap, unitId: number | null): void {
  const filter: FilterSpecification | null = unitId === null ? null : ['!=', ['get', 'id'], unitId];
  for (const layer of ['unit-area-fill', 'unit-area-outline', 'unit-line-casing', 'unit-line', 'unit-point', 'unit-label']) {
    if (map.getLayer(layer)) map.setFilter(layer, filter);
  }
}

/** Hides the boundary (while it is being edited). */
export function hideBoundary(map: MapLibreMap, hidden: boolean): void {
  for (const layer of ['boundary-fill', 'boundary-casing', 'boundary-line']) {
    if (map.getLayer(layer)) map.setLayoutProperty(layer, 'visibility', hidden ? 'none' : 'visible');
  }
}

/** An image overlay as the map needs it. */
export interface MapOverlay {
  id: number;
  imageUrl: string;
  /** [lon, lat] of the top-left, top-right, bottom-right and bottom-left corners. */
  corners: [number, number][];
  opacity: number;
}

type Corners = [[number, number], [number, number], [number, number], [number, number]];

const overlayIds = (id: number) => ({ source: `overlay-${id}`, layer: `overlay-${id}-raster` });

/**
 * Brings the image overlays on the map in line with the list: adds new ones under the plan,
 * removes gone ones, updates corners and opacity of the others.
 */
export function syncOverlays(map: MapLibreMap, overlays: readonly MapOverlay[]): void {
  const wanted = new Set(overlays.map((o) => overlayIds(o.id).layer));
  for (const layer of map.getStyle().layers ?? []) {
    if (/^overlay-\d+-raster$/.test(layer.id) && !wanted.has(layer.id)) {
      const source = (layer as { source?: string }).source;
      map.removeLayer(layer.id);
      if (source && map.getSource(source)) map.removeSource(source);
    }
  }
  for (const o of overlays) {
    const ids = overlayIds(o.id);
    if (o.corners.length !== 4) continue;
    const corners = o.corners.slice(0, 4) as Corners;
    const existing = map.getSource(ids.source) as { setCoordinates?: (c: Corners) => void } | undefined;
    if (existing) {
      existing.setCoordinates?.(corners);
      map.setPaintProperty(ids.layer, 'raster-opacity', o.opacity);
      continue;
    }
    map.addSource(ids.source, { type: 'image', url: o.imageUrl, coordinates: corners });
    map.addLayer({ id: ids.layer, type: 'raster', source: ids.source, paint: { 'raster-opacity': o.opacity, 'raster-fade-duration': 0 } }, 'graticule-line');
  }
}

/** Sets one overlay's opacity on the map (while its slider moves). */
export function setOverlayOpacity(map: MapLibreMap, overlayId: number, opacity: number): void {
  const { layer } = overlayIds(overlayId);
  if (map.getLayer(layer)) map.setPaintProperty(layer, 'raster-opacity', opacity);
}

/** Adds (or removes) the firm's background tiles under everything else of the plan. */
export function setBackgroundTiles(map: MapLibreMap, template: string | null, attribution?: string | null): void {
  if (map.getLayer('tiles-raster')) map.removeLayer('tiles-raster');
  if (map.getSource('tiles')) map.removeSource('tiles');
  if (!template) return;
  map.addSource('tiles', { type: 'raster', tiles: [template], tileSize: 256, maxzoom: 19, ...(attribution ? { attribution } : {}) });
  const firstOverlay = (map.getStyle().layers ?? []).find((l) => /^overlay-\d+-raster$/.test(l.id));
  map.addLayer({ id: 'tiles-raster', type: 'raster', source: 'tiles', paint: { 'raster-fade-duration': 100 } }, firstOverlay?.id ?? 'graticule-line');
}

/** What the units' colours stand for: their kind (the default) or the work done on them. */
export type ColourBy = 'kind' | 'status';

function statusMatch(field: 'fill' | 'stroke' | 'fillOpacity'): ExpressionSpecification {
  const pairs = UNIT_WORK_STATUSES.flatMap((s) => [s, UNIT_STATUS_STYLES[s][field]]);
  return ['match', ['get', 'workStatus'], ...pairs, UNIT_STATUS_STYLES['no-work'][field]] as unknown as ExpressionSpecification;
}

/** Colours areas and lines by kind or by work status (points keep their kind symbols). */
export function setColourBy(map: MapLibreMap, by: ColourBy): void {
  if (!map.getLayer('unit-area-fill')) return;
  const status = by === 'status';
  map.setPaintProperty('unit-area-fill', 'fill-color', status ? statusMatch('fill') : kindMatch('fill', '#BDB8AA'));
  map.setPaintProperty('unit-area-fill', 'fill-opacity', status ? statusMatch('fillOpacity') : kindMatch('fillOpacity', 0.5));
  map.setPaintProperty('unit-area-outline', 'line-color', status ? statusMatch('stroke') : kindMatch('stroke', '#7B776C'));
  map.setPaintProperty('unit-line', 'line-color', status ? statusMatch('stroke') : kindMatch('stroke', '#5B6770'));
}

/** A crew photo's position from its EXIF data. */
export interface PhotoPoint {
  id: number;
  lon: number;
  lat: number;
  label: string;
}

/** Shows the crew's photo positions as small sky dots over the units (an empty list hides them). */
export function setPhotoPoints(map: MapLibreMap, points: readonly PhotoPoint[]): void {
  const data: FeatureCollection = {
    type: 'FeatureCollection',
    features: points.map((p) => ({ type: 'Feature', id: p.id, geometry: { type: 'Point', coordinates: [p.lon, p.lat] }, properties: { label: p.label } })),
  };
  const source = map.getSource('task-photos') as GeoJSONSource | undefined;
  if (source) {
    source.setData(data);
    return;
  }
  if (points.length === 0) return;
  map.addSource('task-photos', { type: 'geojson', data });
  map.addLayer({ id: 'task-photo-point', type: 'circle', source: 'task-photos', paint: { 'circle-radius': 5, 'circle-color': SKY, 'circle-stroke-color': CARD, 'circle-stroke-width': 2 } });
}
