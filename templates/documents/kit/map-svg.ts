/**
 * The plan map as an SVG document for pdfmake's `svg` node: property boundary, units in our kind
 * palette and symbols, area labels where they fit, and a band below the map with the legend (only
 * the kinds present), a scale bar in round feet or miles, and a north arrow.
 *
 * Projection: the shared map projection (shared/domain/map-projection.ts, on d3-geo): a local
 * equirectangular projection centred on the drawing with the WGS84 radii of curvature at the centre
 * latitude, north up, one scale on both axes. Label spots start from the shared centroid
 * (shared/domain/centroid.ts).
 *
 * Only SVG features that pdfmake's svg-to-pdfkit draws are used: paths, rects, circles, polylines,
 * text with text-anchor, fill-opacity, stroke-dasharray, evenodd fill. Every text is XML-escaped.
 */
import { escapeXml } from '../../../shared/domain/xml';
import type { BBox, Geometry, MultiPolygon, Polygon, Position } from 'geojson';
import { DomainValidationError } from '../../../shared/domain/errors';
import { fitsFamily, GeometryKindMismatchError } from '../../../shared/domain/geometry';
import { isUnitKind, KIND_STYLES, kindFamily, UNIT_KINDS, type KindStyle, type UnitKind } from '../../../shared/domain/unit-kinds';
import { FEET_PER_MILE, METRES_PER_FOOT } from '../../../shared/units';
import { DOC_COLORS, FONT_BODY, FONT_HEADING } from './look';
import { areaPaint, fmt, labelWidthPt, lineSvg, SYMBOL_HALF_PT, symbolSvg } from './map-marks';
import { insidePoly, overlaps, polyArea, rectSamples, segmentHitsRect, within, type Poly, type Pt, type Rect } from './map-planar';
import { z } from 'zod';
import { areaCentroid } from '../../../shared/domain/centroid';
import { fitProjection, type FittedProjection } from '../../../shared/domain/map-projection';

export interface PlanMapUnit {
  name: string;
  kind: UnitKind;
  geometry: Geometry;
}

/**
 * An aerial photo printed under the plan: the image (a data URL, already downscaled for print by the
 * server), its [lon, lat] corners top-left, top-right, bottom-right, bottom-left, its opacity, and the
 * credit line printed in the frame's corner.
 */
export interface PlanMapOverlay {
  image: string;
  corners: readonly (readonly [number, number])[];
  opacity: number;
  credit: string;
}

/** The overlays a document input may carry (checked by the plan summary and proposal templates). */
export const PlanMapOverlaysSchema = z
  .array(
    z.object({
      image: z.string().startsWith('data:image/', { message: 'must be a data:image/ URL' }),
      corners: z.array(z.tuple([z.number().min(-180).max(180), z.number().min(-85).max(85)])).length(4, { message: 'must be four [longitude, latitude] corners' }),
      opacity: z.number().min(0).max(1),
      credit: z.string().max(200),
    }),
  )
  .max(8, { message: 'at most 8 aerial photos print under a plan' });

export interface PlanMapInput {
  boundary?: Polygon | MultiPolygon | null;
  units: readonly PlanMapUnit[];
  /** Aerial photos drawn under the plan, clipped to the map frame (they do not widen the map). */
  overlays?: readonly PlanMapOverlay[];
  widthPt: number;
  heightPt: number;
  title?: string;
}

/** A rectangle in points, y downwards (SVG and PDF page space). */
export interface MapBox {
  xPt: number;
  yPt: number;
  widthPt: number;
  heightPt: number;
}

/** The plan map's projection: the shared fit (points are its drawing units). */
export type MapProjection = FittedProjection;

export interface ScaleBarLayout {
  x1Pt: number;
  x2Pt: number;
  yPt: number;
  /** Ground length the bar stands for. */
  groundFt: number;
  groundM: number;
  label: string;
}

export interface PlacedLabel {
  text: string;
  /** Centre of the label's box. */
  xPt: number;
  yPt: number;
  widthPt: number;
  heightPt: number;
  fontSizePt: number;
}

export interface PlanMapLayout {
  projection: MapProjection;
  /** The framed map area inside the SVG. */
  frame: MapBox;
  scaleBar: ScaleBarLayout;
  /** Kinds shown in the legend, in the order of UNIT_KINDS. */
  legendKinds: UnitKind[];
  /** Area labels that fitted inside their unit. */
  labels: PlacedLabel[];
}

export interface PlanMap {
  svg: string;
  layout: PlanMapLayout;
}

/** A single point or a sliver still gets a map this many metres across. */
const MIN_SPAN_M = 150;
export const MIN_MAP_WIDTH_PT = 300;
export const MIN_MAP_HEIGHT_PT = 200;

/**
 * The projection that fits the bounding box [west, south, east, north] (degrees) into the box,
 * centred, leaving at least `marginPt` on every side.
 */
export function projectionFor(bbox: BBox, box: MapBox, marginPt = 0): MapProjection {
  const [west, south, east, north] = bbox.length === 6 ? [bbox[0], bbox[1], bbox[3], bbox[4]] : bbox;
  if (![west, south, east, north].every(Number.isFinite) || west > east || south > north) {
    throw new DomainValidationError('bbox', 'The bounding box must be [west, south, east, north] in degrees, west ≤ east and south ≤ north.');
  }
  if (south < -85 || north > 85) {
    throw new DomainValidationError('bbox', 'The plan map cannot draw land beyond 85° of latitude.');
  }
  const availW = box.widthPt - 2 * marginPt;
  const availH = box.heightPt - 2 * marginPt;
  if (!(availW > 0 && availH > 0)) {
    throw new DomainValidationError('box', 'The map box is smaller than its margins; give it more room.');
  }
  return fitProjection([west, south, east, north], { x: box.xPt, y: box.yPt, width: box.widthPt, height: box.heightPt }, { padding: marginPt, minSpanM: MIN_SPAN_M, digits: 2 });
}

export { escapeXml };
export { kindSwatchSvg, labelWidthPt } from './map-marks';

function checkPosition(pos: unknown, field: string, name: string): Position {
  if (
    !Array.isArray(pos) ||
    pos.length < 2 ||
    typeof pos[0] !== 'number' ||
    typeof pos[1] !== 'number' ||
    !Number.isFinite(pos[0]) ||
    !Number.isFinite(pos[1])
  ) {
    throw new DomainValidationError(field, `${name}: every coordinate must be a [longitude, latitude] pair of numbers.`);
  }
  if (pos[0] < -180 || pos[0] > 180 || pos[1] < -90 || pos[1] > 90) {
    throw new DomainValidationError(
      field,
      `${name}: coordinate [${pos[0]}, ${pos[1]}] is not a longitude/latitude in degrees (longitude −180…180 first, then latitude −90…90). Was the shape exported in a projected system?`,
    );
  }
  return pos as Position;
}

function polygonsOf(geom: Polygon | MultiPolygon, field: string, name: string): Position[][][] {
  const polygons = geom.type === 'Polygon' ? [geom.coordinates] : geom.coordinates;
  if (!Array.isArray(polygons) || polygons.length === 0) throw new DomainValidationError(field, `${name}: the shape has no polygon.`);
  for (const rings of polygons) {
    if (!Array.isArray(rings) || rings.length === 0) throw new DomainValidationError(field, `${name}: a polygon has no outer ring.`);
    for (const ring of rings) {
      if (!Array.isArray(ring) || ring.length < 4) {
        throw new DomainValidationError(field, `${name}: every polygon ring needs at least four positions (closed).`);
      }
      ring.forEach((p) => checkPosition(p, field, name));
    }
  }
  return polygons;
}

function linesOf(geom: Geometry, field: string, name: string): Position[][] {
  const lines = geom.type === 'LineString' ? [geom.coordinates] : geom.type === 'MultiLineString' ? geom.coordinates : [];
  if (lines.length === 0) throw new DomainValidationError(field, `${name}: the line has no coordinates.`);
  for (const line of lines) {
    if (!Array.isArray(line) || line.length < 2) throw new DomainValidationError(field, `${name}: a line needs at least two positions.`);
    line.forEach((p) => checkPosition(p, field, name));
  }
  return lines;
}

function pointsOf(geom: Geometry, field: string, name: string): Position[] {
  const points = geom.type === 'Point' ? [geom.coordinates] : geom.type === 'MultiPoint' ? geom.coordinates : [];
  if (points.length === 0) throw new DomainValidationError(field, `${name}: the point has no coordinates.`);
  return points.map((p) => checkPosition(p, field, name));
}

interface PreparedUnit {
  unit: PlanMapUnit;
  style: KindStyle;
  polygons: Position[][][];
  lines: Position[][];
  points: Position[];
}

function prepareUnits(units: readonly PlanMapUnit[]): PreparedUnit[] {
  if (!Array.isArray(units)) throw new DomainValidationError('units', 'units must be a list (it may be empty).');
  return units.map((unit, i) => {
    const field = `units[${i}]`;
    if (!unit || typeof unit.name !== 'string' || unit.name.trim() === '') {
      throw new DomainValidationError(`${field}.name`, `Unit ${i + 1} has no name; give every unit a name.`);
    }
    const kind: unknown = unit.kind;
    if (typeof kind !== 'string' || !isUnitKind(kind)) {
      throw new DomainValidationError(`${field}.kind`, `"${unit.name}" has the unknown kind "${String(kind)}"; use one of ${UNIT_KINDS.join(', ')}.`);
    }
    const family = kindFamily(kind);
    if (!unit.geometry || !fitsFamily(family, unit.geometry)) {
      const error = new GeometryKindMismatchError(kind, unit.geometry?.type ?? '');
      throw new DomainValidationError(`${field}.geometry`, `"${unit.name}": ${error.message}.`);
    }
    const geomField = `${field}.geometry`;
    return {
      unit,
      style: KIND_STYLES[kind],
      polygons: family === 'area' ? polygonsOf(unit.geometry as Polygon | MultiPolygon, geomField, `"${unit.name}"`) : [],
      lines: family === 'line' ? linesOf(unit.geometry, geomField, `"${unit.name}"`) : [],
      points: family === 'point' ? pointsOf(unit.geometry, geomField, `"${unit.name}"`) : [],
    };
  });
}

function bboxOfPositions(positions: Iterable<Position>): BBox | null {
  let west = Infinity;
  let south = Infinity;
  let east = -Infinity;
  let north = -Infinity;
  for (const [lon, lat] of positions) {
    west = Math.min(west, lon);
    east = Math.max(east, lon);
    south = Math.min(south, lat);
    north = Math.max(north, lat);
  }
  return Number.isFinite(west) ? [west, south, east, north] : null;
}

function* allPositions(boundary: Position[][][], units: PreparedUnit[]): Iterable<Position> {
  for (const rings of boundary) for (const ring of rings) yield* ring;
  for (const u of units) {
    for (const rings of u.polygons) for (const ring of rings) yield* ring;
    for (const line of u.lines) yield* line;
    yield* u.points;
  }
}

interface ScaleChoice {
  ft: number;
  label: string;
}

const SCALE_CHOICES: ScaleChoice[] = [
  ...[10, 20, 50, 100, 200, 250, 500, 1000].map((ft) => ({ ft, label: `${ft.toLocaleString('en-US')} ft` })),
  { ft: FEET_PER_MILE / 4, label: '1/4 mi' },
  { ft: FEET_PER_MILE / 2, label: '1/2 mi' },
  ...[1, 2, 5, 10, 20, 50, 100].map((mi) => ({ ft: mi * FEET_PER_MILE, label: `${mi} mi` })),
];

/** The longest round ground distance (feet up to 1,000 ft, then miles) whose bar fits `maxPt`. */
export function chooseScaleBar(ptPerM: number, maxPt: number): ScaleChoice {
  let best = SCALE_CHOICES[0];
  for (const choice of SCALE_CHOICES) {
    if (choice.ft * METRES_PER_FOOT * ptPerM <= maxPt) best = choice;
  }
  return best;
}

const LEGEND_COL_PT = 112;
const LEGEND_ROW_PT = 14;
const BAND_PAD_PT = 8;
const RIGHT_BLOCK_PT = 170;
const TITLE_BAND_PT = 20;
const FRAME_MARGIN_PT = 16;
const LABEL_SIZES_PT = [8.5, 7];
/** Label offsets tried around a centroid, in label widths (x) and heights (y). */
const LABEL_NUDGES: Array<[number, number]> = [
  [0, 0], [0, -1.2], [0, 1.2], [0, -2.4], [0, 2.4], [-0.3, 0], [0.3, 0], [-0.3, -1.2], [0.3, -1.2], [-0.3, 1.2], [0.3, 1.2],
];
const POINT_LABEL_PT = 7;

/** The validated input: the boundary's polygons, the units with their kind style, and the extent of both. */
interface PreparedMap {
  boundary: Position[][][];
  units: PreparedUnit[];
  bbox: BBox;
}

function prepareMap(input: PlanMapInput): PreparedMap {
  const { widthPt, heightPt } = input;
  if (!Number.isFinite(widthPt) || !Number.isFinite(heightPt) || widthPt < MIN_MAP_WIDTH_PT || heightPt < MIN_MAP_HEIGHT_PT) {
    throw new DomainValidationError(
      'widthPt',
      `The plan map needs at least ${MIN_MAP_WIDTH_PT} × ${MIN_MAP_HEIGHT_PT} pt; it was given ${widthPt} × ${heightPt}.`,
    );
  }
  const boundary = input.boundary ? polygonsOf(input.boundary, 'boundary', 'The property boundary') : [];
  const units = prepareUnits(input.units);
  const bbox = bboxOfPositions(allPositions(boundary, units));
  if (!bbox) {
    throw new DomainValidationError('units', 'Nothing to draw: give the property boundary or at least one unit.');
  }
  return { boundary, units, bbox };
}

/** Where things go: optional title, the framed map, then a band with the legend and the scale bar. */
interface FrameLayout {
  frame: MapBox;
  legendKinds: UnitKind[];
  legendRows: number;
  /** Top of the band under the frame. */
  bandTop: number;
}

function frameLayout(input: PlanMapInput, hasBoundary: boolean, units: readonly PreparedUnit[]): FrameLayout {
  const { widthPt, heightPt } = input;
  const present = new Set(units.map((u) => u.unit.kind));
  const legendKinds = UNIT_KINDS.filter((k) => present.has(k));
  const legendItems = (hasBoundary ? 1 : 0) + legendKinds.length;
  const legendCols = Math.max(1, Math.floor((widthPt - RIGHT_BLOCK_PT - BAND_PAD_PT) / LEGEND_COL_PT));
  const legendRows = Math.max(1, Math.ceil(legendItems / legendCols));
  const bandH = Math.max(legendRows * LEGEND_ROW_PT + 2 * BAND_PAD_PT, 50);
  const titleH = input.title ? TITLE_BAND_PT : 0;
  const frame: MapBox = { xPt: 0.5, yPt: titleH + 0.5, widthPt: widthPt - 1, heightPt: heightPt - titleH - bandH - 1 };
  if (frame.heightPt < 120) {
    throw new DomainValidationError(
      'heightPt',
      `The plan map is too short for its ${legendItems}-entry legend; give it at least ${Math.ceil(heightPt - frame.heightPt + 120)} pt of height.`,
    );
  }
  return { frame, legendKinds, legendRows, bandTop: frame.yPt + frame.heightPt + 0.5 };
}

/** An area unit in drawing space: its polygons projected (for labels) and their drawn size. */
interface DrawnArea extends PreparedUnit {
  polys: Poly[];
  size: number;
}

/** The open tag, the title and the frame's background. */
function frameSvg(input: PlanMapInput, frame: MapBox): string {
  const { widthPt, heightPt } = input;
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" width="${fmt(widthPt)}" height="${fmt(heightPt)}" viewBox="0 0 ${fmt(widthPt)} ${fmt(heightPt)}" font-family="${FONT_BODY}">` +
    (input.title
      ? `<text x="0" y="13" font-family="${FONT_HEADING}" font-weight="bold" font-size="11" fill="${DOC_COLORS.ink}">${escapeXml(input.title)}</text>`
      : '') +
    `<rect x="${fmt(frame.xPt)}" y="${fmt(frame.yPt)}" width="${fmt(frame.widthPt)}" height="${fmt(frame.heightPt)}" fill="#EEEBE1" stroke="${DOC_COLORS.rule}" stroke-width="1"/>`
  );
}

/** The base layer: the property lifts off the surrounding ground as paper, with the aerial photos over it. */
function baseLayerSvg(boundaryPath: string, overlays: readonly PlanMapOverlay[], frame: MapBox, projection: MapProjection): string {
  let out = boundaryPath ? `<path id="boundary-fill" d="${boundaryPath}" fill="${DOC_COLORS.card}" fill-rule="evenodd" stroke="none"/>` : '';
  // Aerial photos over the paper and under the plan, clipped to the frame.
  if (overlays.length > 0) out += overlaysSvg(overlays, frame, projection);
  return out;
}

/** Area units, largest first so that small units stay on top. */
function drawnAreas(units: readonly PreparedUnit[], toPoly: (rings: Position[][]) => Poly): DrawnArea[] {
  return units
    .filter((u) => u.polygons.length > 0)
    .map((u) => {
      const polys = u.polygons.map(toPoly);
      return { ...u, polys, size: polys.reduce((acc, p) => acc + polyArea(p), 0) };
    })
    .sort((a, b) => b.size - a.size);
}

function areasSvg(areas: readonly DrawnArea[], projection: MapProjection): string {
  const paths = areas.map(
    (a) => `<path class="unit" data-kind="${a.unit.kind}" d="${projection.path({ type: 'MultiPolygon', coordinates: a.polygons })}" ${areaPaint(a.style)}/>`,
  );
  return `<g id="areas">${paths.join('')}</g>`;
}

function boundaryOutlineSvg(boundaryPath: string): string {
  return boundaryPath ? `<path id="boundary" d="${boundaryPath}" fill="none" stroke="${DOC_COLORS.ink}" stroke-width="1.6" stroke-linejoin="round"/>` : '';
}

function linesSvg(units: readonly PreparedUnit[], projection: MapProjection): string {
  const groups = units
    .filter((u) => u.lines.length > 0)
    .map((u) => `<g class="unit" data-kind="${u.unit.kind}">${lineSvg(u.style, projection.path({ type: 'MultiLineString', coordinates: u.lines }))}</g>`);
  return `<g id="lines">${groups.join('')}</g>`;
}

interface PointMark {
  u: PreparedUnit;
  at: Pt;
}

function pointMarksOf(units: readonly PreparedUnit[], project: (p: Position) => Pt): PointMark[] {
  return units.flatMap((u) => u.points.map((p) => ({ u, at: project(p) })));
}

function pointsSvg(marks: readonly PointMark[]): string {
  return `<g id="points">${marks.map(({ u, at }) => `<g class="unit" data-kind="${u.unit.kind}">${symbolSvg(u.style, at[0], at[1])}</g>`).join('')}</g>`;
}

/** What a label must not cover: boxes already taken (point symbols, other labels) and segments it should rather not cross. */
interface LabelRoom {
  frameRect: Rect;
  occupied: Rect[];
  obstacles: Array<[Pt, Pt]>;
}

function labelRoom(frame: MapBox, boundaryPolys: readonly Poly[], areas: readonly DrawnArea[], lines: readonly Pt[][], marks: readonly PointMark[]): LabelRoom {
  // Segments that labels should rather not cover: lines, the boundary and area outlines.
  const obstacles: Array<[Pt, Pt]> = [];
  const addSegments = (path: Pt[]) => {
    for (let i = 1; i < path.length; i++) obstacles.push([path[i - 1], path[i]]);
  };
  boundaryPolys.forEach((poly) => poly.forEach(addSegments));
  areas.forEach((a) => a.polys.forEach((poly) => poly.forEach(addSegments)));
  lines.forEach(addSegments);
  const occupied = marks.map(({ at }) => ({ x: at[0] - SYMBOL_HALF_PT - 1, y: at[1] - SYMBOL_HALF_PT - 1, w: 2 * SYMBOL_HALF_PT + 2, h: 2 * SYMBOL_HALF_PT + 2 }));
  return { frameRect: { x: frame.xPt + 2, y: frame.yPt + 2, w: frame.widthPt - 4, h: frame.heightPt - 4 }, occupied, obstacles };
}

/** Whether no obstacle segment touches the rectangle (a plain loop: it runs for every label candidate against every segment). */
function clearOfLines(room: LabelRoom, rect: Rect): boolean {
  const { obstacles } = room;
  for (let i = 0; i < obstacles.length; i += 1) if (segmentHitsRect(obstacles[i][0], obstacles[i][1], rect)) return false;
  return true;
}

/**
 * Area labels at the centroid of each unit's largest polygon (the shared centroid,
 * shared/domain/centroid.ts), when the label fits inside it and clear of the units drawn on top of
 * it, of point symbols and of other labels; a spot that no line crosses is preferred over a larger size.
 */
function areaLabels(areas: readonly DrawnArea[], room: LabelRoom, project: (p: Position) => Pt): { labels: PlacedLabel[]; svg: string } {
  const labels: PlacedLabel[] = [];
  let svg = '';
  const byLabelOrder = [...areas].sort((a, b) => a.size - b.size);
  for (const a of byLabelOrder) {
    let largestIndex = 0;
    a.polys.forEach((p, i) => {
      if (polyArea(p) > polyArea(a.polys[largestIndex])) largestIndex = i;
    });
    const largest = a.polys[largestIndex];
    const centre = areaCentroid([a.polygons[largestIndex]]);
    const [cx, cy] = centre ? project([centre.lon, centre.lat]) : largest[0][0];
    const above = areas.slice(areas.indexOf(a) + 1);
    const text = a.unit.name.trim();
    placing: for (const strict of [true, false]) {
      for (const size of LABEL_SIZES_PT) {
        const w = labelWidthPt(text, size) + 6;
        const h = size * 1.25 + 2;
        // The centroid first, then nudged up, down and sideways.
        for (const [dx, dy] of LABEL_NUDGES) {
          const x = cx + dx * w;
          const y = cy + dy * h;
          const rect: Rect = { x: x - w / 2, y: y - h / 2, w, h };
          if (!within(rect, room.frameRect) || room.occupied.some((r) => overlaps(r, rect))) continue;
          if (strict && !clearOfLines(room, rect)) continue;
          const samples = rectSamples(rect);
          if (!samples.every((s) => insidePoly(s, largest))) continue;
          if (above.some((o) => o.polys.some((poly) => samples.some((s) => insidePoly(s, poly))))) continue;
          room.occupied.push(rect);
          labels.push({ text, xPt: x, yPt: y, widthPt: w, heightPt: h, fontSizePt: size });
          svg +=
            `<g class="unit-label" data-kind="${a.unit.kind}"><rect x="${fmt(rect.x)}" y="${fmt(rect.y)}" width="${fmt(rect.w)}" height="${fmt(rect.h)}" rx="2" fill="${DOC_COLORS.card}" fill-opacity="0.82" stroke="none"/>` +
            `<text x="${fmt(x)}" y="${fmt(y + size * 0.36)}" font-size="${size}" font-weight="bold" text-anchor="middle" fill="${DOC_COLORS.ink}">${escapeXml(text)}</text></g>`;
          break placing;
        }
      }
    }
  }
  return { labels, svg };
}

/** Point names beside their symbol (right, left, above, below) where there is room, preferring a spot that no line crosses. */
function pointLabelsSvg(marks: readonly PointMark[], room: LabelRoom): string {
  let svg = '';
  for (const { u, at } of marks) {
    const text = u.unit.name.trim();
    const w = labelWidthPt(text, POINT_LABEL_PT) + 4;
    const h = POINT_LABEL_PT * 1.25 + 1;
    const gap = SYMBOL_HALF_PT + 2;
    const candidates: Array<{ rect: Rect; anchor: 'start' | 'middle' | 'end'; x: number; baseline: number }> = [
      { rect: { x: at[0] + gap, y: at[1] - h / 2, w, h }, anchor: 'start', x: at[0] + gap + 2, baseline: at[1] },
      { rect: { x: at[0] - gap - w, y: at[1] - h / 2, w, h }, anchor: 'end', x: at[0] - gap - 2, baseline: at[1] },
      { rect: { x: at[0] - w / 2, y: at[1] - gap - h, w, h }, anchor: 'middle', x: at[0], baseline: at[1] - gap - h / 2 },
      { rect: { x: at[0] - w / 2, y: at[1] + gap, w, h }, anchor: 'middle', x: at[0], baseline: at[1] + gap + h / 2 },
    ];
    const free = candidates.filter((c) => within(c.rect, room.frameRect) && !room.occupied.some((r) => overlaps(r, c.rect)));
    const spot = free.find((c) => clearOfLines(room, c.rect)) ?? free[0];
    if (!spot) continue;
    room.occupied.push(spot.rect);
    svg +=
      `<g class="point-label" data-kind="${u.unit.kind}"><rect x="${fmt(spot.rect.x)}" y="${fmt(spot.rect.y)}" width="${fmt(spot.rect.w)}" height="${fmt(spot.rect.h)}" rx="1.5" fill="${DOC_COLORS.card}" fill-opacity="0.75" stroke="none"/>` +
      `<text x="${fmt(spot.x)}" y="${fmt(spot.baseline + POINT_LABEL_PT * 0.36)}" font-size="${POINT_LABEL_PT}" text-anchor="${spot.anchor}" fill="${DOC_COLORS.ink}">${escapeXml(text)}</text></g>`;
  }
  return svg;
}

/** The legend on the left of the band: the boundary (when drawn) and the kinds present. */
function legendSvg(layout: FrameLayout, hasBoundary: boolean): string {
  const entries: Array<{ key: string; label: string; swatch: (x: number, y: number) => string }> = [];
  if (hasBoundary) {
    entries.push({
      key: 'boundary',
      label: 'Property boundary',
      swatch: (x, y) => `<rect x="${fmt(x)}" y="${fmt(y - 4.5)}" width="16" height="9" fill="${DOC_COLORS.card}" stroke="${DOC_COLORS.ink}" stroke-width="1.4"/>`,
    });
  }
  for (const kind of layout.legendKinds) {
    const style = KIND_STYLES[kind];
    entries.push({
      key: kind,
      label: style.label,
      swatch: (x, y) => {
        if (style.family === 'area') {
          return `<rect x="${fmt(x)}" y="${fmt(y - 4.5)}" width="16" height="9" ${areaPaint(style)}/>`;
        }
        if (style.family === 'line') return lineSvg(style, `M${fmt(x)} ${fmt(y)}L${fmt(x + 16)} ${fmt(y)}`);
        return symbolSvg(style, x + 8, y, 4.5);
      },
    });
  }
  const items = entries.map((entry, i) => {
    const col = Math.floor(i / layout.legendRows);
    const row = i % layout.legendRows;
    const x = BAND_PAD_PT + col * LEGEND_COL_PT;
    const y = layout.bandTop + BAND_PAD_PT + row * LEGEND_ROW_PT + LEGEND_ROW_PT / 2;
    const cls = entry.key === 'boundary' ? 'legend-boundary' : 'legend-item';
    return `<g class="${cls}" data-kind="${entry.key}">${entry.swatch(x, y)}<text x="${fmt(x + 22)}" y="${fmt(y + 3)}" font-size="8.5" fill="${DOC_COLORS.ink}">${escapeXml(entry.label)}</text></g>`;
  });
  return `<g id="legend">${items.join('')}</g>`;
}

/** Horizontal centre of the north arrow, at the right end of the band. */
const arrowXOf = (widthPt: number): number => widthPt - BAND_PAD_PT - 10;

/** The scale bar left of the north arrow: the longest round distance that fits, in four segments. */
function scaleBar(layout: FrameLayout, widthPt: number, projection: MapProjection): { bar: ScaleBarLayout; svg: string } {
  const maxBarPt = Math.min(110, layout.frame.widthPt * 0.3);
  const choice = chooseScaleBar(projection.unitsPerMetre, maxBarPt);
  const groundM = choice.ft * METRES_PER_FOOT;
  const barPt = groundM * projection.unitsPerMetre;
  const x2 = arrowXOf(widthPt) - 30;
  const x1 = x2 - barPt;
  const barY = layout.bandTop + BAND_PAD_PT + 10;
  const segment = barPt / 4;
  let svg = `<g id="scale-bar" data-ground-ft="${choice.ft}">`;
  for (let i = 0; i < 4; i++) {
    svg += `<rect class="scale-segment" x="${fmt(x1 + i * segment)}" y="${fmt(barY)}" width="${fmt(segment)}" height="4" fill="${i % 2 === 0 ? DOC_COLORS.ink : DOC_COLORS.card}" stroke="${DOC_COLORS.ink}" stroke-width="0.6"/>`;
  }
  svg +=
    `<text x="${fmt(x1)}" y="${fmt(barY + 14)}" font-size="8" text-anchor="middle" fill="${DOC_COLORS.slate}">0</text>` +
    `<text class="scale-label" x="${fmt(x2)}" y="${fmt(barY + 14)}" font-size="8" text-anchor="middle" fill="${DOC_COLORS.slate}">${escapeXml(choice.label)}</text>` +
    '</g>';
  return { bar: { x1Pt: x1, x2Pt: x2, yPt: barY + 2, groundFt: choice.ft, groundM, label: choice.label }, svg };
}

function northArrowSvg(layout: FrameLayout, widthPt: number): string {
  const arrowX = arrowXOf(widthPt);
  const arrowTop = layout.bandTop + BAND_PAD_PT + 11;
  const arrowBottom = arrowTop + 20;
  return (
    '<g id="north-arrow">' +
    `<text x="${fmt(arrowX)}" y="${fmt(arrowTop - 2)}" font-family="${FONT_HEADING}" font-weight="bold" font-size="9" text-anchor="middle" fill="${DOC_COLORS.ink}">N</text>` +
    `<path d="M${fmt(arrowX)} ${fmt(arrowTop)}L${fmt(arrowX)} ${fmt(arrowBottom - 6)}L${fmt(arrowX - 7)} ${fmt(arrowBottom)}Z" fill="${DOC_COLORS.ink}" stroke="${DOC_COLORS.ink}" stroke-width="0.8" stroke-linejoin="round"/>` +
    `<path d="M${fmt(arrowX)} ${fmt(arrowTop)}L${fmt(arrowX + 7)} ${fmt(arrowBottom)}L${fmt(arrowX)} ${fmt(arrowBottom - 6)}Z" fill="${DOC_COLORS.card}" stroke="${DOC_COLORS.ink}" stroke-width="0.8" stroke-linejoin="round"/>` +
    '</g>'
  );
}

/** Draws the plan map and returns the SVG together with its layout (projection, scale bar, legend). */
export function renderPlanMap(input: PlanMapInput): PlanMap {
  const { boundary, units, bbox } = prepareMap(input);
  const hasBoundary = boundary.length > 0;
  const layout = frameLayout(input, hasBoundary, units);
  const projection = projectionFor(bbox, layout.frame, FRAME_MARGIN_PT);
  const project = (p: Position): Pt => projection.project(p[0], p[1]);
  const toPoly = (rings: Position[][]): Poly => rings.map((ring) => ring.map(project));

  const boundaryPath = hasBoundary ? projection.path({ type: 'MultiPolygon', coordinates: boundary }) : '';
  const areas = drawnAreas(units, toPoly);
  const marks = pointMarksOf(units, project);
  const projectedLines = units.flatMap((u) => u.lines.map((line) => line.map(project)));
  const room = labelRoom(layout.frame, boundary.map(toPoly), areas, projectedLines, marks);
  const areaLabelled = areaLabels(areas, room, project);
  const pointLabels = pointLabelsSvg(marks, room);
  const bar = scaleBar(layout, input.widthPt, projection);

  const svg = [
    frameSvg(input, layout.frame),
    baseLayerSvg(boundaryPath, input.overlays ?? [], layout.frame, projection),
    areasSvg(areas, projection),
    boundaryOutlineSvg(boundaryPath),
    linesSvg(units, projection),
    pointsSvg(marks),
    `<g id="labels">${areaLabelled.svg}${pointLabels}</g>`,
    legendSvg(layout, hasBoundary),
    bar.svg,
    northArrowSvg(layout, input.widthPt),
    '</svg>',
  ].join('');

  return {
    svg,
    layout: { projection, frame: layout.frame, scaleBar: bar.bar, legendKinds: layout.legendKinds, labels: areaLabelled.labels },
  };
}

/**
 * The overlay images placed by their corners: an affine transform maps the unit square onto the
 * projected top-left, top-right and bottom-left corners (the bottom-right follows; over a property
 * the georeferenced quadrilateral is a parallelogram to well under a point). Clipped to the frame,
 * with the credits in the frame's lower left corner.
 */
function overlaysSvg(overlays: readonly PlanMapOverlay[], frame: MapBox, projection: MapProjection): string {
  const out: string[] = [
    `<defs><clipPath id="map-frame-clip"><rect x="${fmt(frame.xPt)}" y="${fmt(frame.yPt)}" width="${fmt(frame.widthPt)}" height="${fmt(frame.heightPt)}"/></clipPath></defs>`,
    '<g id="overlays" clip-path="url(#map-frame-clip)">',
  ];
  for (const o of overlays) {
    if (o.corners.length !== 4 || !o.image.startsWith('data:image/')) continue;
    const [tl, tr, , bl] = o.corners.map(([lon, lat]) => projection.project(lon, lat));
    const m = [tr[0] - tl[0], tr[1] - tl[1], bl[0] - tl[0], bl[1] - tl[1], tl[0], tl[1]];
    if (!m.every(Number.isFinite)) continue;
    const opacity = Math.min(1, Math.max(0, o.opacity));
    out.push(
      `<image class="overlay" x="0" y="0" width="1" height="1" preserveAspectRatio="none" opacity="${opacity.toFixed(2)}" transform="matrix(${m.map((v) => v.toFixed(3)).join(' ')})" href="${escapeXml(o.image)}"/>`,
    );
  }
  out.push('</g>');
  const credit = `Aerial photo: ${overlays.map((o) => o.credit.trim()).filter(Boolean).join('; ')}`;
  const size = 6.5;
  const w = Math.min(labelWidthPt(credit, size) + 6, frame.widthPt - 8);
  const x = frame.xPt + 4;
  const y = frame.yPt + frame.heightPt - size * 1.25 - 6;
  out.push(
    `<g id="overlay-credit"><rect x="${fmt(x)}" y="${fmt(y)}" width="${fmt(w)}" height="${fmt(size * 1.25 + 2)}" rx="1.5" fill="${DOC_COLORS.card}" fill-opacity="0.85" stroke="none"/>` +
      `<text x="${fmt(x + 3)}" y="${fmt(y + size + 1)}" font-size="${size}" fill="${DOC_COLORS.slate}">${escapeXml(credit)}</text></g>`,
  );
  return out.join('');
}

/** The plan map as an SVG document string for pdfmake's `svg` node. */
export function renderPlanMapSvg(input: PlanMapInput): string {
  return renderPlanMap(input).svg;
}
