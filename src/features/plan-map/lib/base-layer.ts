/**
 * The offline base layer under every map: US state and county lines (us-atlas, U.S. Census Bureau
 * cartographic boundaries) in the quiet paper style, with state names when zoomed out and county
 * names when zoomed in. The TopoJSON is a lazy chunk of its own, fetched from our server with the
 * map page: no tile service, no glyphs, no network beyond the app. Labels are HTML markers (the
 * offline style has no glyph server), only those in view, at most 150.
 */
import { Marker, type Map as MapLibreMap } from 'maplibre-gl';
import { baseMapData, labelsInView, type BaseMapData, type UsAtlasTopology } from '../../../../shared/domain/base-map';
import { SLATE } from './map-style';

let data: Promise<BaseMapData> | null = null;

/** The base map's lines and labels, loaded and built once per page. */
export function loadBaseMapData(): Promise<BaseMapData> {
  data ??= import('us-atlas/counties-10m.json').then((m) => baseMapData((m as unknown as { default: UsAtlasTopology }).default));
  return data;
}

/** The layer ids of the base map, bottom to top. */
export const BASE_LAYER_IDS = ['base-county-line', 'base-state-line'] as const;

/**
 * Adds the base layer to a map whose style is loaded, under `beforeId` (the plan's first layer),
 * and keeps its labels to the view. Answers a function that takes the labels off again.
 */
export function addBaseLayer(map: MapLibreMap, beforeId?: string): () => void {
  let markers: Marker[] = [];
  let labels: BaseMapData['labels'] = [];
  let stopped = false;
  const drawLabels = () => {
    for (const m of markers) m.remove();
    markers = [];
    if (stopped || labels.length === 0) return;
    const b = map.getBounds();
    const zoom = map.getZoom();
    // Zoomed in to a farm, county names would only crowd the plan.
    if (zoom > 13) return;
    for (const l of labelsInView(labels, [b.getWest(), b.getSouth(), b.getEast(), b.getNorth()], zoom)) {
      const el = document.createElement('div');
      el.className = l.kind === 'state' ? 'base-label base-label-state' : 'base-label base-label-county';
      el.textContent = l.name;
      el.setAttribute('aria-hidden', 'true');
      el.style.cssText = `pointer-events:none;color:${SLATE};font-size:${l.kind === 'state' ? 12 : 11}px;letter-spacing:${l.kind === 'state' ? '0.12em' : '0.02em'};text-transform:${l.kind === 'state' ? 'uppercase' : 'none'};white-space:nowrap;opacity:0.85;text-shadow:0 0 2px #FFFDF7,0 0 2px #FFFDF7`;
      markers.push(new Marker({ element: el, anchor: 'center' }).setLngLat([l.lon, l.lat]).addTo(map));
    }
  };
  void loadBaseMapData().then((d) => {
    if (stopped || !map.getStyle()) return;
    map.addSource('base-map', {
      type: 'geojson',
      attribution: 'State and county lines: U.S. Census Bureau',
      data: {
        type: 'FeatureCollection',
        features: [
          { type: 'Feature', properties: { level: 'county' }, geometry: d.countyLines },
          { type: 'Feature', properties: { level: 'state' }, geometry: d.stateLines },
        ],
      },
    });
    const before = beforeId && map.getLayer(beforeId) ? beforeId : undefined;
    map.addLayer(
      {
        id: 'base-county-line',
        type: 'line',
        source: 'base-map',
        filter: ['==', ['get', 'level'], 'county'],
        paint: { 'line-color': SLATE, 'line-opacity': ['interpolate', ['linear'], ['zoom'], 4, 0.15, 8, 0.45, 14, 0.3], 'line-width': 0.8, 'line-dasharray': [3, 2] },
      },
      before,
    );
    map.addLayer(
      { id: 'base-state-line', type: 'line', source: 'base-map', filter: ['==', ['get', 'level'], 'state'], paint: { 'line-color': SLATE, 'line-opacity': 0.6, 'line-width': ['interpolate', ['linear'], ['zoom'], 3, 0.8, 10, 1.8] } },
      before,
    );
    labels = d.labels;
    drawLabels();
    map.getContainer().dataset.baseLayer = 'ready';
  });
  map.on('moveend', drawLabels);
  return () => {
    stopped = true;
    map.off('moveend', drawLabels);
    for (const m of markers) m.remove();
    markers = [];
  };
}
