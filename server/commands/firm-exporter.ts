/**
 * Take your data with you: the owner asks for the whole firm as one zip; a background job writes it
 * (a CSV per table, a GeoJSON file per property, the proposal and invoice PDFs, every uploaded file)
 * to a file on disk entry by entry, keeps it in storage, and the outbox tells the owner it is ready.
 */
import fsp from 'node:fs/promises';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import crypto from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { BackgroundJob, Firm, Invoice, Proposal, User } from '../models';
import { FirmExport } from '../models/firm-export';
import { enqueueJob, type JobContext } from '../services/jobs/job-queue';
import { enqueueEmail } from '../services/mail/outbox';
import { deleteFile, openStoredFile, saveStream } from '../services/storage/storage';
import { createZipFile, type ZipFileWriter } from '../services/firm-export/zip-writer';
import { firmTables, tableCsv } from '../services/firm-export/firm-tables';
import { renderProposalPdfFor } from '../services/proposals/proposal-pdf';
import { renderInvoicePdfFor } from '../services/invoices/invoice-pdf';
import { emailFirmContact } from '../services/firm-profile';
import { firmExportReadyEmail } from '../../templates/email/firm-export';
import { recordAudit } from './audit-recorder';
import { conflict, notFound } from '../errors';
import { config } from '../config';
import { logger } from '../logger';

export interface FirmExportJobData {
  exportId: number;
  firmId: number;
}

/** A safe file name part: letters, digits, dot, dash and underscore, at most 80 characters. */
export function safeName(text: string): string {
  return (
    text
      .normalize('NFD')
      .replace(/[\u0300-\u036f]/g, '')
      .replace(/[^A-Za-z0-9._-]+/g, '-')
      .replace(/^[-.]+|-+$/g, '')
      .slice(0, 80) || 'file'
  );
}

/** Starts an export of the owner's firm; refused while another one is still being built. */
export async function requestFirmExport(me: { id: number; firmId: number }, ip: string | null): Promise<{ record: FirmExport; job: BackgroundJob }> {
  return sequelize.transaction(async (transaction) => {
    // One export at a time per firm: the firm's row is the lock.
    await Firm.findByPk(me.firmId, { transaction, lock: transaction.LOCK.UPDATE });
    const building = await FirmExport.findAll({ where: { firmId: me.firmId, status: 'building' }, transaction });
    for (const b of building) {
      const job = b.jobId ? await BackgroundJob.findByPk(b.jobId, { transaction }) : null;
      if (job && job.status !== 'failed') throw conflict('An export of your firm is already being built. Wait for it to finish (this page shows its progress), then download it.');
    }
    const record = await FirmExport.create({ firmId: me.firmId, requestedById: me.id, jobId: null, storageKey: null, byteSize: null, fileCount: null, finishedAt: null }, { transaction });
    const job = await enqueueJob(
      { kind: 'firm-export', firmId: me.firmId, createdById: me.id, title: 'Export of the whole firm', subject: { type: 'FirmExport', id: record.id }, data: { exportId: record.id, firmId: me.firmId }, retryLimit: 2 },
      transaction,
    );
    await record.update({ jobId: job.id }, { transaction });
    await recordAudit({ firmId: me.firmId, userId: me.id, action: 'firm.export-requested', subjectType: 'FirmExport', subjectId: record.id, ip }, transaction);
    return { record, job };
  });
}

/** A size as people read it: "840 KB", "12.4 MB". */
export function sizeText(bytes: number): string {
  if (bytes < 1024 * 1024) return `${Math.max(1, Math.round(bytes / 1024))} KB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}

async function* streamOf(key: string): AsyncGenerator<Uint8Array> {
  const { stream } = await openStoredFile(key);
  for await (const chunk of stream) yield chunk as Uint8Array;
}

/** Each property as a GeoJSON FeatureCollection: its boundary, then its units (acres and feet as stored). */
async function addProperties(zip: ZipFileWriter, firmId: number): Promise<void> {
  const properties = await sequelize.query<{ id: number; name: string; client_name: string; county: string | null; state: string | null; acres: string | null; boundary: string | null }>(
    `SELECT p.id, p.name, c.name AS client_name, p.county, p.state, p.acres, ST_AsGeoJSON(p.boundary) AS boundary
       FROM properties p JOIN clients c ON c.id = p.client_id WHERE p.firm_id = :firmId ORDER BY p.id`,
    { replacements: { firmId }, type: QueryTypes.SELECT },
  );
  for (const p of properties) {
    const units = await sequelize.query<{ id: number; name: string; kind: string; acres: string | null; perimeter_ft: string | null; length_ft: string | null; notes: string | null; geometry: string | null }>(
      `SELECT id, name, kind, acres, perimeter_ft, length_ft, notes, ST_AsGeoJSON(geometry) AS geometry FROM units WHERE firm_id = :firmId AND property_id = :propertyId ORDER BY id`,
      { replacements: { firmId, propertyId: p.id }, type: QueryTypes.SELECT },
    );
    const num = (v: string | null) => (v === null ? null : Number(v));
    const features = [
      ...(p.boundary ? [{ type: 'Feature', id: `property-${p.id}`, geometry: JSON.parse(p.boundary), properties: { role: 'boundary', propertyId: p.id, name: p.name, client: p.client_name, county: p.county, state: p.state, acres: num(p.acres) } }] : []),
      ...units.filter((u) => u.geometry).map((u) => ({ type: 'Feature', id: `unit-${u.id}`, geometry: JSON.parse(u.geometry!), properties: { role: 'unit', unitId: u.id, name: u.name, kind: u.kind, acres: num(u.acres), perimeterFt: num(u.perimeter_ft), lengthFt: num(u.length_ft), notes: u.notes } })),
    ];
    await zip.add(`properties/${p.id}-${safeName(p.name)}.geojson`, JSON.stringify({ type: 'FeatureCollection', name: p.name, features }, null, 1));
  }
}

/** The job: writes the zip, keeps it in storage, marks the export ready and queues the owner's e-mail. */
export async function buildFirmExport(data: FirmExportJobData, job: JobContext): Promise<void> {
  const record = await FirmExport.findOne({ where: { id: data.exportId, firmId: data.firmId } });
  if (!record || record.status === 'ready') return;
  const firm = await Firm.findByPk(data.firmId);
  if (!firm) throw notFound('The firm');
  const tmp = path.join(os.tmpdir(), `browseline-export-${crypto.randomBytes(8).toString('hex')}.zip`);
  const zip = createZipFile(tmp);
  const skipped: string[] = [];
  let key: string | null = null;
  try {
    // 1. A CSV per table (0–40 %).
    const tables = await firmTables();
    for (const [i, t] of tables.entries()) {
      await job.progress((i / tables.length) * 40, `Table ${t.table}`);
      await zip.add(`tables/${t.table}.csv`, tableCsv(t, firm.id));
    }
    // 2. A GeoJSON file per property (40–50 %).
    await job.progress(40, 'Property maps');
    await addProperties(zip, firm.id);
    // 3. Proposal and invoice PDFs (50–75 %), one at a time.
    const proposals = await Proposal.findAll({ where: { firmId: firm.id }, attributes: ['id'], order: [['id', 'ASC']] });
    const invoices = await Invoice.findAll({ where: { firmId: firm.id }, attributes: ['id'], order: [['id', 'ASC']] });
    const documents = proposals.length + invoices.length;
    let done = 0;
    for (const { id } of proposals) {
      await job.progress(50 + (done++ / Math.max(1, documents)) * 25, `Proposal PDFs (${done} of ${documents} documents)`);
      const proposal = await Proposal.findByPk(id);
      if (!proposal) continue;
      const name = `documents/proposals/${safeName(proposal.number)}-v${proposal.version}.pdf`;
      try {
        await zip.add(name, await renderProposalPdfFor(proposal));
      } catch (err) {
        skipped.push(`${name}: ${(err as Error).message}`);
      }
    }
    for (const { id } of invoices) {
      await job.progress(50 + (done++ / Math.max(1, documents)) * 25, `Invoice PDFs (${done} of ${documents} documents)`);
      const invoice = await Invoice.findByPk(id);
      if (!invoice) continue;
      const name = `documents/invoices/${safeName(invoice.number)}.pdf`;
      try {
        await zip.add(name, await renderInvoicePdfFor(invoice));
      } catch (err) {
        skipped.push(`${name}: ${(err as Error).message}`);
      }
    }
    // 4. Every uploaded file through storage, streamed (75–95 %).
    const files = await sequelize.query<{ folder: string; id: number; key: string; name: string | null; created_at: Date }>(
      `SELECT 'shared-files' AS folder, id, storage_key AS key, original_name AS name, created_at FROM shared_files WHERE firm_id = :firmId
       UNION ALL SELECT 'task-photos', id, storage_key, original_name, created_at FROM task_photos WHERE firm_id = :firmId
       UNION ALL SELECT 'overlays', id, storage_key, name, created_at FROM overlays WHERE firm_id = :firmId
       UNION ALL SELECT 'logo', id, logo_key, 'logo', updated_at FROM firms WHERE id = :firmId AND logo_key IS NOT NULL
       ORDER BY 1, 2`,
      { replacements: { firmId: firm.id }, type: QueryTypes.SELECT },
    );
    for (const [i, f] of files.entries()) {
      await job.progress(75 + (i / Math.max(1, files.length)) * 20, `Files (${i + 1} of ${files.length})`);
      const extension = path.extname(f.key);
      const base = safeName((f.name ?? 'file').replace(/\.[A-Za-z0-9]{1,8}$/, ''));
      const name = `files/${f.folder}/${f.id}-${base}${extension}`;
      try {
        await zip.add(name, streamOf(f.key), f.created_at);
      } catch (err) {
        skipped.push(`${name}: ${(err as Error).message}`);
      }
    }
    await zip.add(
      'README.txt',
      [
        `${firm.name}: everything in Browseline, exported ${new Date().toISOString()}.`,
        '',
        'tables/      one CSV file per table (RFC 4180, UTF-8); geometry columns as GeoJSON text; password and token hashes left out.',
        'properties/  one GeoJSON file per property: its boundary and its units (WGS84 longitude, latitude).',
        'documents/   the PDF of every proposal version and every invoice.',
        'files/       every uploaded file: shared files and season reports, task photos, imagery overlays, the logo.',
        '',
        skipped.length ? `Left out (${skipped.length}):\n${skipped.map((s) => `  ${s}`).join('\n')}` : 'Nothing was left out.',
        '',
      ].join('\r\n'),
    );
    const fileCount = await zip.close();
    await job.progress(95, 'Keeping the zip');
    const { size } = await fsp.stat(tmp);
    key = await saveStream('exports', fs.createReadStream(tmp), 'zip');
    const owner = record.requestedById ? await User.findByPk(record.requestedById) : null;
    const stored = key;
    const finished = await job.finish(async (transaction) => {
      await record.update({ status: 'ready', storageKey: stored, byteSize: size, fileCount, finishedAt: new Date() }, { transaction });
      if (owner?.active) {
        await enqueueEmail(
          { firmId: firm.id, kind: 'firm-export-ready', to: owner.email, email: firmExportReadyEmail({ firmName: firm.name, firmContact: emailFirmContact(firm), name: owner.name, url: `${config.publicUrl}/settings/export`, sizeText: sizeText(size), fileCount }) },
          transaction,
        );
      }
      return true;
    }, () => ({ exportId: record.id, byteSize: size, fileCount }));
    // Another delivery of the same job finished first: ours is not needed.
    if (finished === null) await deleteFile(stored);
  } catch (err) {
    zip.abort();
    if (key) await deleteFile(key).catch((e) => logger.warn({ err: e }, 'export zip not removed'));
    throw err;
  } finally {
    await fsp.rm(tmp, { force: true });
  }
}
