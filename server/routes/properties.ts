/** Properties of the firm, their plan (units, summary), imports and exports. */
import { Op, QueryTypes, type WhereOptions } from 'sequelize';
import { defineRoutes, STAFF } from '../middlewares/access';
import { validate } from '../middlewares/validate';
import { singleUpload } from '../middlewares/upload';
import { Client, Property } from '../models';
import { sequelize } from '../db/sequelize';
import { IdParamsSchema, pageOf } from '../../shared/schemas/common';
import { PropertyCreateSchema, PropertyListQuerySchema, PropertyUpdateSchema } from '../../shared/schemas/property';
import { UnitBulkCreateSchema, UnitCreateSchema } from '../../shared/schemas/unit';
import { GEOMETRY_LIMITS } from '../../shared/limits';
import { presentProperty } from '../presenters/property';
import { presentUnit } from '../presenters/unit';
import { actor, findInFirm } from '../policies/firm-scope';
import { createProperty, deleteProperty, updateProperty } from '../commands/property-writer';
import { createUnits } from '../commands/unit-writer';
import { loadPlan, planEtagAt, planRevision, planSummaryOf, unitsAnswer } from '../services/plan/plan-reader';
import { etagMatches, sendPrecompressed } from '../services/http/precompressed';
import { writeGeoFile, isExportFormat, EXPORT_FORMATS } from '../services/geo-files';
import { runGeoImport } from '../services/geo-work/geo-pool';
import { loadImportGeometries, storeImport } from '../services/geo-files/import-store';
import { ImportFeaturesQuerySchema, ImportParamsSchema } from '../../shared/schemas/geo-import';
import { badRequest, notFound, unprocessable } from '../errors';
import { stripCrs } from '../presenters/geojson';
import { z } from 'zod';
import { Firm } from '../models';
import { renderPlanSummaryPdf } from '../services/documents/render-documents';
import { liveOverlaysForPrint } from '../services/documents/overlay-print';
import { todayInZone } from '../services/clock';
import { documentFirm } from '../services/firm-profile';
import { letterheadFirm } from '../services/documents/firm-letterhead';
import { observationsForExport } from '../queries/observations';

const r = defineRoutes('/properties');

/** Unit counts per property, one query. */
async function unitCounts(firmId: number, propertyIds: number[]): Promise<Map<number, number>> {
  if (propertyIds.length === 0) return new Map();
  const rows = await sequelize.query<{ property_id: number; n: string }>(
    'SELECT property_id, count(*) AS n FROM units WHERE firm_id = :firmId AND property_id IN (:ids) GROUP BY property_id',
    { replacements: { firmId, ids: propertyIds }, type: QueryTypes.SELECT },
  );
  return new Map(rows.map((row) => [row.property_id, Number(row.n)]));
}

async function present(firmId: number, property: Property) {
  const [client, counts] = await Promise.all([Client.findByPk(property.clientId, { attributes: ['name'] }), unitCounts(firmId, [property.id])]);
  return presentProperty(property, client?.name ?? '', counts.get(property.id) ?? 0);
}

r.get('/', STAFF, validate({ query: PropertyListQuerySchema }), async (req, res) => {
  const { firmId } = actor(req);
  const query = req.validQuery as z.infer<typeof PropertyListQuerySchema>;
  const { clientId, q } = query;
  const where: WhereOptions = { firmId, ...(clientId ? { clientId } : {}), ...(q ? { name: { [Op.iLike]: `%${q}%` } } : {}) };
  const [total, properties] = await Promise.all([
    Property.count({ where }),
    Property.findAll({ where, include: [{ model: Client, as: 'client', attributes: ['name'] }], order: [['name', 'ASC'], ['id', 'ASC']], limit: query.limit, offset: query.offset }),
  ]);
  const counts = await unitCounts(firmId, properties.map((p) => p.id));
  res.json({ data: properties.map((p) => presentProperty(p, (p as Property & { client?: Client }).client?.name ?? '', counts.get(p.id) ?? 0)), page: pageOf(query, total) });
});

r.post('/', STAFF, validate({ body: PropertyCreateSchema }), async (req, res) => {
  const me = actor(req);
  const property = await createProperty(me, req.body, req.ip ?? null);
  res.status(201).json({ data: await present(me.firmId, property) });
});

r.get('/:id', STAFF, validate({ params: IdParamsSchema }), async (req, res) => {
  const { firmId } = actor(req);
  const property = await findInFirm(Property, Number(req.params.id), firmId, 'That property');
  res.json({ data: await present(firmId, property) });
});

r.patch('/:id', STAFF, validate({ params: IdParamsSchema, body: PropertyUpdateSchema }), async (req, res) => {
  const me = actor(req);
  const property = await updateProperty(me, Number(req.params.id), req.body, req.ip ?? null);
  res.json({ data: await present(me.firmId, property) });
});

r.delete('/:id', STAFF, validate({ params: IdParamsSchema }), async (req, res) => {
  await deleteProperty(actor(req), Number(req.params.id), req.ip ?? null);
  res.status(204).end();
});

r.get('/:id/units', STAFF, validate({ params: IdParamsSchema }), async (req, res) => {
  // The revision first, alone: a 304 costs the session read and this one small query.
  const propertyId = Number(req.params.id);
  const revision = await planRevision(propertyId, actor(req).firmId);
  const etag = planEtagAt(propertyId, revision);
  res.setHeader('ETag', etag);
  res.setHeader('Cache-Control', 'private, no-cache');
  res.vary('Accept-Encoding');
  if (etagMatches(req.headers['if-none-match'], etag)) return res.status(304).end();
  sendPrecompressed(req, res, await unitsAnswer(propertyId, revision));
});

r.post('/:id/units', STAFF, validate({ params: IdParamsSchema, body: UnitCreateSchema }), async (req, res) => {
  const me = actor(req);
  const [unit] = await createUnits(me, Number(req.params.id), [req.body], req.ip ?? null);
  res.status(201).json({ data: presentUnit(unit) });
});

r.post('/:id/units/bulk', STAFF, validate({ params: IdParamsSchema, body: UnitBulkCreateSchema }), async (req, res) => {
  const me = actor(req);
  const units = await createUnits(me, Number(req.params.id), req.body.units, req.ip ?? null, { confirmLargeArea: req.body.confirmLargeArea });
  res.status(201).json({ data: units.map(presentUnit) });
});

r.get('/:id/plan', STAFF, validate({ params: IdParamsSchema }), async (req, res) => {
  const { firmId } = actor(req);
  res.json({ data: await planSummaryOf(Number(req.params.id), firmId) });
});

r.post('/:id/imports', STAFF, validate({ params: IdParamsSchema }), singleUpload('file', GEOMETRY_LIMITS.importMaxBytes, 'file'), async (req, res) => {
  const me = actor(req);
  const property = await findInFirm(Property, Number(req.params.id), me.firmId, 'That property');
  if (!req.file) throw badRequest('Attach the file in the form field “file” (a .geojson, .kml, .kmz, .gpx or zipped shapefile).');
  // Read in a worker thread; the answer comes back as JSON text, so nothing large is rebuilt here.
  const answer = await runGeoImport({ filename: req.file.originalname, bytes: req.file.buffer });
  await storeImport({ id: answer.importId, firmId: me.firmId, propertyId: property.id, userId: me.id, format: answer.format, featureCount: answer.featureCount, geometriesJson: answer.geometriesJson });
  res.type('application/json').send(`{"data":${answer.previewJson}}`);
});

r.get('/:id/imports/:importId/features', STAFF, validate({ params: ImportParamsSchema, query: ImportFeaturesQuerySchema }), async (req, res) => {
  const { firmId } = actor(req);
  const { id, importId } = req.params as unknown as z.infer<typeof ImportParamsSchema>;
  const { items } = req.validQuery as z.output<typeof ImportFeaturesQuerySchema>;
  await findInFirm(Property, id, firmId, 'That property');
  const features = await loadImportGeometries(firmId, id, importId, items);
  if (!features) throw notFound('That import (imports are kept for a day; upload the file again)');
  res.json({ data: features });
});

const ExportQuerySchema = z.object({
  format: z.string().refine(isExportFormat, { message: `choose one of ${EXPORT_FORMATS.join(', ')}` }),
});

r.get('/:id/export', STAFF, validate({ params: IdParamsSchema, query: ExportQuerySchema }), async (req, res) => {
  const { firmId } = actor(req);
  const { format } = req.validQuery as { format: (typeof EXPORT_FORMATS)[number] };
  const plan = await loadPlan(Number(req.params.id), firmId);
  const units = (await plan.units()).map(presentUnit);
  const file = writeGeoFile(format, {
    propertyName: plan.property.name,
    boundary: plan.property.boundary ?? undefined,
    units: units.map((u) => ({ id: u.id, name: u.name, kind: u.kind, geometry: u.geometry, acres: u.acres ?? undefined, lengthFt: u.lengthFt ?? undefined, notes: u.notes ?? undefined })),
    observations: await observationsForExport(plan.property.id),
  } as Parameters<typeof writeGeoFile>[1]);
  res.setHeader('Content-Type', file.contentType);
  res.setHeader('Content-Disposition', `attachment; filename="${file.filename}"`);
  res.send(file.body);
});

r.get('/:id/plan.pdf', STAFF, validate({ params: IdParamsSchema }), async (req, res) => {
  const { firmId } = actor(req);
  const plan = await loadPlan(Number(req.params.id), firmId);
  const { property } = plan;
  if (!property.boundary || !property.acres) throw unprocessable('Draw or import the property boundary before printing its plan.');
  const [firm, client, units, overlays] = await Promise.all([Firm.findByPk(firmId), Client.findByPk(property.clientId), plan.units(), liveOverlaysForPrint(property.id, firmId)]);
  const pdf = await renderPlanSummaryPdf({
    overlays,
    firm: await letterheadFirm(documentFirm(firm!)),
    client: { name: client!.name },
    property: {
      name: property.name,
      acres: property.acres,
      boundary: stripCrs(property.boundary),
      locality: [property.county && `${property.county} County`, property.state].filter(Boolean).join(', ') || undefined,
    },
    preparedOn: todayInZone(actor(req).firmTimezone),
    units: units.map((u) => presentUnit(u)).map((u) => ({ name: u.name, kind: u.kind, geometry: u.geometry, acres: u.acres, lengthFt: u.lengthFt })),
  } as Parameters<typeof renderPlanSummaryPdf>[0]);
  res.setHeader('Content-Type', 'application/pdf');
  res.setHeader('Content-Disposition', `inline; filename="${property.name.replace(/[^\w.-]+/g, '-')}-plan.pdf"`);
  res.send(pdf);
});

export const propertiesRouter = r.router;
