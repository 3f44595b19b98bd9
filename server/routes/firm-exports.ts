/** Take your data with you: the owner's whole-firm zip, built in the background and downloaded here. */
import { defineRoutes, OWNER } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { actor } from '../policies/firm-scope';
import { BackgroundJob, Firm } from '../models';
import { FirmExport } from '../models/firm-export';
import { FirmExportIdParamsSchema } from '../../shared/schemas/firm-export';
import { requestFirmExport } from '../commands/firm-exporter';
import { presentFirmExport } from '../presenters/firm-export';
import { sendStoredFile } from '../services/storage/storage';
import { conflict, notFound } from '../errors';

const r = defineRoutes('/firm-exports');

async function exportInFirm(id: number, firmId: number): Promise<FirmExport> {
  const record = await FirmExport.findOne({ where: { id, firmId } });
  if (!record) throw notFound('That export');
  return record;
}

async function present(records: FirmExport[]) {
  const jobIds = records.map((r) => r.jobId).filter((id): id is string => Boolean(id));
  const jobs = new Map((jobIds.length ? await BackgroundJob.findAll({ where: { id: jobIds } }) : []).map((j) => [j.id, j]));
  return records.map((r) => presentFirmExport(r, r.jobId ? (jobs.get(r.jobId) ?? null) : null));
}

r.post('/', OWNER, async (req, res) => {
  const { record, job } = await requestFirmExport(actor(req), req.ip ?? null);
  res.status(202).json({ data: presentFirmExport(record, job) });
});

r.get('/', OWNER, async (req, res) => {
  res.setHeader('Cache-Control', 'no-store');
  const records = await FirmExport.findAll({ where: { firmId: actor(req).firmId }, order: [['createdAt', 'DESC'], ['id', 'DESC']], limit: 10 });
  res.json({ data: await present(records) });
});

r.get('/:id', OWNER, ...typed({ params: FirmExportIdParamsSchema }, async ({ params }, req, res) => {
  res.setHeader('Cache-Control', 'no-store');
  const record = await exportInFirm(params.id, actor(req).firmId);
  res.json({ data: (await present([record]))[0] });
}));

r.get('/:id/download', OWNER, ...typed({ params: FirmExportIdParamsSchema }, async ({ params }, req, res) => {
  const me = actor(req);
  const record = await exportInFirm(params.id, me.firmId);
  if (record.status !== 'ready' || !record.storageKey) throw conflict('This export is not ready yet. Wait until this page says it is ready, then download it.');
  const firm = await Firm.findByPk(me.firmId, { attributes: ['slug'] });
  const day = (record.finishedAt ?? record.createdAt).toISOString().slice(0, 10);
  res.setHeader('Content-Type', 'application/zip');
  res.setHeader('Content-Disposition', `attachment; filename="${firm?.slug ?? 'firm'}-export-${day}.zip"`);
  res.setHeader('Cache-Control', 'private, no-store');
  res.setHeader('X-Content-Type-Options', 'nosniff');
  await sendStoredFile(res, record.storageKey);
}));

export const firmExportsRouter = r.router;
