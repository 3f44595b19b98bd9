/** The plan map's offline style: paper and a faint graticule, no remote style, tiles, glyphs or sprites. */
import type { StyleSpecification } from '@maplibre/maplibre-gl-style-spec';
import type { BBox, FeatureCollection, LineString } from 'geojson';

export const PAPER = '#F6F3EA';
export const CARD = '#FFFDF7';
export const RULE = '#D9D3C3';
export const INK = '#1F2A24';
export const SLATE = '#5B6770';
export const MOSS = '#3F6B3A';
export const MOSS_DEEP = '#2E5029';
export const OCHRE = '#C99A2E';
export const CLAY = '#B5562B';
export const SKY = '#3C7A9E';

/** A style that draws without any request: the paper background only; the plan layers come after. */
export function offlineStyle(): StyleSpecification {
  return {
    version: 8,
    name: 'Browseline paper',
    sources: {},
    layers: [{ id: 'paper', type: 'background', paint: { 'background-color': PAPER } }],
  };
}

const STEPS_DEG = [0.0005, 0.001, 0.0025, 0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10];

/**
 * Lines of latitude and longitude around a box (five times its size each way), spaced so that the
 * box holds about six of them: a quiet reference on the paper when there are no tiles.
 */
export function graticule(box: BBox | null): FeatureCollection<LineString> {
  const [w0, s0, e0, n0] = box ?? [-130, 20, -60, 55];
  const span = Math.max(e0 - w0, n0 - s0, 0.001);
  const step = STEPS_DEG.find((s) => span / s <= 6) ?? 10;
  const pad = span * 5;
  const clampLat = (v: number) => Math.max(-85, Math.min(85, v));
  const west = Math.floor((w0 - pad) / step) * step;
  const east = Math.ceil((e0 + pad) / step) * step;
  const south = clampLat(Math.floor((s0 - pad) / step) * step);
  const north = clampLat(Math.ceil((n0 + pad) / step) * step);
  const features: FeatureCollection<LineString>['features'] = [];
  const round = (v: number) => Number(v.toFixed(6));
  for (let lon = west; lon <= east + step / 2; lon += step) {
    features.push({ type: 'Feature', properties: {}, geometry: { type: 'LineString', coordinates: [[round(lon), south], [round(lon), north]] } });
  }
  for (let lat = south; lat <= north + step / 2; lat += step) {
    features.push({ type: 'Feature', properties: {}, geometry: { type: 'LineString', coordinates: [[west, round(lat)], [east, round(lat)]] } });
  }
  return { type: 'FeatureCollection', features };
}
