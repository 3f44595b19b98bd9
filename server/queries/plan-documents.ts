/** Reads that gather a property's plan into what its exports and printed plan summary need. */
import { Client, Firm } from '../models';
import { presentUnit } from '../presenters/unit';
import { stripCrs } from '../presenters/geojson';
import { loadPlan } from '../services/plan/plan-reader';
import type { writeGeoFile } from '../services/geo-files';
import type { renderPlanSummaryPdf } from '../services/documents/render-documents';
import { liveOverlaysForPrint } from '../services/documents/overlay-print';
import { letterheadFirm } from '../services/documents/firm-letterhead';
import { documentFirm } from '../services/firm-profile';
import { todayInZone } from '../services/clock';
import { unprocessable } from '../errors';
import { observationsForExport } from './observations';

/** The plan as a geo file writes it: the property's name and boundary, its units and its observations (404 outside the firm). */
export async function planExport(propertyId: number, firmId: number): Promise<Parameters<typeof writeGeoFile>[1]> {
  const plan = await loadPlan(propertyId, firmId);
  const units = (await plan.units()).map(presentUnit);
  return {
    propertyName: plan.property.name,
    boundary: plan.property.boundary ?? undefined,
    units: units.map((u) => ({ id: u.id, name: u.name, kind: u.kind, geometry: u.geometry, acres: u.acres ?? undefined, lengthFt: u.lengthFt ?? undefined, notes: u.notes ?? undefined })),
    observations: await observationsForExport(plan.property.id),
  } as Parameters<typeof writeGeoFile>[1];
}

/**
 * What the printed plan summary shows: the firm's letterhead, the client, the property with its
 * boundary, its units and live overlays, dated today in the firm's time zone. 422 before any work
 * when the property has no boundary yet; 404 outside the firm.
 */
export async function planSummaryDocument(propertyId: number, firmId: number, firmTimezone: string) {
  const plan = await loadPlan(propertyId, firmId);
  const { property } = plan;
  if (!property.boundary || !property.acres) throw unprocessable('Draw or import the property boundary before printing its plan.');
  const [firm, client, units, overlays] = await Promise.all([Firm.findByPk(firmId), Client.findByPk(property.clientId), plan.units(), liveOverlaysForPrint(property.id, firmId)]);
  const input = {
    overlays,
    firm: await letterheadFirm(documentFirm(firm!)),
    client: { name: client!.name },
    property: {
      name: property.name,
      acres: property.acres,
      boundary: stripCrs(property.boundary),
      locality: [property.county && `${property.county} County`, property.state].filter(Boolean).join(', ') || undefined,
    },
    preparedOn: todayInZone(firmTimezone),
    units: units.map((u) => presentUnit(u)).map((u) => ({ name: u.name, kind: u.kind, geometry: u.geometry, acres: u.acres, lengthFt: u.lengthFt })),
  } as Parameters<typeof renderPlanSummaryPdf>[0];
  return { input, fileStem: property.name.replace(/[^\w.-]+/g, '-') };
}
