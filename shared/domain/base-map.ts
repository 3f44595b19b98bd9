/**
 * The offline base map: US state and county lines with label points, from the Census-derived
 * `us-atlas` TopoJSON (counties-10m: counties, states and nation objects). Pure: the caller hands
 * the topology in (the browser loads it as a lazy chunk on map pages only).
 */
import { feature, mesh } from 'topojson-client';
import type { GeometryCollection, Topology } from 'topojson-specification';
import type { Feature, FeatureCollection, Geometry, MultiLineString, Position } from 'geojson';
import { US_STATES } from './us-states';

export type UsAtlasTopology = Topology<{
  counties: GeometryCollection<{ name: string }>;
  states: GeometryCollection<{ name: string }>;
  nation: GeometryCollection;
}>;

/** A label's place: the middle of its largest ring's bounding box, nudged onto the shape's own area. */
export interface BaseLabel {
  name: string;
  kind: 'state' | 'county';
  lon: number;
  lat: number;
  /** [west, south, east, north] of the whole shape, for picking labels in view. */
  bbox: [number, number, number, number];
}

export interface BaseMapData {
  /** Lines between two states (each drawn once), plus the coast/border of the nation. */
  stateLines: MultiLineString;
  /** Lines between two counties of one state (state lines are not repeated). */
  countyLines: MultiLineString;
  labels: BaseLabel[];
}

function ringsOf(geometry: Geometry): Position[][] {
  if (geometry.type === 'Polygon') return [geometry.coordinates[0] ?? []];
  if (geometry.type === 'MultiPolygon') return geometry.coordinates.map((p) => p[0] ?? []);
  return [];
}

/** Area of a ring in square degrees (planar shoelace: only for choosing the largest part). */
function ringArea(ring: Position[]): number {
  let a = 0;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) a += (ring[j]![0]! + ring[i]![0]!) * (ring[j]![1]! - ring[i]![1]!);
  return Math.abs(a / 2);
}

/** Whether a point lies inside a ring (even–odd rule). */
function inRing(x: number, y: number, ring: Position[]): boolean {
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i] as [number, number];
    const [xj, yj] = ring[j] as [number, number];
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

/**
 * A point inside the shape's largest part for its label: the middle of that part's box when it is
 * inside, else the middle of the widest inside run along the box's middle latitude.
 */
export function labelPoint(geometry: Geometry): [number, number] | null {
  const rings = ringsOf(geometry);
  if (rings.length === 0) return null;
  const ring = rings.reduce((best, r) => (ringArea(r) > ringArea(best) ? r : best));
  let [w, s, e, n] = [Infinity, Infinity, -Infinity, -Infinity];
  for (const [x, y] of ring as [number, number][]) {
    if (x < w) w = x;
    if (x > e) e = x;
    if (y < s) s = y;
    if (y > n) n = y;
  }
  const cx = (w + e) / 2;
  const cy = (s + n) / 2;
  if (inRing(cx, cy, ring)) return [cx, cy];
  const xs: number[] = [];
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i] as [number, number];
    const [xj, yj] = ring[j] as [number, number];
    if (yi > cy !== yj > cy) xs.push(((xj - xi) * (cy - yi)) / (yj - yi) + xi);
  }
  xs.sort((a, b) => a - b);
  let best: [number, number] | null = null;
  let width = -1;
  for (let i = 0; i + 1 < xs.length; i += 2) {
    if (xs[i + 1]! - xs[i]! > width) {
      width = xs[i + 1]! - xs[i]!;
      best = [(xs[i]! + xs[i + 1]!) / 2, cy];
    }
  }
  return best ?? [cx, cy];
}

function bboxOf(geometry: Geometry): [number, number, number, number] {
  let [w, s, e, n] = [Infinity, Infinity, -Infinity, -Infinity];
  for (const ring of ringsOf(geometry)) {
    for (const [x, y] of ring as [number, number][]) {
      if (x < w) w = x;
      if (x > e) e = x;
      if (y < s) s = y;
      if (y > n) n = y;
    }
  }
  return [w, s, e, n];
}

const countyWord = (abbr: string | undefined) => (abbr === 'LA' ? ' Parish' : abbr === 'AK' || abbr === 'PR' ? '' : ' County');

/** State and county lines and their label points from the us-atlas topology. */
export function baseMapData(topology: UsAtlasTopology): BaseMapData {
  const stateOf = (id: unknown) => String(id).slice(0, 2);
  const stateLines = mesh(topology, topology.objects.states) as MultiLineString;
  const countyLines = mesh(topology, topology.objects.counties, (a, b) => a !== b && stateOf(a.id) === stateOf(b.id)) as MultiLineString;
  const labels: BaseLabel[] = [];
  const add = (f: Feature<Geometry | null, { name: string } | null>, kind: BaseLabel['kind'], name: string) => {
    if (!f.geometry) return;
    const p = labelPoint(f.geometry);
    if (p) labels.push({ name, kind, lon: Math.round(p[0] * 1e4) / 1e4, lat: Math.round(p[1] * 1e4) / 1e4, bbox: bboxOf(f.geometry) });
  };
  for (const f of (feature(topology, topology.objects.states) as FeatureCollection<Geometry | null, { name: string }>).features) {
    if (f.properties?.name) add(f, 'state', f.properties.name);
  }
  for (const f of (feature(topology, topology.objects.counties) as FeatureCollection<Geometry | null, { name: string }>).features) {
    if (f.properties?.name) add(f, 'county', `${f.properties.name}${countyWord(US_STATES[stateOf(f.id)]?.abbr)}`);
  }
  return { stateLines, countyLines, labels };
}

/** The labels to show in a view: states when zoomed out (below `countyZoom`), counties in the view when zoomed in, at most `max`. */
export function labelsInView(labels: readonly BaseLabel[], view: [number, number, number, number], zoom: number, countyZoom = 6.5, max = 150): BaseLabel[] {
  const [w, s, e, n] = view;
  const kind = zoom < countyZoom ? 'state' : 'county';
  const out: BaseLabel[] = [];
  for (const l of labels) {
    if (l.kind !== kind || l.lon < w || l.lon > e || l.lat < s || l.lat > n) continue;
    out.push(l);
    if (out.length >= max) break;
  }
  return out;
}

