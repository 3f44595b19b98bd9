/** A property's plan as a geo file: GeoJSON, KML, GPX or CSV. */
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { IdParamsSchema } from '../../shared/schemas/common';
import { PlanExportQuerySchema } from '../../shared/schemas/geo-import';
import { actor } from '../policies/firm-scope';
import { writeGeoFile } from '../services/geo-files';
import { planExport } from '../queries/plan-documents';

const r = defineRoutes('/properties');

r.get('/:id/export', STAFF, ...typed({ params: IdParamsSchema, query: PlanExportQuerySchema }, async ({ params, query }, req, res) => {
  const file = writeGeoFile(query.format, await planExport(params.id, actor(req).firmId));
  res.setHeader('Content-Type', file.contentType);
  res.setHeader('Content-Disposition', `attachment; filename="${file.filename}"`);
  res.send(file.body);
}));

export const propertyExportsRouter = r.router;
