/** Spray records for the firm's staff: a season's applications as JSON, CSV or PDF. Records are never deleted here. */
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { SprayRecordQuerySchema } from '../../shared/schemas/spray-records';
import { SPRAY_RECORD_CAUTION, sprayRecordsCsv } from '../../shared/domain/spray-records';
import { formatDate } from '../../shared/domain/clock';
import { actor, findInFirm } from '../policies/firm-scope';
import { listSprayRecords } from '../queries/spray-records';
import { renderSprayRecordsPdf } from '../services/documents/spray-records-pdf';
import { todayInZone } from '../services/clock';
import { Firm, Property } from '../models';

const r = defineRoutes('/spray-records');

r.get('/', STAFF, ...typed({ query: SprayRecordQuerySchema }, async ({ query }, req, res) => {
  const me = actor(req);
  const property = query.propertyId ? await findInFirm(Property, query.propertyId, me.firmId, 'That property') : null;
  const records = await listSprayRecords(me.firmId, query.season, property?.id);
  const fileName = `spray-records-${query.season}${property ? `-property-${property.id}` : ''}`;
  if (query.format === 'csv') {
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="${fileName}.csv"`);
    res.send(sprayRecordsCsv(records));
    return;
  }
  if (query.format === 'pdf') {
    const firm = await Firm.findByPk(me.firmId, { attributes: ['name'] });
    const pdf = await renderSprayRecordsPdf({ firmName: firm?.name ?? '', season: query.season, scope: property?.name ?? 'All properties', preparedOn: formatDate(todayInZone(me.firmTimezone)), records });
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `inline; filename="${fileName}.pdf"`);
    res.send(pdf);
    return;
  }
  res.json({ data: { season: query.season, caution: SPRAY_RECORD_CAUTION, records } });
}));

export const sprayRecordsRouter = r.router;
