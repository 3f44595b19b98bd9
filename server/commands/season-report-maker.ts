/**
 * Season reports: makes the PDF for a property's season (kept as a shared file of category
 * 'season-report', private to the firm until sent) and sends it to the landowner through the outbox.
 */
import { emailFirmContact } from '../services/firm-profile';
import { Client, Firm, Property, SeasonReport, SharedFile, type TaskPhoto } from '../models';
import type { Transaction } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { findInFirm } from '../policies/firm-scope';
import { conflict, unprocessable } from '../errors';
import { recordAudit } from './audit-recorder';
import { firmToday } from '../services/clock';
import { enqueueEmail } from '../services/mail/outbox';
import { deleteFile, readFile, saveFile } from '../services/storage/disk-storage';
import { readSeasonSummary } from '../services/results/results-reader';
import { renderSeasonReportPdf, type SeasonReportDocumentInput } from '../../templates/documents/season-report';
import { seasonReportSentEmail } from '../../templates/email/season-report-sent';
import { CAUTIONS } from '../../shared/domain/cautions';
import { seasonRange } from '../../shared/domain/season-results';
import type { SessionUser } from '../../shared/schemas/auth';
import { config } from '../config';
import { logger } from '../logger';
import { clientRecipients } from '../services/mail/client-recipients';

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

/** The document input for one property and season. */
export async function seasonReportInput(property: Property, season: number, recommendations: string | null, transaction?: Transaction): Promise<SeasonReportDocumentInput> {
  const summary = await readSeasonSummary(property, season, { transaction });
  const [firm, client] = await Promise.all([Firm.findByPk(property.firmId, { transaction }), Client.findByPk(property.clientId, { transaction })]);
  const captions = new Map(summary.work.map((w) => [w.taskId, `${w.name}, ${w.unitName}`]));
  const range = seasonRange(season);
  return {
    firm: { name: firm?.name ?? '', phone: firm?.phone ?? null, email: firm?.email ?? null },
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
  };
}

/** Makes the season report PDF and keeps it (private to the firm until sent). */
export async function makeSeasonReport(actor: SessionUser, propertyId: number, input: { season: number; recommendations?: string | null }, ip: string | null): Promise<SeasonReport> {
  const property = await findInFirm(Property, propertyId, actor.firmId, 'That property');
  const recommendations = input.recommendations ?? null;
  const pdf = await renderSeasonReportPdf(await seasonReportInput(property, input.season, recommendations));
  const storageKey = await saveFile('files', pdf, 'pdf');
  try {
    return await sequelize.transaction(async (transaction) => {
      const label = seasonRange(input.season).label;
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
      await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'season-report.created', subjectType: 'SeasonReport', subjectId: report.id, data: { propertyId, season: input.season }, ip }, transaction);
      return report;
    });
  } catch (err) {
    await deleteFile(storageKey);
    throw err;
  }
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
    await report.update({ sentAt: new Date(), sentTo: recipients }, { transaction });
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
