/**
 * Shared files: the consultant's uploads for a client (and optionally one property), the client's
 * own uploads where allowed, edits and deletion. The type is decided from the bytes; the bytes go to
 * disk storage under a random key; the row and the audit event are written in one transaction.
 */
import { fileTypeFromBuffer } from 'file-type';
import type { SessionUser } from '../../shared/schemas/auth';
import { Op } from 'sequelize';
import { Client, Property, SeasonReport, SharedFile } from '../models';
import { sequelize } from '../db/sequelize';
import { recordAudit } from './audit-recorder';
import { badRequest, conflict, forbidden, notFound, unsupportedMedia } from '../errors';
import { findInFirm } from '../policies/firm-scope';
import { deleteFile, saveFile } from '../services/storage/storage';
import { decideFileKind } from '../../shared/domain/file-kinds';
import type { ClientFileUploadInput, FileUpdateInput, SharedFileCategory, StaffFileUploadInput } from '../../shared/schemas/file';

export interface UploadedBytes {
  buffer: Buffer;
  originalname: string;
}

/** Checks the bytes by content: answers the stored content type and extension, or a 415 saying what to upload. */
export async function checkFileContent(file: UploadedBytes | undefined): Promise<{ contentType: string; extension: string }> {
  if (!file) throw badRequest('Attach the file in the form field “file”.');
  const sniffed = await fileTypeFromBuffer(file.buffer);
  const decision = decideFileKind(file.buffer, sniffed ? { ext: sniffed.ext, mime: sniffed.mime } : undefined, file.originalname);
  if (!decision.ok) throw unsupportedMedia(decision.message);
  return { contentType: decision.contentType, extension: decision.extension };
}

const titleFrom = (title: string | undefined, originalName: string) => (title && title.length ? title : originalName.replace(/\.[A-Za-z0-9]{1,10}$/, '').slice(0, 160) || 'File');

async function store(
  me: SessionUser,
  file: UploadedBytes,
  row: { clientId: number; propertyId: number | null; category: SharedFileCategory; title: string; visibleToClient: boolean; uploadedByRole: 'staff' | 'client' },
  ip: string | null,
): Promise<SharedFile> {
  const { contentType, extension } = await checkFileContent(file);
  const key = await saveFile('files', file.buffer, extension);
  try {
    return await sequelize.transaction(async (transaction) => {
      const created = await SharedFile.create(
        { firmId: me.firmId, ...row, storageKey: key, originalName: file.originalname.slice(0, 255) || null, contentType, byteSize: file.buffer.length, uploadedById: me.id },
        { transaction },
      );
      await recordAudit({ firmId: me.firmId, userId: me.id, action: row.uploadedByRole === 'client' ? 'file.uploaded-by-client' : 'file.shared', subjectType: 'SharedFile', subjectId: created.id, data: { clientId: row.clientId, category: row.category }, ip }, transaction);
      return created;
    });
  } catch (err) {
    await deleteFile(key);
    throw err;
  }
}

/** A consultant's upload for one of the firm's clients (and optionally one of its properties). */
export async function shareFile(me: SessionUser, input: StaffFileUploadInput, file: UploadedBytes | undefined, ip: string | null): Promise<SharedFile> {
  const client = await findInFirm(Client, input.clientId, me.firmId, 'That client');
  if (input.propertyId) {
    const property = await findInFirm(Property, input.propertyId, me.firmId, 'That property');
    if (property.clientId !== client.id) throw badRequest(`The property “${property.name}” belongs to another client; choose one of ${client.name}’s properties or none.`);
  }
  if (!file) throw badRequest('Attach the file in the form field “file”.');
  return store(me, file, { clientId: client.id, propertyId: input.propertyId, category: input.category, title: titleFrom(input.title, file.originalname), visibleToClient: input.visibleToClient, uploadedByRole: 'staff' }, ip);
}

/** Refuses a client whose consultant has not allowed portal uploads (checked before the upload is read). */
export async function assertClientMayUpload(me: SessionUser): Promise<Client> {
  const client = me.clientId ? await Client.findOne({ where: { id: me.clientId, firmId: me.firmId } }) : null;
  if (!client) throw forbidden();
  if (!client.portalUploadsAllowed) throw forbidden('Uploads are not turned on for your account. Ask your consultant to allow them, or e-mail the file instead.');
  return client;
}

/** A client's own upload, always visible to the client and to the firm. */
export async function uploadClientFile(me: SessionUser, input: ClientFileUploadInput, file: UploadedBytes | undefined, ip: string | null): Promise<SharedFile> {
  const client = await assertClientMayUpload(me);
  if (input.propertyId) {
    const property = await Property.findOne({ where: { id: input.propertyId, firmId: me.firmId, clientId: client.id }, attributes: ['id'] });
    if (!property) throw notFound('That property');
  }
  if (!file) throw badRequest('Attach the file in the form field “file”.');
  return store(me, file, { clientId: client.id, propertyId: input.propertyId, category: 'client-upload', title: titleFrom(input.title, file.originalname), visibleToClient: true, uploadedByRole: 'client' }, ip);
}

/** Renames a file or shares/unshares it; a client's own upload stays visible to the client. */
export async function updateSharedFile(me: SessionUser, id: number, input: FileUpdateInput, ip: string | null): Promise<SharedFile> {
  return sequelize.transaction(async (transaction) => {
    const file = await findInFirm(SharedFile, id, me.firmId, 'That file', { transaction, lock: true });
    if (input.visibleToClient === false && file.uploadedByRole === 'client') throw badRequest('The client uploaded this file, so it stays visible to them. Delete it instead if it should go.');
    await file.update(input, { transaction });
    await recordAudit({ firmId: me.firmId, userId: me.id, action: 'file.updated', subjectType: 'SharedFile', subjectId: file.id, data: { ...input }, ip }, transaction);
    return file;
  });
}

/** Deletes a file's row (with an audit event) and then its bytes. */
export async function removeSharedFile(me: SessionUser, id: number, ip: string | null): Promise<void> {
  const key = await sequelize.transaction(async (transaction) => {
    const file = await findInFirm(SharedFile, id, me.firmId, 'That file', { transaction, lock: true });
    // A sent season report is a document the landowner received: it stays as sent.
    if (file.category === 'season-report' && (await SeasonReport.count({ where: { sharedFileId: file.id, sentAt: { [Op.ne]: null } }, transaction }))) {
      throw conflict('This is a season report that was sent to the landowner; it stays as sent. Make a new report for changes.');
    }
    await file.destroy({ transaction });
    await recordAudit({ firmId: me.firmId, userId: me.id, action: 'file.deleted', subjectType: 'SharedFile', subjectId: file.id, data: { title: file.title, clientId: file.clientId }, ip }, transaction);
    return file.storageKey;
  });
  await deleteFile(key);
}
