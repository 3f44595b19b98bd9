/**
 * Hunting pressure: stand winds, stand-site details, the wind record, sits and pressure, the firm's
 * planner settings and the client switch for sit logging. Mounted at /api (full paths below).
 */
import type { NextFunction, Request, Response } from 'express';
import { defineRoutes, OWNER, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { idempotencyKey } from '../middlewares/idempotency-key';
import { singleUpload } from '../middlewares/upload';
import { actor, findInFirm } from '../policies/firm-scope';
import { badRequest, unprocessable } from '../errors';
import { IdParamsSchema } from '../../shared/schemas/common';
import {
  HUNTING_LIMITS,
  HuntingSettingsUpdateSchema,
  PressureQuerySchema,
  SitCreateSchema,
  SitLoggingSchema,
  StandSiteUpdateSchema,
  WindFileFieldsSchema,
  WindSectorsSchema,
} from '../../shared/schemas/hunting';
import { Firm, Unit } from '../models';
import { readableProperty } from '../services/results/results-reader';
import { propertyCenter, readHuntingLayout, readPressureWarnings, readPressure, readSits, readStandWinds, readWindRecord, standWindsOf } from '../queries/hunting';
import { assertMayLogSits, createSit, saveWindRecord, setSitLogging, updateHuntingSettings, updateStandSite } from '../commands/hunting-writer';
import { presentSit, presentWindRecord } from '../presenters/hunting';
import { readWindFile } from '../services/wind/wind-file-reader';
import { DEFAULT_HUNTING_MONTHS, normalizeSectors, WindFileError } from '../../shared/domain/wind-record';
import { huntingSettings } from '../../shared/domain/stand-winds';

const r = defineRoutes('');
const STAFF_AND_CLIENT = ['owner', 'consultant', 'client'] as const;

r.get('/properties/:id/stand-winds', STAFF_AND_CLIENT, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  res.json(await readStandWinds(actor(req), params.id));
}));

r.put('/units/:id/stand-site', STAFF, ...typed({ params: IdParamsSchema, body: StandSiteUpdateSchema }, async ({ params, body }, req, res) => {
  const { unit, site } = await updateStandSite(actor(req), params.id, body, req.ip ?? null);
  res.json({ data: { unitId: unit.id, name: unit.name, watchedUnitId: site.watchedUnitId, standType: site.standType, heightFt: site.heightFt, approachFrom: site.approachFrom } });
}));

r.get('/properties/:id/wind-record', STAFF_AND_CLIENT, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  res.json({ data: await readWindRecord(actor(req), params.id) });
}));

/** The property must be the firm's before an upload is read. */
async function staffProperty(req: Request, _res: Response, next: NextFunction) {
  const parsed = IdParamsSchema.safeParse(req.params);
  if (!parsed.success) return next(badRequest('The property id must be a positive whole number.'));
  await readableProperty(actor(req), parsed.data.id);
  next();
}

const windUpload = singleUpload('file', HUNTING_LIMITS.windFileMaxBytes, 'wind file');
const multipartOnly = (req: Request, res: Response, next: NextFunction) => (req.is('multipart/form-data') ? windUpload(req, res, next) : next());

r.post('/properties/:id/wind-record', STAFF, staffProperty, multipartOnly, async (req, res) => {
  const me = actor(req);
  const { id } = IdParamsSchema.parse(req.params);
  if (!req.file) {
    const parsed = WindSectorsSchema.safeParse(req.body ?? {});
    if (!parsed.success) throw unprocessable(`Send a wind file in the “file” field (CSV or ISD-Lite), or JSON { sectors: [{ from, share }] }: ${parsed.error.issues[0]?.path.join('.') ?? ''} ${parsed.error.issues[0]?.message ?? ''}`.trim(), { issues: parsed.error.issues });
    let rose;
    try {
      rose = normalizeSectors(parsed.data.sectors);
    } catch (error) {
      if (error instanceof WindFileError) throw unprocessable(error.message);
      throw error;
    }
    const record = await saveWindRecord(me, id, { source: 'sectors', fileName: null, months: [], hoursFilter: 'typed', rose, hours: 0, calmHours: 0, skippedRows: 0 }, req.ip ?? null);
    res.status(201).json({ data: presentWindRecord(record) });
    return;
  }
  const fields = WindFileFieldsSchema.safeParse(req.body ?? {});
  if (!fields.success) throw unprocessable(`${fields.error.issues[0]?.path.join('.') ?? 'fields'}: ${fields.error.issues[0]?.message ?? 'not valid'}`);
  const layout = await readHuntingLayout(me, id);
  const center = propertyCenter(layout);
  const hours = fields.data.hours ?? 'hunting';
  if (!center && hours === 'hunting') throw unprocessable('Draw the property boundary first: sunrise and sunset are computed at the property. Or send hours=all.');
  const months = fields.data.months ?? [...DEFAULT_HUNTING_MONTHS];
  const text = req.file.buffer.toString('utf8');
  const answer = await readWindFile(text, { months, hours, lat: center?.lat ?? 0, lon: center?.lon ?? 0, timeZone: layout.zone });
  if (!answer.ok) {
    if (answer.usage) throw unprocessable(answer.message);
    throw new Error(answer.message);
  }
  const record = await saveWindRecord(
    me,
    id,
    { source: answer.format, fileName: req.file.originalname.slice(0, 200), months, hoursFilter: hours, rose: answer.rose, hours: answer.hours, calmHours: answer.calmHours, skippedRows: answer.skipped },
    req.ip ?? null,
  );
  res.status(201).json({ data: presentWindRecord(record) });
});


/** A client is refused before the body is looked at when sit logging is not on for them. */
async function mayLogSits(req: Request, _res: Response, next: NextFunction) {
  await assertMayLogSits(actor(req));
  next();
}

r.get('/properties/:id/sits', STAFF_AND_CLIENT, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const { sits, winds } = await readSits(actor(req), params.id);
  res.json({ data: sits.map((s) => presentSit(s, winds)) });
}));

r.post('/properties/:id/sits', STAFF_AND_CLIENT, mayLogSits, ...typed({ params: IdParamsSchema, body: SitCreateSchema }, async ({ params, body }, req, res) => {
  const me = actor(req);
  const key = idempotencyKey(req, 'sit');
  const { sit, replayed } = await createSit(me, params.id, body, key, req.ip ?? null);
  const layout = await readHuntingLayout(me, sit.propertyId);
  res.status(replayed ? 200 : 201).json({ data: presentSit(sit, standWindsOf(layout)), replayed });
}));

r.get('/properties/:id/pressure', STAFF_AND_CLIENT, ...typed({ params: IdParamsSchema, query: PressureQuerySchema }, async ({ params, query }, req, res) => {
  const { rows, season, maxSitsPerWeek } = await readPressure(actor(req), params.id, query.season);
  res.json({ data: rows, meta: { season, maxSitsPerWeek } });
}));

r.get('/pressure-warnings', STAFF_AND_CLIENT, async (req, res) => {
  res.json({ data: await readPressureWarnings(actor(req)) });
});

r.get('/firm/hunting-settings', STAFF, async (req, res) => {
  const firm = await Firm.findByPk(actor(req).firmId, { attributes: ['id', 'settings'] });
  res.json({ data: huntingSettings(firm?.settings) });
});

r.patch('/firm/hunting-settings', OWNER, ...typed({ body: HuntingSettingsUpdateSchema }, async ({ body }, req, res) => {
  const settings = await updateHuntingSettings(actor(req), body, req.ip ?? null);
  res.json({ data: huntingSettings(settings) });
}));

r.put('/clients/:id/sit-logging', STAFF, ...typed({ params: IdParamsSchema, body: SitLoggingSchema }, async ({ params, body }, req, res) => {
  const client = await setSitLogging(actor(req), params.id, body.allowed, req.ip ?? null);
  res.json({ data: { clientId: client.id, portalSitsAllowed: client.portalSitsAllowed } });
}));

/** A stand unit's details for its page (staff). */
r.get('/units/:id/stand-site', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const me = actor(req);
  const unit = await findInFirm(Unit, params.id, me.firmId, 'That unit');
  if (unit.kind !== 'stand-site') throw unprocessable(`“${unit.name}” is not a stand site.`);
  const layout = await readHuntingLayout(me, unit.propertyId);
  const stand = layout.stands.find((s) => s.id === unit.id);
  const d = stand?.detail ?? null;
  res.json({ data: { unitId: unit.id, name: unit.name, watchedUnitId: d?.watchedUnitId ?? null, standType: d?.standType ?? null, heightFt: d?.heightFt ?? null, approachFrom: d?.approachFrom ?? null } });
}));

export const huntingRouter = r.router;
