/**
 * Checks of a whole plan against its property boundary and against common practice for food
 * plots, and the share of the property in each area kind. Warnings, not errors: the consultant
 * decides. Every warning names the units it concerns and says what to do.
 */
import {
  along,
  bbox,
  booleanPointInPolygon,
  buffer,
  difference,
  feature,
  featureCollection,
  intersect,
  lineSplit,
} from '@turf/turf';
import type { BBox, Feature, Geometry, LineString, Polygon } from 'geojson';
import {
  areaSqM,
  fitsFamily,
  lengthM,
  measureArea,
  measureUnit,
  type AreaGeometry,
  type LineGeometry,
  type PointGeometry,
} from './geometry';
import { findGeometryProblems } from './geometry-problems';
import { AREA_KINDS, KIND_STYLES, kindFamily, type AreaKind, type UnitKind } from './unit-kinds';
import { METRES_PER_FOOT, metresToFeet, sqMetresToAcres } from '../units';
import { accessRouteWarnings, DEFAULT_HUNTING_SETTINGS, type RouteWarningCode } from './stand-winds';

/** Smallest food plot, acres: NRCS CRP practice CP12 (wildlife food plot) job sheet. */
export const FOOD_PLOT_MIN_ACRES = 0.25;
/** Narrowest food plot, feet: NRCS CRP practice CP12 job sheet. */
export const FOOD_PLOT_MIN_WIDTH_FT = 40;
/** Food plots in total commonly cover 1–10 % of a property (Georgia DNR biologist; weak source). */
export const FOOD_PLOT_SHARE_MIN_PCT = 1;
export const FOOD_PLOT_SHARE_MAX_PCT = 10;
/**
 * Overlaps and parts outside the boundary smaller than this are ignored: slivers left when an edge
 * is traced by hand along a neighbour's (0.01 acre is about 2 ft × 218 ft). Common practice, no source.
 */
export const NEGLIGIBLE_ACRES = 0.01;
/** Line lengths outside the boundary shorter than this are ignored (tracing slop). */
export const NEGLIGIBLE_LENGTH_FT = 10;

export type PlanWarningCode =
  | 'outside-boundary'
  | 'partly-outside-boundary'
  | 'overlap'
  | 'food-plot-small'
  | 'food-plot-narrow'
  | 'food-plot-share-low'
  | 'food-plot-share-high'
  | 'invalid-geometry'
  | 'check-failed'
  | 'plant-back'
  | 'rotation'
  | RouteWarningCode;

export interface PlanWarning {
  code: PlanWarningCode;
  unitIds: string[];
  message: string;
  /** Acres concerned: outside the boundary, overlapping, the plot's size, or all food plots. */
  acres?: number;
  /** Feet concerned: a line's length outside the boundary, or a food plot's estimated width. */
  lengthFt?: number;
}

export interface PlanUnit {
  id: string;
  name: string;
  kind: UnitKind;
  geometry: Geometry;
}

export interface PlanCheckInput {
  /** The property boundary; null when none is drawn yet (boundary and share checks are skipped). */
  boundary: AreaGeometry | null;
  units: readonly PlanUnit[];
  /** Vertex cap for the structural pre-check of each shape (default 10,000; see findGeometryProblems). */
  maxVertices?: number;
  /** Above this many vertices the self-crossing pre-check is skipped (stored shapes passed PostGIS). */
  crossingCheckMaxVertices?: number;
  /** Access routes closer than this to a bedding area or sanctuary are warned about (the firm's hunting setting; default 100 yd, common practice). */
  routeBufferYd?: number;
}

/** Default vertex cap of the pre-check: turf `kinks` takes about 0.35 s at this size. */
export const DEFAULT_MAX_VERTICES = 10000;

export interface KindShareRow {
  kind: AreaKind | 'unassigned';
  label: string;
  acres: number;
  pctOfProperty: number;
}

/**
 * All warnings for a plan: units (partly) outside the boundary, overlapping area units, food plots
 * under 0.25 acre or narrower than 40 ft (NRCS CP12), food plots in total outside 1–10 % of the
 * property. A unit (or boundary) with a structural problem gets an 'invalid-geometry' warning and is
 * left out of the other checks; one whose check throws anyway gets 'check-failed' instead of a crash.
 */
export function planWarnings(input: PlanCheckInput): PlanWarning[] {
  const warnings: PlanWarning[] = [];
  const maxVertices = input.maxVertices ?? DEFAULT_MAX_VERTICES;
  let boundary: Feature<AreaGeometry> | null = null;
  if (input.boundary) {
    const [problem] = findGeometryProblems(input.boundary, { maxVertices, crossingCheckMaxVertices: input.crossingCheckMaxVertices });
    if (problem) {
      warnings.push({
        code: 'invalid-geometry',
        unitIds: [],
        message: `The property boundary cannot be used for checks, so units were not checked against it: ${problem.message}`,
      });
    } else {
      boundary = feature(input.boundary);
    }
  }
  const areaUnits: { unit: PlanUnit; box: BBox }[] = [];
  const checkable: PlanUnit[] = [];
  const foodPlotIds: string[] = [];
  let foodPlotAcres = 0;

  for (const unit of input.units) {
    const [problem] = findGeometryProblems(unit.geometry, { maxVertices, crossingCheckMaxVertices: input.crossingCheckMaxVertices });
    if (problem) {
      warnings.push({
        code: 'invalid-geometry',
        unitIds: [unit.id],
        message: `${quote(unit.name)} cannot be checked until its shape is fixed: ${problem.message}`,
      });
      continue;
    }
    checkable.push(unit);
    try {
      const measure = measureUnit(unit.kind, unit.geometry);
      if (boundary) warnings.push(...boundaryWarnings(unit, boundary, measure.acres));
      if (measure.acres !== null) {
        areaUnits.push({ unit, box: bbox(unit.geometry) });
      }
      if (unit.kind === 'food-plot' && measure.acres !== null) {
        foodPlotAcres += measure.acres;
        foodPlotIds.push(unit.id);
        warnings.push(...foodPlotWarnings(unit, measure.acres));
      }
    } catch (err) {
      warnings.push(checkFailed([unit], err));
    }
  }

  warnings.push(...overlapWarnings(areaUnits));

  if (boundary && foodPlotIds.length > 0) {
    const share = foodPlotShareWarning(measureArea(boundary.geometry).acres, foodPlotAcres, foodPlotIds);
    if (share) warnings.push(share);
  }
  warnings.push(...routeWarnings(checkable, input.routeBufferYd ?? DEFAULT_HUNTING_SETTINGS.routeBufferYd));
  return warnings;
}

/** The hunting planner's access-route checks (near bedding/sanctuary, across a food plot) as plan warnings. */
function routeWarnings(units: readonly PlanUnit[], routeBufferYd: number): PlanWarning[] {
  const relevant = units.filter((u) => ['access-route', 'bedding-area', 'sanctuary', 'food-plot'].includes(u.kind));
  if (!relevant.some((u) => u.kind === 'access-route')) return [];
  try {
    const layout = relevant.map((u, i) => ({ id: i, name: u.name, kind: u.kind, geometry: u.geometry }));
    return accessRouteWarnings(layout, { ...DEFAULT_HUNTING_SETTINGS, routeBufferYd }).map((w) => ({ code: w.code, unitIds: w.unitIds.map((i) => relevant[i]!.id), message: w.message }));
  } catch (err) {
    return [checkFailed(relevant.filter((u) => u.kind === 'access-route'), err)];
  }
}

function boundaryWarnings(unit: PlanUnit, boundary: Feature<AreaGeometry>, unitAcres: number | null): PlanWarning[] {
  const ids = [unit.id];
  const name = quote(unit.name);
  const family = kindFamily(unit.kind);

  if (family === 'area' && unitAcres !== null) {
    const shape = feature(unit.geometry as AreaGeometry);
    const inside = intersect(featureCollection([shape, boundary]));
    if (!inside) {
      return [{
        code: 'outside-boundary',
        unitIds: ids,
        acres: unitAcres,
        message: `${name} lies entirely outside the property boundary: move it inside, or correct the boundary.`,
      }];
    }
    const outside = difference(featureCollection([shape, boundary]));
    const outsideAcres = outside ? sqMetresToAcres(areaSqM(outside.geometry)) : 0;
    if (outsideAcres < NEGLIGIBLE_ACRES) return [];
    return [{
      code: 'partly-outside-boundary',
      unitIds: ids,
      acres: outsideAcres,
      message: `${name} extends ${formatAcres(outsideAcres)} outside the property boundary: trim it to the boundary, or correct the boundary.`,
    }];
  }

  if (family === 'line') {
    const { totalFt, outsideFt } = lineOutside(unit.geometry as LineGeometry, boundary);
    if (outsideFt < NEGLIGIBLE_LENGTH_FT) return [];
    if (outsideFt >= totalFt - NEGLIGIBLE_LENGTH_FT) {
      return [{
        code: 'outside-boundary',
        unitIds: ids,
        lengthFt: totalFt,
        message: `${name} runs entirely outside the property boundary: move it inside, or correct the boundary.`,
      }];
    }
    return [{
      code: 'partly-outside-boundary',
      unitIds: ids,
      lengthFt: outsideFt,
      message: `${name} runs ${formatFeet(outsideFt)} outside the property boundary: end it at the boundary, or correct the boundary.`,
    }];
  }

  const points = unit.geometry as PointGeometry;
  const positions = points.type === 'Point' ? [points.coordinates] : points.coordinates;
  const outsideCount = positions.filter((p) => !booleanPointInPolygon(p, boundary)).length;
  if (outsideCount === 0) return [];
  const all = outsideCount === positions.length;
  return [{
    code: all ? 'outside-boundary' : 'partly-outside-boundary',
    unitIds: ids,
    message: all
      ? `${name} is outside the property boundary: move it inside, or correct the boundary.`
      : `${outsideCount} of the ${positions.length} points of ${name} are outside the property boundary: move them inside, or correct the boundary.`,
  }];
}

/** Length of a line and of its parts outside the boundary, split where it crosses the boundary edge. */
function lineOutside(geom: LineGeometry, boundary: Feature<AreaGeometry>): { totalFt: number; outsideFt: number } {
  const parts: LineString[] =
    geom.type === 'LineString' ? [geom] : geom.coordinates.map((coordinates) => ({ type: 'LineString', coordinates }));
  let totalM = 0;
  let outsideM = 0;
  for (const part of parts) {
    const split = lineSplit(feature(part), boundary).features;
    const pieces = split.length > 0 ? split : [feature(part)];
    for (const piece of pieces) {
      const pieceM = lengthM(piece.geometry);
      totalM += pieceM;
      const middle = along(piece, pieceM / 2, { units: 'meters' });
      if (!booleanPointInPolygon(middle, boundary)) outsideM += pieceM;
    }
  }
  return { totalFt: metresToFeet(totalM), outsideFt: metresToFeet(outsideM) };
}

function foodPlotWarnings(unit: PlanUnit, acres: number): PlanWarning[] {
  const warnings: PlanWarning[] = [];
  const name = quote(unit.name);
  if (acres < FOOD_PLOT_MIN_ACRES) {
    warnings.push({
      code: 'food-plot-small',
      unitIds: [unit.id],
      acres,
      message: `${name} is ${formatAcres(acres)}; a food plot should be at least ${FOOD_PLOT_MIN_ACRES} acre (NRCS practice CP12): enlarge it or merge it with a nearby plot.`,
    });
  }
  const geom = unit.geometry as AreaGeometry;
  const parts: Polygon[] =
    geom.type === 'Polygon' ? [geom] : geom.coordinates.map((coordinates) => ({ type: 'Polygon', coordinates }));
  const widths = parts.map((part) => inscribedWidthFt(part, FOOD_PLOT_MIN_WIDTH_FT));
  const narrowest = Math.min(...widths);
  if (narrowest < FOOD_PLOT_MIN_WIDTH_FT) {
    const where = parts.length > 1 ? `part ${widths.indexOf(narrowest) + 1} of ${name} is` : `${name} is`;
    warnings.push({
      code: 'food-plot-narrow',
      unitIds: [unit.id],
      lengthFt: narrowest,
      message: `${capitalise(where)} only about ${Math.floor(narrowest)} ft wide; a food plot should be at least ${FOOD_PLOT_MIN_WIDTH_FT} ft wide (NRCS practice CP12): widen it.`,
    });
  }
  return warnings;
}

/**
 * Width of a polygon in feet, estimated as the diameter of the largest circle that fits inside it,
 * capped at `capFt`. Method: shrink the outline by a negative buffer (turf `buffer`); a shape
 * narrower than W vanishes under an inset of W/2. If an inset of capFt/2 leaves something, the shape
 * is at least capFt wide somewhere and capFt is returned; otherwise the inset that just empties it is
 * found by bisection to 0.25 ft. For a strip this is its width; a wide plot with a narrow arm
 * counts as wide (the arm is not flagged).
 */
export function inscribedWidthFt(polygon: Polygon, capFt: number): number {
  if (survivesInset(polygon, capFt / 2)) return capFt;
  let lo = 0;
  let hi = capFt / 2;
  while (hi - lo > 0.125) {
    const mid = (lo + hi) / 2;
    if (survivesInset(polygon, mid)) lo = mid;
    else hi = mid;
  }
  return lo + hi; // twice the midpoint of the last bracket
}

function survivesInset(polygon: Polygon, insetFt: number): boolean {
  if (insetFt <= 0) return true;
  const shrunk = buffer(feature(polygon), -insetFt * METRES_PER_FOOT, { units: 'meters' });
  return shrunk !== undefined && areaSqM(shrunk.geometry) > 0;
}

/** Pairwise overlaps of area units; pairs whose bounding boxes are apart are skipped unclipped. */
function overlapWarnings(areaUnits: { unit: PlanUnit; box: BBox }[]): PlanWarning[] {
  const warnings: PlanWarning[] = [];
  for (let i = 0; i < areaUnits.length; i++) {
    for (let j = i + 1; j < areaUnits.length; j++) {
      const a = areaUnits[i];
      const b = areaUnits[j];
      if (!boxesMeet(a.box, b.box)) continue;
      try {
        const shared = intersect(
          featureCollection([feature(a.unit.geometry as AreaGeometry), feature(b.unit.geometry as AreaGeometry)]),
        );
        const acres = shared ? sqMetresToAcres(areaSqM(shared.geometry)) : 0;
        if (acres < NEGLIGIBLE_ACRES) continue;
        warnings.push({
          code: 'overlap',
          unitIds: [a.unit.id, b.unit.id],
          acres,
          message: `${quote(a.unit.name)} and ${quote(b.unit.name)} overlap by ${formatAcres(acres)}: trim one of them so that ground is not planned or billed twice.`,
        });
      } catch (err) {
        warnings.push(checkFailed([a.unit, b.unit], err));
      }
    }
  }
  return warnings;
}

function boxesMeet(a: BBox, b: BBox): boolean {
  return a[0] <= b[2] && b[0] <= a[2] && a[1] <= b[3] && b[1] <= a[3];
}

function foodPlotShareWarning(boundaryAcres: number, foodPlotAcres: number, ids: string[]): PlanWarning | null {
  if (!(boundaryAcres > 0)) return null;
  const pct = (foodPlotAcres / boundaryAcres) * 100;
  const said = `Food plots total ${formatAcres(foodPlotAcres)}, ${formatPct(pct)} of the property`;
  if (pct < FOOD_PLOT_SHARE_MIN_PCT) {
    return {
      code: 'food-plot-share-low',
      unitIds: ids,
      acres: foodPlotAcres,
      message: `${said}; ${FOOD_PLOT_SHARE_MIN_PCT}–${FOOD_PLOT_SHARE_MAX_PCT} % is common practice: consider more or larger plots if the landowner wants deer to feed on the property.`,
    };
  }
  if (pct > FOOD_PLOT_SHARE_MAX_PCT) {
    return {
      code: 'food-plot-share-high',
      unitIds: ids,
      acres: foodPlotAcres,
      message: `${said}; ${FOOD_PLOT_SHARE_MIN_PCT}–${FOOD_PLOT_SHARE_MAX_PCT} % is common practice: check that enough cover and bedding ground remains.`,
    };
  }
  return null;
}

/**
 * Acres and share of the property per area kind (kinds present, in palette order) plus an
 * "unassigned" remainder. Overlapping units are counted once per unit (so shares may sum to more
 * than 100 %) and units outside the boundary count in full; planWarnings reports both cases. The
 * remainder never goes below zero. Line and point units are ignored.
 */
export function shareByKind(boundaryAcres: number, units: readonly Pick<PlanUnit, 'kind' | 'geometry'>[]): KindShareRow[] {
  if (!Number.isFinite(boundaryAcres) || boundaryAcres <= 0) {
    throw new RangeError(`The property boundary measures ${boundaryAcres} acres: draw the boundary before computing shares by kind.`);
  }
  const acresByKind = new Map<AreaKind, number>();
  for (const unit of units) {
    if (kindFamily(unit.kind) !== 'area' || !fitsFamily('area', unit.geometry)) continue;
    const kind = unit.kind as AreaKind;
    acresByKind.set(kind, (acresByKind.get(kind) ?? 0) + measureArea(unit.geometry as AreaGeometry).acres);
  }
  const rows: KindShareRow[] = AREA_KINDS.filter((kind) => acresByKind.has(kind)).map((kind) => {
    const acres = acresByKind.get(kind)!;
    return { kind, label: KIND_STYLES[kind].label, acres, pctOfProperty: (acres / boundaryAcres) * 100 };
  });
  const assigned = rows.reduce((sum, row) => sum + row.acres, 0);
  const unassigned = Math.max(0, boundaryAcres - assigned);
  rows.push({ kind: 'unassigned', label: 'Unassigned', acres: unassigned, pctOfProperty: (unassigned / boundaryAcres) * 100 });
  return rows;
}

function checkFailed(units: PlanUnit[], err: unknown): PlanWarning {
  const names = units.map((u) => quote(u.name)).join(' and ');
  const reason = err instanceof Error ? err.message : String(err);
  return {
    code: 'check-failed',
    unitIds: units.map((u) => u.id),
    message: `Could not check ${names}: ${reason.replace(/\.$/, '')}. Redraw the shape if the problem stays.`,
  };
}

function quote(name: string): string {
  return `"${name.trim() || 'Unnamed unit'}"`;
}

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

/** "0.20 acre", "3.45 acres", "12.3 acres". */
export function formatAcres(acres: number): string {
  const text = acres < 10 ? acres.toFixed(2) : acres.toFixed(1);
  return `${text} ${Number(text) <= 1 ? 'acre' : 'acres'}`;
}

function formatFeet(ft: number): string {
  return `${Math.round(ft).toLocaleString('en-US')} ft`;
}

function formatPct(pct: number): string {
  return `${pct < 10 ? pct.toFixed(1) : pct.toFixed(0)} %`;
}

/** One task of the plan as the season checks read it: its unit, step kind, date and materials. */
export interface SeasonTaskInput {
  unitId: string;
  unitName: string;
  /** Step kind: 'spray' carries herbicides, 'seed' and 'plant' sow the plot. */
  kind: string;
  name: string;
  /** The day the work happens: done on, else its scheduled start, else its earliest day (YYYY-MM-DD). */
  date: string;
  /** Material keys the task applies. */
  materialKeys: readonly string[];
}

/** A herbicide's plant-back interval from its label, days. */
export interface PlantBackMaterial {
  key: string;
  name: string;
  plantBackDays: number;
}

const SEEDING_KINDS = new Set(['seed', 'plant']);

/** Whole days from `a` to `b` (ISO dates, UTC calendar days). */
function daysBetween(a: string, b: string): number {
  return Math.round((Date.parse(`${b}T00:00:00Z`) - Date.parse(`${a}T00:00:00Z`)) / 86_400_000);
}

/** `date` plus `days` calendar days, ISO. */
function addDays(date: string, days: number): string {
  return new Date(Date.parse(`${date}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
}

/**
 * Plant-back warnings: a herbicide task whose date plus the product's plant-back interval (a field
 * on the material, from its label) falls after a seeding planned on or after it on the same unit.
 * A seeding before the spray is not its follow crop and is not checked. The label is the law: the
 * message says to move the seeding or use a product whose label allows it.
 */
export function plantBackWarnings(tasks: readonly SeasonTaskInput[], herbicides: readonly PlantBackMaterial[]): PlanWarning[] {
  const byKey = new Map(herbicides.map((h) => [h.key, h]));
  const warnings: PlanWarning[] = [];
  for (const spray of tasks) {
    for (const key of spray.materialKeys) {
      const herbicide = byKey.get(key);
      if (!herbicide || herbicide.plantBackDays <= 0) continue;
      const clear = addDays(spray.date, herbicide.plantBackDays);
      for (const seeding of tasks) {
        if (seeding.unitId !== spray.unitId || !SEEDING_KINDS.has(seeding.kind)) continue;
        const gap = daysBetween(spray.date, seeding.date);
        if (gap < 0 || gap >= herbicide.plantBackDays) continue;
        warnings.push({
          code: 'plant-back',
          unitIds: [spray.unitId],
          message: `${quote(spray.unitName)}: ${herbicide.name} sprayed ${spray.date} has a plant-back interval of ${herbicide.plantBackDays} days on its label, so "${seeding.name}" on ${seeding.date} is ${herbicide.plantBackDays - gap} days too early. Seed on or after ${clear}, or choose a product whose label allows this crop sooner; the label is the law and local rules may be stricter.`,
        });
      }
    }
  }
  return warnings;
}

/** A unit's crop family per season (from the species its prescriptions sow; null when nothing is sown). */
export interface RotationUnitInput {
  unitId: string;
  unitName: string;
  seasons: readonly { year: number; family: string | null }[];
}

/**
 * Rotation warnings: a plot that carries the same crop family in two consecutive seasons (common
 * practice, no source: a family grown again builds up its pests and diseases). One warning per pair.
 */
export function rotationWarnings(units: readonly RotationUnitInput[]): PlanWarning[] {
  const warnings: PlanWarning[] = [];
  for (const unit of units) {
    const byYear = new Map<number, string>();
    for (const s of unit.seasons) if (s.family && !byYear.has(s.year)) byYear.set(s.year, s.family);
    for (const [year, family] of [...byYear].sort((a, b) => a[0] - b[0])) {
      if (byYear.get(year - 1) !== family) continue;
      warnings.push({
        code: 'rotation',
        unitIds: [unit.unitId],
        message: `${quote(unit.unitName)} carries ${family} crops in ${year - 1} and ${year}: rotate to another crop family in ${year} (common practice, no source).`,
      });
    }
  }
  return warnings;
}
