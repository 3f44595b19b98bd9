/** Which function does each kind of job. Loaded by the queue when it starts its workers. */
import { registerJobHandler } from './job-queue';
import { sendDocumentEmail, type DocumentEmailData } from '../../commands/document-mailer';
import { makeSeasonReportJob, type SeasonReportJobData } from '../../commands/season-report-maker';
import { makeCameraThumbnails } from '../cameras/thumbnails';
import { buildFirmExport, type FirmExportJobData } from '../../commands/firm-exporter';

/** Registers every job handler (idempotent). */
export function registerJobHandlers(): void {
  registerJobHandler('document-email', (data, job) => sendDocumentEmail(data as unknown as DocumentEmailData, job));
  registerJobHandler('season-report', (data, job) => makeSeasonReportJob(data as unknown as SeasonReportJobData, job));
  registerJobHandler('camera-thumbnails', (data, job) => makeCameraThumbnails(data as unknown as { photoIds: number[] }, job));
  registerJobHandler('firm-export', (data, job) => buildFirmExport(data as unknown as FirmExportJobData, job));
}
