/** Results: camera surveys, harvest records, the season summary and the season report. */
import type { Request } from 'express';
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { waitForJob } from '../services/jobs/job-queue';
import { presentJob } from '../presenters/job';
import { CameraSurvey, HarvestRecord, Property, SeasonReport, SharedFile, Unit } from '../models';
import { IdParamsSchema } from '../../shared/schemas/common';
import {
  HarvestCreateSchema,
  HarvestUpdateSchema,
  SeasonParamsSchema,
  SeasonReportCreateSchema,
  SurveyUpdateSchema,
} from '../../shared/schemas/results';
import { actor, findInFirm } from '../policies/firm-scope';
import { notFound } from '../errors';
import { createHarvest, createSurvey, deleteHarvest, deleteSurvey, updateHarvest, updateSurvey } from '../commands/results-writer';
import { deleteSeasonReport, requestSeasonReport, sendSeasonReport, withdrawSeasonReport } from '../commands/season-report-maker';
import { listHarvests, listSeasonReports, listSurveys, readableProperty, readResults, readSeasonSummary, readSurvey } from '../services/results/results-reader';
import { presentHarvest, presentSeasonReport } from '../presenters/results';
import { sendStoredFile } from '../services/storage/storage';
import { SurveyPostSchema } from '../../shared/schemas/cameras';
import { createSurveyFromPhotos } from '../commands/photo-survey-maker';
import { assertMayLogSits } from '../commands/hunting-writer';

const perProperty = defineRoutes('/properties');
const surveys = defineRoutes('/surveys');
const harvests = defineRoutes('/harvests');
const reports = defineRoutes('/season-reports');
const STAFF_AND_CLIENT = ['owner', 'consultant', 'client'] as const;

const propertyOf = (req: Request, id: number) => readableProperty(actor(req), id);

/** A record of a property the person may read (staff of its firm, or the client who owns the property). */
async function readableRecord<M extends CameraSurvey | HarvestRecord>(req: Request, id: number, model: typeof CameraSurvey | typeof HarvestRecord, label: string): Promise<{ record: M; property: Property }> {
  const me = actor(req);
  const record = (await findInFirm(model as typeof CameraSurvey, id, me.firmId, label)) as unknown as M;
  try {
    return { record, property: await readableProperty(me, record.propertyId) };
  } catch {
    throw notFound(label);
  }
}

async function harvestAnswer(record: HarvestRecord) {
  const ids = [record.unitId, record.standUnitId].filter((id): id is number => typeof id === 'number');
  const units = ids.length ? await Unit.findAll({ where: { id: ids }, attributes: ['id', 'name'] }) : [];
  return presentHarvest(record, new Map(units.map((u) => [u.id, u.name])));
}

/** Harvests: staff, or a client's contacts when their consultant turned sit logging on (refused before the body is read). */
async function mayRecordHarvest(params: { id: number }, req: Request) {
  const me = actor(req);
  if (me.role === 'client') {
    await propertyOf(req, params.id);
    await assertMayLogSits(me);
  }
}

// ---- per property ----

perProperty.get('/:id/results', STAFF_AND_CLIENT, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const property = await propertyOf(req, params.id);
  res.json({ data: await readResults(actor(req), property) });
}));

perProperty.get('/:id/surveys', STAFF_AND_CLIENT, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  res.json({ data: await listSurveys(await propertyOf(req, params.id)) });
}));

perProperty.post('/:id/surveys', STAFF, ...typed({ params: IdParamsSchema, body: SurveyPostSchema }, async ({ params, body }, req, res) => {
  // Typed tallies, or `fromPhotos: { deploymentIds, from, to }` to tally the tagged photos.
  const { survey, property } = 'fromPhotos' in body
    ? await createSurveyFromPhotos(actor(req), params.id, body, req.ip ?? null)
    : await createSurvey(actor(req), params.id, body, req.ip ?? null);
  res.status(201).json({ data: await readSurvey(survey, property) });
}));

perProperty.get('/:id/harvests', STAFF_AND_CLIENT, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  res.json({ data: await listHarvests(await propertyOf(req, params.id)) });
}));

perProperty.post('/:id/harvests', STAFF_AND_CLIENT, ...typed({ params: IdParamsSchema, body: HarvestCreateSchema }, async ({ params, body }, req, res) => {
  const record = await createHarvest(actor(req), params.id, body, req.ip ?? null);
  res.status(201).json({ data: await harvestAnswer(record) });
}, { before: mayRecordHarvest }));

perProperty.get('/:id/seasons/:season', STAFF_AND_CLIENT, ...typed({ params: SeasonParamsSchema }, async ({ params }, req, res) => {
  const property = await propertyOf(req, params.id);
  const { photos, ...summary } = await readSeasonSummary(property, params.season);
  res.json({ data: { ...summary, photoCount: photos.length } });
}));

perProperty.get('/:id/season-reports', STAFF_AND_CLIENT, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  res.json({ data: await listSeasonReports(actor(req), await propertyOf(req, params.id)) });
}));

perProperty.post('/:id/season-reports', STAFF, ...typed({ params: IdParamsSchema, body: SeasonReportCreateSchema }, async ({ params, body }, req, res) => {
  const me = actor(req);
  const job = await requestSeasonReport(me, params.id, body, req.ip ?? null);
  // Made by a background job: a quick one answers 201 with the report as before; a slow one 202 with
  // the job, which the page polls at GET /api/jobs/:id.
  const settled = (await waitForJob(job.id)) ?? job;
  const reportId = settled.status === 'done' ? Number(settled.result?.seasonReportId) : null;
  const report = reportId ? await SeasonReport.findOne({ where: { id: reportId, firmId: me.firmId } }) : null;
  if (!report) return res.status(202).json({ data: null, job: presentJob(settled) });
  const file = await SharedFile.findByPk(report.sharedFileId, { attributes: ['byteSize'] });
  res.status(201).json({ data: presentSeasonReport(report, file?.byteSize ?? 0), job: presentJob(settled) });
}));

// ---- surveys ----

surveys.get('/:id', STAFF_AND_CLIENT, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const { record, property } = await readableRecord<CameraSurvey>(req, params.id, CameraSurvey, 'That survey');
  res.json({ data: await readSurvey(record, property) });
}));

surveys.patch('/:id', STAFF, ...typed({ params: IdParamsSchema, body: SurveyUpdateSchema }, async ({ params, body }, req, res) => {
  const { survey, property } = await updateSurvey(actor(req), params.id, body, req.ip ?? null);
  res.json({ data: await readSurvey(survey, property) });
}));

surveys.delete('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  await deleteSurvey(actor(req), params.id, req.ip ?? null);
  res.status(204).end();
}));

// ---- harvest records ----

harvests.get('/:id', STAFF_AND_CLIENT, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const { record } = await readableRecord<HarvestRecord>(req, params.id, HarvestRecord, 'That harvest record');
  res.json({ data: await harvestAnswer(record) });
}));

harvests.patch('/:id', STAFF, ...typed({ params: IdParamsSchema, body: HarvestUpdateSchema }, async ({ params, body }, req, res) => {
  const record = await updateHarvest(actor(req), params.id, body, req.ip ?? null);
  res.json({ data: await harvestAnswer(record) });
}));

harvests.delete('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  await deleteHarvest(actor(req), params.id, req.ip ?? null);
  res.status(204).end();
}));

// ---- season reports ----

reports.get('/:id/pdf', STAFF_AND_CLIENT, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const me = actor(req);
  const report = await findInFirm(SeasonReport, params.id, me.firmId, 'That season report');
  if (me.role === 'client' && (report.clientId !== me.clientId || report.sentAt === null || report.withdrawnAt !== null)) throw notFound('That season report');
  const file = await SharedFile.findByPk(report.sharedFileId);
  if (!file) throw notFound('That season report’s PDF');
  res.setHeader('Content-Type', 'application/pdf');
  res.setHeader('Content-Disposition', `inline; filename="season-report-${report.season}.pdf"`);
  await sendStoredFile(res, file.storageKey);
}));

reports.post('/:id/send', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const report = await sendSeasonReport(actor(req), params.id, req.ip ?? null);
  const file = await SharedFile.findByPk(report.sharedFileId, { attributes: ['byteSize'] });
  res.json({ data: presentSeasonReport(report, file?.byteSize ?? 0) });
}));

reports.post('/:id/withdraw', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const report = await withdrawSeasonReport(actor(req), params.id, req.ip ?? null);
  const file = await SharedFile.findByPk(report.sharedFileId, { attributes: ['byteSize'] });
  res.json({ data: presentSeasonReport(report, file?.byteSize ?? 0) });
}));

reports.delete('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  await deleteSeasonReport(actor(req), params.id, req.ip ?? null);
  res.status(204).end();
}));

export const propertyResultsRouter = perProperty.router;
export const surveysRouter = surveys.router;
export const harvestsRouter = harvests.router;
export const seasonReportsRouter = reports.router;
