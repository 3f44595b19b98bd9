import type { Property } from '../models';
import type { PropertyDto } from '../../shared/schemas/property';
import { sqMetresToHectares, SQ_M_PER_ACRE } from '../../shared/units';
import { stripCrs } from './geojson';

/** A property with its client's name and unit count; hectares follow from the stored acres. */
export function presentProperty(p: Property, clientName: string, unitCount: number): PropertyDto {
  return {
    id: p.id,
    clientId: p.clientId,
    clientName,
    name: p.name,
    county: p.county,
    state: p.state,
    region: p.region,
    objectives: p.objectives,
    notes: p.notes,
    boundary: p.boundary ? stripCrs(p.boundary) : null,
    acres: p.acres,
    hectares: p.acres === null ? null : Math.round(sqMetresToHectares(p.acres * SQ_M_PER_ACRE) * 1000) / 1000,
    perimeterFt: p.perimeterFt,
    revision: p.revision,
    unitCount,
    createdAt: p.createdAt.toISOString(),
    updatedAt: p.updatedAt.toISOString(),
  };
}
