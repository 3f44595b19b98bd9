/**
 * Which of the 16 winds suit a stand. A wind is named by the direction it blows FROM (as weather
 * reports give it) and carries scent the opposite way: a wind from the south (180°) lays the scent
 * cone toward the north (0°). A wind is not suitable for a stand when the stand's cone reaches a
 * bedding area or a sanctuary, or covers the side its watched unit is approached from; and, when
 * access routes lead to the stand, only when at least one of them is suitable for that wind too.
 */
import type { Geometry, Point, Position } from 'geojson';
import { centroidOf } from './centroid';
import { destination, inverse, normalizeDeg } from './geodesic';
import { coneReaches, METRES_PER_YARD, partsOf, pathToAreaM, pointToPathM, samplePath, type Cone } from './scent';
import type { UnitKind } from './unit-kinds';

/** The 16 compass winds, clockwise from north. */
export const WIND_NAMES = ['N', 'NNE', 'NE', 'ENE', 'E', 'ESE', 'SE', 'SSE', 'S', 'SSW', 'SW', 'WSW', 'W', 'WNW', 'NW', 'NNW'] as const;
export type WindName = (typeof WIND_NAMES)[number];

/** The bearing in degrees of a named wind (the direction it blows from). */
export function windDegrees(name: WindName): number {
  return WIND_NAMES.indexOf(name) * 22.5;
}

/** The named wind (of 16 sectors of 22.5°, centred on N = 0°) a direction in degrees falls in. */
export function windSector(deg: number): WindName {
  return WIND_NAMES[Math.round(normalizeDeg(deg) / 22.5) % 16]!;
}

/** Where a wind from `fromDeg` carries scent: the opposite bearing. */
export function downwindBearing(fromDeg: number): number {
  return normalizeDeg(fromDeg + 180);
}

/** The firm's settings for the planner; each default is common practice, no source. */
export interface HuntingSettings {
  /** Half the spread of the downwind scent cone, degrees. */
  coneHalfAngleDeg: number;
  /** How far downwind scent is taken to matter, yards. */
  coneReachYd: number;
  /** An access route closer than this to a bedding area or sanctuary is warned about, yards. */
  routeBufferYd: number;
  /** A route whose path comes this close to a stand leads to it, yards. */
  routeToStandYd: number;
  /** More sits than this on one stand within seven days is warned about. */
  maxSitsPerWeek: number;
}

/** Defaults: common practice, no source. */
export const DEFAULT_HUNTING_SETTINGS: HuntingSettings = {
  coneHalfAngleDeg: 30,
  coneReachYd: 300,
  routeBufferYd: 100,
  routeToStandYd: 50,
  maxSitsPerWeek: 2,
};

/** The firm's planner settings (stored under `settings.hunting`), with defaults for what is unset. */
export function huntingSettings(firmSettings: Record<string, unknown> | null | undefined): HuntingSettings {
  const stored = (firmSettings?.hunting ?? {}) as Partial<HuntingSettings>;
  const out = { ...DEFAULT_HUNTING_SETTINGS };
  for (const k of Object.keys(out) as (keyof HuntingSettings)[]) {
    const v = stored[k];
    if (typeof v === 'number' && Number.isFinite(v) && v > 0) out[k] = v;
  }
  return out;
}

export type WindReasonKind = 'bedding-area' | 'sanctuary' | 'approach-side' | 'route';

/** Why a wind does not suit a stand: the unit concerned (a bedding area, sanctuary, the watched unit, or an access route). */
export interface WindReason {
  kind: WindReasonKind;
  unitId: number;
  name: string;
}

export interface WindJudgement {
  from: WindName;
  degrees: number;
  suitable: boolean;
  reasons: WindReason[];
  /** The access routes to the stand that suit this wind (walk in by one of these). */
  routeIds: number[];
}

/** A unit of the plan as the planner reads it. */
export interface LayoutUnit {
  id: number;
  name: string;
  kind: UnitKind;
  geometry: Geometry;
}

/** A stand site with what it watches. `approachFrom` overrides the approach side found from the nearest bedding area. */
export interface StandInput {
  id: number;
  name: string;
  geometry: Point;
  watchedUnitId?: number | null;
  approachFrom?: WindName | null;
}

export interface StandWinds {
  unitId: number;
  name: string;
  winds: WindJudgement[];
  /** The access routes that lead to the stand. */
  routeIds: number[];
}

const coneFor = (apex: Position, fromDeg: number, s: HuntingSettings): Cone => ({
  apex,
  bearingDeg: downwindBearing(fromDeg),
  halfAngleDeg: s.coneHalfAngleDeg,
  reachM: s.coneReachYd * METRES_PER_YARD,
});

const PROTECTED: UnitKind[] = ['bedding-area', 'sanctuary'];

/** A representative point of a unit: the shared centroid (area-weighted over all the parts of an area). */
function areaCenter(geometry: Geometry): Position | null {
  if (!partsOf(geometry)[0]?.[0]?.length) return null;
  const c = centroidOf(geometry);
  return [c.lon, c.lat];
}

/**
 * The side of a watched unit deer approach from, as a wedge polygon: from the unit's centre toward
 * `approachFrom` (or, when not given, toward the nearest bedding area or sanctuary), ±45°, out to the
 * unit's own radius plus the cone's reach. Null when there is no way to tell.
 */
export function approachSide(watched: LayoutUnit, units: readonly LayoutUnit[], s: HuntingSettings, approachFrom?: WindName | null): Geometry | null {
  const center = watched.geometry.type === 'Point' ? watched.geometry.coordinates : areaCenter(watched.geometry);
  if (!center) return null;
  let bearing: number | null = approachFrom ? windDegrees(approachFrom) : null;
  if (bearing === null) {
    let best = Infinity;
    for (const u of units) {
      if (!PROTECTED.includes(u.kind) || u.id === watched.id) continue;
      const c = areaCenter(u.geometry);
      if (!c) continue;
      const line = inverse(center, c);
      if (line.distanceM < best) [best, bearing] = [line.distanceM, line.bearingDeg];
    }
  }
  if (bearing === null) return null;
  let radiusM = 0;
  for (const part of partsOf(watched.geometry)) for (const ring of part) for (const p of ring) radiusM = Math.max(radiusM, inverse(center, p).distanceM);
  const reach = radiusM + s.coneReachYd * METRES_PER_YARD;
  const ring: Position[] = [center];
  for (let a = -45; a <= 45; a += 7.5) ring.push(destination(center, bearing + a, reach));
  ring.push(center);
  return { type: 'Polygon', coordinates: [ring] };
}

const paths = (g: Geometry): Position[][] => (g.type === 'LineString' ? [g.coordinates] : g.type === 'MultiLineString' ? g.coordinates : []);

/** The access routes whose path comes within `routeToStandYd` of the stand. */
export function routesToStand(stand: Point, routes: readonly LayoutUnit[], s: HuntingSettings): LayoutUnit[] {
  const near = s.routeToStandYd * METRES_PER_YARD;
  return routes.filter((r) => paths(r.geometry).some((p) => pointToPathM(stand.coordinates, p) <= near));
}

/** Protected units (bedding areas, sanctuaries) a cone from any of `apexes` reaches. */
function reachedProtected(apexes: readonly Position[], fromDeg: number, protectedUnits: readonly LayoutUnit[], s: HuntingSettings): LayoutUnit[] {
  return protectedUnits.filter((u) => apexes.some((apex) => coneReaches(coneFor(apex, fromDeg, s), u.geometry)));
}

/** Per wind, the protected units an access route's walking path lays scent over (cones from points along it). */
export function judgeRoute(route: LayoutUnit, units: readonly LayoutUnit[], s: HuntingSettings): Map<WindName, LayoutUnit[]> {
  const protectedUnits = units.filter((u) => PROTECTED.includes(u.kind));
  const step = Math.max(5, (s.coneReachYd * METRES_PER_YARD) / 8);
  const apexes = paths(route.geometry).flatMap((p) => samplePath(p, step, 120));
  const out = new Map<WindName, LayoutUnit[]>();
  for (const name of WIND_NAMES) out.set(name, reachedProtected(apexes, windDegrees(name), protectedUnits, s));
  return out;
}

/** The 16-wind judgement of every stand of a plan (stands from `stands`, everything else from `units`). */
export function judgeStandWinds(stands: readonly StandInput[], units: readonly LayoutUnit[], s: HuntingSettings = DEFAULT_HUNTING_SETTINGS): StandWinds[] {
  const protectedUnits = units.filter((u) => PROTECTED.includes(u.kind));
  const routes = units.filter((u) => u.kind === 'access-route');
  const routeJudgements = new Map<number, Map<WindName, LayoutUnit[]>>();
  const byId = new Map(units.map((u) => [u.id, u]));
  return stands.map((stand) => {
    const watched = stand.watchedUnitId ? byId.get(stand.watchedUnitId) : undefined;
    const approach = watched ? approachSide(watched, units, s, stand.approachFrom) : null;
    const myRoutes = routesToStand(stand.geometry, routes, s);
    for (const r of myRoutes) if (!routeJudgements.has(r.id)) routeJudgements.set(r.id, judgeRoute(r, units, s));
    const winds = WIND_NAMES.map((from): WindJudgement => {
      const degrees = windDegrees(from);
      const cone = coneFor(stand.geometry.coordinates, degrees, s);
      const reasons: WindReason[] = protectedUnits
        .filter((u) => coneReaches(cone, u.geometry))
        .map((u) => ({ kind: u.kind as 'bedding-area' | 'sanctuary', unitId: u.id, name: u.name }));
      if (watched && approach && coneReaches(cone, approach)) reasons.push({ kind: 'approach-side', unitId: watched.id, name: watched.name });
      const goodRoutes = myRoutes.filter((r) => routeJudgements.get(r.id)!.get(from)!.length === 0).map((r) => r.id);
      if (myRoutes.length > 0 && goodRoutes.length === 0) {
        for (const r of myRoutes) reasons.push({ kind: 'route', unitId: r.id, name: r.name });
      }
      return { from, degrees, suitable: reasons.length === 0, reasons, routeIds: goodRoutes };
    });
    return { unitId: stand.id, name: stand.name, winds, routeIds: myRoutes.map((r) => r.id) };
  });
}

export type RouteWarningCode = 'route-near-bedding' | 'route-near-sanctuary' | 'route-crosses-food-plot';

export interface RouteWarning {
  code: RouteWarningCode;
  unitIds: number[];
  message: string;
  /** How close the route comes, yards (0 when it enters). */
  distanceYd: number;
}

/** Plan checks for access routes: within `routeBufferYd` of a bedding area or sanctuary, or across a food plot. */
export function accessRouteWarnings(units: readonly LayoutUnit[], s: HuntingSettings = DEFAULT_HUNTING_SETTINGS): RouteWarning[] {
  const out: RouteWarning[] = [];
  const bufferM = s.routeBufferYd * METRES_PER_YARD;
  for (const route of units.filter((u) => u.kind === 'access-route')) {
    for (const area of units) {
      if (area.kind !== 'bedding-area' && area.kind !== 'sanctuary' && area.kind !== 'food-plot') continue;
      const dM = Math.min(...paths(route.geometry).map((p) => pathToAreaM(p, area.geometry)));
      const yd = Math.round(dM / METRES_PER_YARD);
      if (area.kind === 'food-plot') {
        if (dM === 0) out.push({ code: 'route-crosses-food-plot', unitIds: [route.id, area.id], distanceYd: 0, message: `Access route “${route.name}” crosses the food plot “${area.name}”: walk around its edge so deer feeding there are not pushed off.` });
      } else if (dM <= bufferM) {
        const what = area.kind === 'bedding-area' ? 'bedding area' : 'sanctuary';
        out.push({
          code: area.kind === 'bedding-area' ? 'route-near-bedding' : 'route-near-sanctuary',
          unitIds: [route.id, area.id],
          distanceYd: yd,
          message: `Access route “${route.name}” comes within ${yd} yd of the ${what} “${area.name}” (keep at least ${s.routeBufferYd} yd): move it further out.`,
        });
      }
    }
  }
  return out;
}

/** The share of the wind record's hours (rose shares by wind) in winds that suit the stand, 0–1. */
export function huntableShare(winds: readonly WindJudgement[], rose: readonly { from: WindName; share: number }[]): number {
  const suitable = new Set(winds.filter((w) => w.suitable).map((w) => w.from));
  const share = rose.reduce((sum, r) => sum + (suitable.has(r.from) ? r.share : 0), 0);
  return Math.round(share * 10000) / 10000;
}
