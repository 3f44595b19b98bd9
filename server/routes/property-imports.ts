/** Geo file imports onto a property: upload a file for a preview, then fetch the full geometries of the chosen features. */
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { singleUpload } from '../middlewares/upload';
import { Property } from '../models';
import { IdParamsSchema } from '../../shared/schemas/common';
import { ImportFeaturesQuerySchema, ImportParamsSchema } from '../../shared/schemas/geo-import';
import { GEOMETRY_LIMITS } from '../../shared/limits';
import { actor, findInFirm } from '../policies/firm-scope';
import { runGeoImport } from '../services/geo-work/geo-pool';
import { loadImportGeometries, storeImport } from '../services/geo-files/import-store';
import { badRequest, notFound } from '../errors';

const r = defineRoutes('/properties');

r.post('/:id/imports', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const me = actor(req);
  const property = await findInFirm(Property, params.id, me.firmId, 'That property');
  if (!req.file) throw badRequest('Attach the file in the form field “file” (a .geojson, .kml, .kmz, .gpx or zipped shapefile).');
  // Read in a worker thread; the answer comes back as JSON text, so nothing large is rebuilt here.
  const answer = await runGeoImport({ filename: req.file.originalname, bytes: req.file.buffer });
  await storeImport({ id: answer.importId, firmId: me.firmId, propertyId: property.id, userId: me.id, format: answer.format, featureCount: answer.featureCount, geometriesJson: answer.geometriesJson });
  res.type('application/json').send(`{"data":${answer.previewJson}}`);
}, { upload: singleUpload('file', GEOMETRY_LIMITS.importMaxBytes, 'file') }));

r.get('/:id/imports/:importId/features', STAFF, ...typed({ params: ImportParamsSchema, query: ImportFeaturesQuerySchema }, async ({ params, query }, req, res) => {
  const { firmId } = actor(req);
  await findInFirm(Property, params.id, firmId, 'That property');
  const features = await loadImportGeometries(firmId, params.id, params.importId, query.items);
  if (!features) throw notFound('That import (imports are kept for a day; upload the file again)');
  res.json({ data: features });
}));

export const propertyImportsRouter = r.router;
