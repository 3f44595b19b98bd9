/**
 * Image overlays of a property (drone or purchased orthophotos): add, change (name, opacity, shown,
 * printed) and delete, each in a transaction with its audit record. The image is checked and
 * converted in a geo worker thread before anything is written; its stored file is removed again when
 * the transaction fails, and a deleted overlay's file only after its row is gone.
 */
import { sequelize } from '../db/sequelize';
import { Overlay, Property, type Corners } from '../models';
import { findInFirm } from '../policies/firm-scope';

/** Who acts: the signed-in user's id and firm. */
export interface Actor {
  id: number;
  firmId: number;
}
import { runOverlayPrep } from '../services/geo-work/geo-pool';
import { deleteFile, saveFile } from '../services/storage/storage';
import { recordAudit } from './audit-recorder';
import type { z } from 'zod';
import type { OverlayUpdateSchema } from '../../shared/schemas/firm';

export interface OverlayUpload {
  bytes: Buffer;
  fileName: string;
  name?: string;
  corners: Corners | null;
  worldFile: { text: string; epsg: number } | null;
}

/** Checks, converts (off the request thread) and stores an uploaded image as an overlay of the property. */
export async function addOverlay(actor: Actor, propertyId: number, upload: OverlayUpload, ip: string | null): Promise<Overlay> {
  const property = await findInFirm(Property, propertyId, actor.firmId, 'That property');
  const answer = await runOverlayPrep({ bytes: upload.bytes, corners: upload.corners, worldFile: upload.worldFile });
  const bytes = Buffer.from(answer.bytes.buffer, answer.bytes.byteOffset, answer.bytes.byteLength);
  const key = await saveFile('overlays', bytes, answer.extension);
  try {
    return await sequelize.transaction(async (transaction) => {
      const row = await Overlay.create(
        {
          firmId: actor.firmId,
          propertyId: property.id,
          name: upload.name || upload.fileName.slice(0, 120) || 'Image',
          storageKey: key,
          contentType: answer.contentType,
          byteSize: bytes.length,
          corners: answer.corners,
          createdById: actor.id,
        },
        { transaction },
      );
      await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'overlay.added', subjectType: 'Property', subjectId: property.id, data: { overlayId: row.id, byteSize: bytes.length }, ip }, transaction);
      return row;
    });
  } catch (err) {
    await deleteFile(key);
    throw err;
  }
}

/** Changes an overlay's name, opacity, visibility on the map or printing in documents. */
export async function updateOverlay(actor: Actor, overlayId: number, input: z.output<typeof OverlayUpdateSchema>, ip: string | null): Promise<Overlay> {
  return sequelize.transaction(async (transaction) => {
    const overlay = await findInFirm(Overlay, overlayId, actor.firmId, 'That image', { transaction, lock: true });
    await overlay.update(input, { transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'overlay.changed', subjectType: 'Property', subjectId: overlay.propertyId, data: { overlayId, keys: Object.keys(input) }, ip }, transaction);
    return overlay;
  });
}

/** Deletes an overlay and then its stored image. */
export async function deleteOverlay(actor: Actor, overlayId: number, ip: string | null): Promise<void> {
  const key = await sequelize.transaction(async (transaction) => {
    const overlay = await findInFirm(Overlay, overlayId, actor.firmId, 'That image', { transaction, lock: true });
    await overlay.destroy({ transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'overlay.deleted', subjectType: 'Property', subjectId: overlay.propertyId, data: { overlayId, name: overlay.name }, ip }, transaction);
    return overlay.storageKey;
  });
  await deleteFile(key);
}
