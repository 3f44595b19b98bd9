/** A property's printed plan summary (PDF). */
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { IdParamsSchema } from '../../shared/schemas/common';
import { actor } from '../policies/firm-scope';
import { renderPlanSummaryPdf } from '../services/documents/render-documents';
import { planSummaryDocument } from '../queries/plan-documents';

const r = defineRoutes('/properties');

r.get('/:id/plan.pdf', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const me = actor(req);
  const { input, fileStem } = await planSummaryDocument(params.id, me.firmId, me.firmTimezone);
  const pdf = await renderPlanSummaryPdf(input);
  res.setHeader('Content-Type', 'application/pdf');
  res.setHeader('Content-Disposition', `inline; filename="${fileStem}-plan.pdf"`);
  res.send(pdf);
}));

export const propertyPlanPdfRouter = r.router;
