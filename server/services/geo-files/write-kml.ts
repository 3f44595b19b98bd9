/** KML 2.2 export: one Style per kind from our palette, one Folder per kind, Placemarks with ExtendedData. */
import type { Position } from 'geojson';
import { KIND_STYLES, UNIT_KINDS, type UnitKind } from '../../../shared/domain/unit-kinds';
import { escapeXml, formatCoordinate, linesOf, polygonsOf, prepareGeometry } from './export-helpers';
import type { ExportUnit, PlanExport, PlanGeometry } from './types';

export const KML_NAMESPACE = 'http://www.opengis.net/kml/2.2';

/** Boundary outline colour: our "ink" token (DESIGN.md). */
const BOUNDARY_STROKE = '#1F2A24';
/** Observation pins: a warm brown of the observation palette (shared/domain/observations.ts). */
const OBSERVATION_COLOUR = '#8A5A2B';

/** A #RRGGBB colour and an opacity as a KML colour, which is aabbggrr (KML 2.2 reference, <color>). */
export function kmlColor(hex: string, opacity = 1): string {
  const match = /^#?([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (!match) throw new Error(`not a #RRGGBB colour: ${hex}`);
  const alpha = Math.round(Math.min(1, Math.max(0, opacity)) * 255)
    .toString(16)
    .padStart(2, '0');
  return `${alpha}${match[3]}${match[2]}${match[1]}`.toLowerCase();
}

const coordinates = (positions: Position[]): string => positions.map((p) => `${formatCoordinate(p[0])},${formatCoordinate(p[1])}`).join(' ');

function polygonKml(rings: Position[][]): string {
  const [outer, ...holes] = rings;
  const inner = holes.map((h) => `<innerBoundaryIs><LinearRing><coordinates>${coordinates(h)}</coordinates></LinearRing></innerBoundaryIs>`).join('');
  return `<Polygon><outerBoundaryIs><LinearRing><coordinates>${coordinates(outer)}</coordinates></LinearRing></outerBoundaryIs>${inner}</Polygon>`;
}

const lineKml = (line: Position[]): string => `<LineString><tessellate>1</tessellate><coordinates>${coordinates(line)}</coordinates></LineString>`;

function geometryKml(geometry: PlanGeometry): string {
  const g = prepareGeometry(geometry); // KML 2.2 also wants outer rings counter-clockwise
  switch (g.type) {
    case 'Point':
      return `<Point><coordinates>${coordinates([g.coordinates])}</coordinates></Point>`;
    case 'LineString':
      return lineKml(g.coordinates);
    case 'MultiLineString':
      return `<MultiGeometry>${linesOf(g).map(lineKml).join('')}</MultiGeometry>`;
    case 'Polygon':
      return polygonKml(g.coordinates);
    case 'MultiPolygon':
      return `<MultiGeometry>${polygonsOf(g).map(polygonKml).join('')}</MultiGeometry>`;
  }
}

const data = (name: string, value: string | number): string => `<Data name="${name}"><value>${escapeXml(String(value))}</value></Data>`;

function placemark(unit: ExportUnit): string {
  const extended = [data('id', unit.id), data('kind', unit.kind)];
  if (typeof unit.acres === 'number' && Number.isFinite(unit.acres)) extended.push(data('acres', unit.acres.toFixed(2)));
  if (typeof unit.lengthFt === 'number' && Number.isFinite(unit.lengthFt)) extended.push(data('lengthFt', unit.lengthFt.toFixed(0)));
  const description = unit.notes ? `<description>${escapeXml(unit.notes)}</description>` : '';
  return (
    `<Placemark><name>${escapeXml(unit.name)}</name>${description}<styleUrl>#kind-${unit.kind}</styleUrl>` +
    `<ExtendedData>${extended.join('')}</ExtendedData>${geometryKml(unit.geometry)}</Placemark>`
  );
}

function style(kind: UnitKind): string {
  const s = KIND_STYLES[kind];
  if (s.family === 'point') {
    return `<Style id="kind-${kind}"><IconStyle><color>${kmlColor(s.fill)}</color><scale>1</scale></IconStyle><LabelStyle><scale>0.8</scale></LabelStyle></Style>`;
  }
  const width = s.family === 'line' ? 3 : 2;
  const poly = s.family === 'area' ? `<PolyStyle><color>${kmlColor(s.fill, s.fillOpacity)}</color></PolyStyle>` : '';
  return `<Style id="kind-${kind}"><LineStyle><color>${kmlColor(s.stroke)}</color><width>${width}</width></LineStyle>${poly}</Style>`;
}

/** The plan as a KML 2.2 document (boundary first, then a folder per kind in the palette order). */
export function writeKml(plan: PlanExport): string {
  const kinds = UNIT_KINDS.filter((kind) => plan.units.some((u) => u.kind === kind));
  const parts: string[] = [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<kml xmlns="${KML_NAMESPACE}">`,
    '<Document>',
    `<name>${escapeXml(plan.propertyName)}</name>`,
    '<open>1</open>',
  ];
  if (plan.boundary) {
    parts.push(`<Style id="boundary"><LineStyle><color>${kmlColor(BOUNDARY_STROKE)}</color><width>3</width></LineStyle><PolyStyle><fill>0</fill></PolyStyle></Style>`);
  }
  parts.push(...kinds.map(style));
  if (plan.boundary) {
    parts.push(
      `<Folder><name>Property boundary</name><Placemark><name>${escapeXml(plan.propertyName)}</name><styleUrl>#boundary</styleUrl>` +
        `<ExtendedData>${data('kind', 'boundary')}</ExtendedData>${geometryKml(plan.boundary)}</Placemark></Folder>`,
    );
  }
  for (const kind of kinds) {
    const units = plan.units.filter((u) => u.kind === kind);
    parts.push(`<Folder><name>${escapeXml(KIND_STYLES[kind].label)}</name>${units.map(placemark).join('\n')}</Folder>`);
  }
  const observations = plan.observations ?? [];
  if (observations.length) {
    parts.push(`<Style id="observation"><IconStyle><color>${kmlColor(OBSERVATION_COLOUR)}</color><scale>0.8</scale></IconStyle></Style>`);
    const marks = observations.map(
      (o) =>
        `<Placemark><name>${escapeXml(o.label)}</name>${o.notes ? `<description>${escapeXml(o.notes)}</description>` : ''}<TimeStamp><when>${escapeXml(o.observedAt)}</when></TimeStamp>` +
        `<styleUrl>#observation</styleUrl><ExtendedData>${data('id', o.id)}${data('kind', o.kind)}${o.unitName ? data('unit', o.unitName) : ''}</ExtendedData>` +
        `<Point><coordinates>${coordinates([o.position])}</coordinates></Point></Placemark>`,
    );
    parts.push(`<Folder><name>Observations</name>${marks.join('\n')}</Folder>`);
  }
  parts.push('</Document>', '</kml>', '');
  return parts.join('\n');
}
