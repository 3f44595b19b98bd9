/**
 * Season reports: makes the PDF for a property's season (kept as a shared file of category
 * 'season-report', private to the firm until sent) and sends it to the landowner through the outbox.
 */
import { emailFirmContact, firmDefaults } from '../services/firm-profile';
import { Op } from 'sequelize';
import { Client, Firm, Property, SeasonReport, SharedFile, type BackgroundJob, type TaskPhoto } from '../models';
import type { Transaction } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { findInFirm } from '../policies/firm-scope';
import { conflict, unprocessable } from '../errors';
import { recordAudit } from './audit-recorder';
import { firmToday, usableZone } from '../services/clock';
import { enqueueEmail } from '../services/mail/outbox';
import { deleteFile, readFile, saveFile } from '../services/storage/storage';
import { readSeasonSummary } from '../services/results/results-reader';
import { type SeasonReportDocumentInput } from '../../templates/documents/season-report';
import { renderSeasonReportPdf } from '../services/documents/render-documents';
import { seasonReportSentEmail } from '../../templates/email/season-report-sent';
import { CAUTIONS } from '../../shared/domain/cautions';
import { emptySeasonReason, seasonRange } from '../../shared/domain/season-results';
import type { SessionUser } from '../../shared/schemas/auth';
import { config } from '../config';
import { logger } from '../logger';
import { clientRecipients } from '../services/mail/client-recipients';
import { enqueueJob, type JobContext } from '../services/jobs/job-queue';
import { countObservations } from '../queries/observations';
import { buildSeasonPressure } from '../queries/season-pressure';
import { readSeasonReportChecks } from '../queries/season-report-checks';
import { kindLabel, presentObservationSummary } from '../presenters/observation';
import type { SeasonReportObservations } from '../../templates/documents/season-report';

/** Photos larger than this are left out of the PDF (a report should stay small enough to e-mail). */
const MAX_PHOTO_BYTES = 4 * 1024 * 1024;
const PHOTO_TYPES = new Set(['image/jpeg', 'image/png']);

/** Up to `max` JPEG/PNG task photos as data URLs; unreadable files are skipped, never fatal. */
async function photoDataUrls(photos: readonly TaskPhoto[], captions: ReadonlyMap<number, string>, max = 4): Promise<{ dataUrl: string; caption: string }[]> {
  const out: { dataUrl: string; caption: string }[] = [];
  for (const photo of photos) {
    if (out.length >= max) break;
    if (!PHOTO_TYPES.has(photo.contentType) || photo.byteSize > MAX_PHOTO_BYTES) continue;
    try {
      const bytes = await readFile(photo.storageKey);
      out.push({ dataUrl: `data:${photo.contentType};base64,${bytes.toString('base64')}`, caption: captions.get(photo.taskId) ?? '' });
    } catch (err) {
      logger.warn({ err, photoId: photo.id }, 'task photo left out of the season report');
    }
  }
  return out;
}

/** The season's field observations counted by kind, unit and month. */
async function seasonObservations(propertyId: number, from: string, to: string, zone: string): Promise<SeasonReportObservations> {
  const [units, months] = await Promise.all([countObservations(propertyId, 'unit', { from, to }, zone), countObservations(propertyId, 'month', { from, to }, zone)]);
  const byUnit = presentObservationSummary('unit', units);
  const byMonth = presentObservationSummary('month', months);
  const kinds = new Map<string, number>();
  for (const c of units) kinds.set(c.kind, (kinds.get(c.kind) ?? 0) + c.count);
  return {
    total: byUnit.total,
    byKind: [...kinds.entries()].sort((a, b) => b[1] - a[1]).map(([k, count]) => ({ label: kindLabel(k), count })),
    byUnit: byUnit.rows.map((r) => ({ label: r.label, count: r.total })),
    byMonth: byMonth.rows.map((r) => ({ label: r.label, count: r.total })),
  };
}

/** The document input for one property and season. */
export async function seasonReportInput(property: Property, season: number, recommendations: string | null, transaction?: Transaction): Promise<SeasonReportDocumentInput> {
  const summary = await readSeasonSummary(property, season, { transaction });
  const [firm, client] = await Promise.all([Firm.findByPk(property.firmId, { transaction }), Client.findByPk(property.clientId, { transaction })]);
  const captions = new Map(summary.work.map((w) => [w.taskId, `${w.name}, ${w.unitName}`]));
  const range = seasonRange(season);
  return {
    firm: { name: firm?.name ?? '', phone: firm?.phone ?? null, email: firm?.email ?? null, areaUnit: firm ? firmDefaults(firm).areaUnit : 'acres' },
    client: { name: client?.name ?? '' },
    property: { name: property.name, acres: property.acres, locality: [property.county && `${property.county} County`, property.state].filter(Boolean).join(', ') || null },
    season: { label: range.label, startsOn: range.startsOn, endsOn: range.endsOn },
    preparedOn: await firmToday(property.firmId, transaction),
    work: summary.work,
    acresEstablished: summary.acresEstablished,
    unitsEstablished: summary.unitsEstablished,
    photos: await photoDataUrls(summary.photos, captions),
    surveys: summary.surveys.map((s) => ({ name: s.name, startDate: s.startDate, endDate: s.endDate, cameraCount: s.cameraCount, surveyDays: s.surveyDays, display: s.display, warnings: s.warnings })),
    surveyTrend: summary.surveyTrend,
    harvest: summary.harvestSummary,
    harvestTrend: summary.harvestTrend,
    recommendations,
    cautions: [CAUTIONS['deer-scent-baiting']],
    observations: await seasonObservations(property.id, range.startsOn, range.endsOn, usableZone(firm?.timezone)),
    pressure: await buildSeasonPressure(property.firmId, property.id, season, transaction),
    checks: await readSeasonReportChecks(property, range.startsOn, range.endsOn, transaction),
  };
}

/** A season with no finished work, survey or harvest makes no report (422 with what to do). */
async function refuseEmptySeason(property: Property, season: number): Promise<void> {
  const document = await seasonReportInput(property, season, null);
  const empty = emptySeasonReason({ work: document.work.length, surveys: document.surveys.length, harvests: document.harvest.total }, document.season.label);
  if (empty) throw unprocessable(empty);
}

export interface SeasonReportJobData {
  actor: SessionUser;
  propertyId: number;
  season: number;
  recommendations: string | null;
  ip: string | null;
}

/** Hands the making of a season report to a background job (checked first: the property is the firm's). */
export async function requestSeasonReport(actor: SessionUser, propertyId: number, input: { season: number; recommendations?: string | null }, ip: string | null): Promise<BackgroundJob> {
  return sequelize.transaction(async (transaction) => {
    const property = await findInFirm(Property, propertyId, actor.firmId, 'That property', { transaction });
    await refuseEmptySeason(property, input.season);
    const data: SeasonReportJobData = { actor, propertyId: property.id, season: input.season, recommendations: input.recommendations ?? null, ip };
    return enqueueJob(
      { kind: 'season-report', firmId: actor.firmId, createdById: actor.id, title: `Season report ${seasonRange(input.season).label} — ${property.name}`, subject: { type: 'Property', id: property.id }, data: data as unknown as Record<string, unknown> },
      transaction,
    );
  });
}

/** The 'season-report' job: makes the report once, however often the job is delivered. */
export async function makeSeasonReportJob(data: SeasonReportJobData, job: JobContext): Promise<void> {
  await makeSeasonReport(data.actor, data.propertyId, { season: data.season, recommendations: data.recommendations }, data.ip, job);
}

/**
 * Makes the season report PDF and keeps it (private to the firm until sent); an empty season is
 * refused (422) and remaking a season replaces its unsent report. In a job, progress is
 * reported and the rows are written by the job's finish (nothing twice; answers null if done before).
 */
export async function makeSeasonReport(actor: SessionUser, propertyId: number, input: { season: number; recommendations?: string | null }, ip: string | null, job?: JobContext): Promise<SeasonReport | null> {
  const property = await findInFirm(Property, propertyId, actor.firmId, 'That property');
  const recommendations = input.recommendations ?? null;
  await job?.progress(10, 'Reading the season');
  const documentInput = await seasonReportInput(property, input.season, recommendations);
  const empty = emptySeasonReason({ work: documentInput.work.length, surveys: documentInput.surveys.length, harvests: documentInput.harvest.total }, documentInput.season.label);
  if (empty) throw unprocessable(empty);
  await job?.progress(40, 'Drawing the PDF');
  const pdf = await renderSeasonReportPdf(documentInput);
  await job?.progress(80, 'Storing the PDF');
  const storageKey = await saveFile('files', pdf, 'pdf');
  try {
    const write = async (transaction: Transaction) => {
      const label = seasonRange(input.season).label;
      // The unsent report(s) of this season are replaced, not joined by a second of the same title.
      const unsent = await SeasonReport.findAll({ where: { firmId: actor.firmId, propertyId: property.id, season: input.season, sentAt: { [Op.is]: null } }, transaction, lock: transaction.LOCK.UPDATE });
      const replacedKeys: string[] = [];
      for (const old of unsent) {
        const oldFile = await SharedFile.findByPk(old.sharedFileId, { transaction });
        await old.destroy({ transaction });
        if (oldFile) {
          replacedKeys.push(oldFile.storageKey);
          await oldFile.destroy({ transaction });
        }
      }
      const file = await SharedFile.create(
        {
          firmId: actor.firmId,
          clientId: property.clientId,
          propertyId: property.id,
          category: 'season-report',
          title: `Season report ${label} — ${property.name}`,
          storageKey,
          originalName: `season-report-${input.season}.pdf`,
          contentType: 'application/pdf',
          byteSize: pdf.length,
          visibleToClient: false,
          uploadedById: actor.id,
          uploadedByRole: 'staff',
        },
        { transaction },
      );
      const report = await SeasonReport.create(
        { firmId: actor.firmId, propertyId: property.id, clientId: property.clientId, season: input.season, recommendations, sharedFileId: file.id, createdById: actor.id },
        { transaction },
      );
      await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'season-report.created', subjectType: 'SeasonReport', subjectId: report.id, data: { propertyId, season: input.season, replaced: unsent.map((r) => r.id) }, ip }, transaction);
      return { report, replacedKeys };
    };
    const made = job ? await job.finish(write, (r) => ({ seasonReportId: r.report.id })) : await sequelize.transaction(write);
    // Another delivery of the same job made the report already: this PDF is not needed.
    if (!made) await deleteFile(storageKey);
    for (const key of made?.replacedKeys ?? []) await deleteFile(key);
    const report = made?.report ?? null;
    return report;
  } catch (err) {
    await deleteFile(storageKey);
    throw err;
  }
}

/** Takes a sent season report back out of the landowner's portal; the firm keeps it on file. */
export async function withdrawSeasonReport(actor: SessionUser, id: number, ip: string | null): Promise<SeasonReport> {
  return sequelize.transaction(async (transaction) => {
    const report = await findInFirm(SeasonReport, id, actor.firmId, 'That season report', { transaction, lock: true });
    if (report.sentAt === null) throw conflict('This report was never sent, so the client cannot see it; delete it or make it again instead.');
    if (report.withdrawnAt !== null) throw conflict('This report is already withdrawn from the portal.');
    const file = await SharedFile.findByPk(report.sharedFileId, { transaction });
    await file?.update({ visibleToClient: false }, { transaction });
    await report.update({ withdrawnAt: new Date() }, { transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'season-report.withdrawn', subjectType: 'SeasonReport', subjectId: report.id, data: { propertyId: report.propertyId, season: report.season }, ip }, transaction);
    return report;
  });
}

/** Sends a season report to the landowner (PDF attached) and shows it in their portal's files. */
export async function sendSeasonReport(actor: SessionUser, id: number, ip: string | null): Promise<SeasonReport> {
  return sequelize.transaction(async (transaction) => {
    const report = await findInFirm(SeasonReport, id, actor.firmId, 'That season report', { transaction, lock: true });
    const recipients = await clientRecipients(report.clientId, transaction);
    if (recipients.length === 0) throw unprocessable('The client has no e-mail address or portal contact. Add one on the client’s page, then send the report.');
    const [file, property, firm] = await Promise.all([
      SharedFile.findByPk(report.sharedFileId, { transaction }),
      Property.findByPk(report.propertyId, { attributes: ['id', 'name'], transaction }),
      Firm.findByPk(actor.firmId, { transaction }),
    ]);
    if (!file) throw unprocessable('The report’s PDF is missing. Make the season report again, then send it.');
    const pdf = await readFile(file.storageKey);
    const label = seasonRange(report.season).label;
    for (const to of recipients) {
      await enqueueEmail(
        {
          firmId: actor.firmId,
          kind: 'season-report-sent',
          to,
          email: seasonReportSentEmail({ firmName: firm?.name ?? '', firmContact: emailFirmContact(firm), consultantName: actor.name, propertyName: property?.name ?? '', seasonLabel: label, url: `${config.publicUrl}/portal/properties/${report.propertyId}/results` }),
          attachments: [{ filename: `season-report-${report.season}.pdf`, contentType: 'application/pdf', contentBase64: pdf.toString('base64') }],
        },
        transaction,
      );
    }
    await file.update({ visibleToClient: true }, { transaction });
    await report.update({ sentAt: new Date(), sentTo: recipients, withdrawnAt: null }, { transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'season-report.sent', subjectType: 'SeasonReport', subjectId: report.id, data: { to: recipients }, ip }, transaction);
    return report;
  });
}

/** Deletes a season report and its PDF. */
export async function deleteSeasonReport(actor: SessionUser, id: number, ip: string | null): Promise<void> {
  const storageKey = await sequelize.transaction(async (transaction) => {
    const report = await findInFirm(SeasonReport, id, actor.firmId, 'That season report', { transaction, lock: true });
    if (report.sentAt) throw conflict('This season report was sent to the landowner, so it stays as sent. Make a new report for changes.');
    const file = await SharedFile.findByPk(report.sharedFileId, { transaction });
    await report.destroy({ transaction });
    await file?.destroy({ transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'season-report.deleted', subjectType: 'SeasonReport', subjectId: id, data: { propertyId: report.propertyId, season: report.season }, ip }, transaction);
    return file?.storageKey ?? null;
  });
  if (storageKey) await deleteFile(storageKey);
}
