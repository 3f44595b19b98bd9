/** GeoJSON export (RFC 7946): a FeatureCollection in lon/lat, no crs member, right-hand-rule polygons. */
import type { Feature, FeatureCollection } from 'geojson';
import { kindFamily } from '../../../shared/domain/unit-kinds';
import { prepareGeometry, roundCoordinate } from './export-helpers';
import type { PlanExport, PlanGeometry } from './types';

const round = (value: number | null | undefined, decimals: number): number | null =>
  typeof value === 'number' && Number.isFinite(value) ? Number(value.toFixed(decimals)) : null;

/** The plan's units (and boundary, as kind "boundary"; observations as points of family "observation") as RFC 7946 GeoJSON text. */
export function writeGeoJson(plan: PlanExport): string {
  const features: Feature<PlanGeometry>[] = [];
  if (plan.boundary) {
    features.push({
      type: 'Feature',
      id: 'boundary',
      geometry: prepareGeometry(plan.boundary),
      properties: { kind: 'boundary', family: 'area', name: plan.propertyName, acres: null, lengthFt: null, notes: null },
    });
  }
  for (const unit of plan.units) {
    features.push({
      type: 'Feature',
      id: unit.id,
      geometry: prepareGeometry(unit.geometry),
      properties: {
        kind: unit.kind,
        family: kindFamily(unit.kind),
        name: unit.name,
        acres: round(unit.acres, 2),
        lengthFt: round(unit.lengthFt, 0),
        notes: unit.notes ?? null,
      },
    });
  }
  for (const o of plan.observations ?? []) {
    features.push({
      type: 'Feature',
      id: `observation-${o.id}`,
      geometry: { type: 'Point', coordinates: [roundCoordinate(o.position[0]), roundCoordinate(o.position[1])] },
      properties: { kind: o.kind, family: 'observation', name: o.label, acres: null, lengthFt: null, notes: o.notes ?? null, observedAt: o.observedAt, unitName: o.unitName ?? null },
    });
  }
  const collection: FeatureCollection<PlanGeometry> = { type: 'FeatureCollection', features };
  return JSON.stringify(collection);
}
