/**
 * Card photos: adding a card's photos to a deployment (duplicates by content hash skipped, true
 * time from the camera clock in the firm's zone plus the deployment's clock offset, thumbnails
 * handed to a background job) and tagging them in review.
 */
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { Buck, CameraDeployment, CameraPhoto } from '../models';
import { findInFirm } from '../policies/firm-scope';
import { unprocessable } from '../errors';
import { recordAudit } from './audit-recorder';
import { cameraSettings } from '../queries/camera-fleet';
import { enqueueJob } from '../services/jobs/job-queue';
import { deleteFile, saveFile } from '../services/storage/storage';
import { correctedPhotoTime } from '../../shared/domain/camera-events';
import { formatDate, zonedReading } from '../../shared/domain/clock';
import type { InspectedPhoto } from '../services/photos';
import type { CardPhotoReading } from '../services/cameras/card-photo';
import type { CardUploadResult, CameraPhotoTagInput } from '../../shared/schemas/cameras';
import type { SessionUser } from '../../shared/schemas/auth';
import { presentCameraPhoto } from '../presenters/camera';

const DAY_MS = 86_400_000;
const nameOf = (p: InspectedPhoto) => (p.originalName ? `“${p.originalName}”` : 'A photo');

/**
 * Flags a photo whose true time cannot be right: after now (a clock in 2099) or more than a day
 * outside the deployment's days. Such photos are kept but left out of events until the clock
 * offset is corrected.
 */
export function photoTimeFlags(takenAt: Date, deployment: Pick<CameraDeployment, 'startedOn' | 'endedOn'>, now: Date): string[] {
  const start = Date.parse(`${deployment.startedOn}T00:00:00Z`) - DAY_MS;
  const end = deployment.endedOn ? Date.parse(`${deployment.endedOn}T00:00:00Z`) + 2 * DAY_MS : now.getTime() + DAY_MS;
  const t = takenAt.getTime();
  return t < start || t > end || t > now.getTime() + DAY_MS ? ['time-out-of-range'] : [];
}

/** Adds a batch of a card's photos to a deployment; answers what was added, skipped and flagged, and why. */
export async function addCardPhotos(actor: SessionUser, deploymentId: number, readings: CardPhotoReading[], ip: string | null): Promise<CardUploadResult> {
  const deployment = await findInFirm(CameraDeployment, deploymentId, actor.firmId, 'That deployment');
  const { zone } = await cameraSettings(actor.firmId);
  const skips: CardUploadResult['skips'] = [];
  const flagged: CardUploadResult['flagged'] = [];
  const seen = new Set<string>();
  const fresh = [];
  for (const r of readings) {
    if (!r.ok) {
      skips.push({ name: r.name, reason: r.reason, message: r.message });
      continue;
    }
    if (seen.has(r.photo.sha256)) {
      skips.push({ name: r.photo.originalName, reason: 'duplicate', message: `${nameOf(r.photo)} was sent twice in this batch; it was added once.` });
      continue;
    }
    seen.add(r.photo.sha256);
    fresh.push(r.photo);
  }
  const existing = fresh.length
    ? await sequelize.query<{ sha256: string }>(`SELECT sha256 FROM camera_photos WHERE deployment_id = :deploymentId AND sha256 IN (:hashes)`, { replacements: { deploymentId, hashes: fresh.map((p) => p.sha256) }, type: QueryTypes.SELECT })
    : [];
  const have = new Set(existing.map((e) => e.sha256));
  const toAdd = fresh.filter((p) => {
    if (!have.has(p.sha256)) return true;
    skips.push({ name: p.originalName, reason: 'duplicate', message: `${nameOf(p)} is already on this deployment (same content); it was skipped.` });
    return false;
  });

  // Files first, rows after in one transaction; if the transaction fails, the files go again.
  const keys: string[] = [];
  try {
    for (const p of toAdd) keys.push(await saveFile('photos', p.bytes, p.extension));
    const now = new Date();
    const added = await sequelize.transaction(async (transaction) => {
      const rows: CameraPhoto[] = [];
      for (const [i, p] of toAdd.entries()) {
        const flags: string[] = [];
        const label = nameOf(p);
        const { takenAtLocal, takenAtOffset, problems } = p.exif;
        const takenAt = takenAtLocal ? correctedPhotoTime(takenAtLocal, takenAtOffset, zone, deployment.clockOffsetSeconds) : null;
        for (const problem of problems) {
          flags.push(problem.tag === 'GPS' ? 'gps-unusable' : 'no-time');
          flagged.push({ name: p.originalName, message: `${label}: ${problem.message.replace(/ Use the phone’s position or tap the map\.$/, ' The camera site’s position is used instead.').replace(/,? or give the time yourself\.$/, '. It is kept for review but left out of the events.')}` });
        }
        if (takenAt) {
          const out = photoTimeFlags(takenAt, deployment, now);
          flags.push(...out);
          if (out.length) flagged.push({ name: p.originalName, message: `${label} says it was taken ${formatDate(zonedReading(takenAt, zone).date)}, outside the days this camera ran; it is kept but left out of the events. Set the deployment’s clock offset if the camera’s clock was wrong.` });
        } else if (!flags.includes('no-time')) {
          flags.push('no-time');
          flagged.push({ name: p.originalName, message: `${label} carries no capture time (EXIF DateTimeOriginal); it is kept for review but left out of the events.` });
        }
        // ON CONFLICT: the same photo sent at the same moment by another request is added once.
        const [inserted] = await sequelize.query<{ id: number }>(
          `INSERT INTO camera_photos (firm_id, deployment_id, property_id, sha256, storage_key, content_type, byte_size, original_name, camera_time, camera_offset, taken_at, flags)
           VALUES (:firmId, :deploymentId, :propertyId, :sha256, :key, :contentType, :byteSize, :name, :cameraTime, :cameraOffset, :takenAt, :flags::jsonb)
           ON CONFLICT (deployment_id, sha256) DO NOTHING RETURNING id`,
          {
            replacements: { firmId: actor.firmId, deploymentId, propertyId: deployment.propertyId, sha256: p.sha256, key: keys[i], contentType: p.contentType, byteSize: p.byteSize, name: p.originalName, cameraTime: p.exifRead.takenAtLocal, cameraOffset: p.exifRead.takenAtOffset, takenAt, flags: JSON.stringify(flags) },
            type: QueryTypes.SELECT,
            transaction,
          },
        );
        if (!inserted) {
          skips.push({ name: p.originalName, reason: 'duplicate', message: `${label} is already on this deployment (same content); it was skipped.` });
          continue;
        }
        const row = await CameraPhoto.findByPk(inserted.id, { transaction });
        rows.push(row!);
      }
      if (rows.length) {
        await enqueueJob({ kind: 'camera-thumbnails', firmId: actor.firmId, createdById: actor.id, title: `Thumbnails of ${rows.length} camera photo${rows.length === 1 ? '' : 's'}`, subject: { type: 'CameraDeployment', id: deploymentId }, data: { photoIds: rows.map((r) => r.id) }, retryLimit: 3 }, transaction);
        await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'camera-photos.added', subjectType: 'CameraDeployment', subjectId: deploymentId, data: { added: rows.length, skipped: skips.length }, ip }, transaction);
      }
      return rows;
    });
    // Files of rows that turned out to be duplicates are not needed.
    const kept = new Set(added.map((r) => r.storageKey));
    await Promise.all(keys.filter((k) => !kept.has(k)).map((k) => deleteFile(k).catch(() => undefined)));
    return { added: added.length, skipped: skips.length, photos: added.map(presentCameraPhoto), skips, flagged };
  } catch (err) {
    await Promise.all(keys.map((k) => deleteFile(k).catch(() => undefined)));
    throw err;
  }
}

/** Tags a photo (and names its buck from the property's roster); another firm's photo is a 404. */
export async function tagPhoto(actor: SessionUser, id: number, values: CameraPhotoTagInput, ip: string | null): Promise<CameraPhoto> {
  return sequelize.transaction(async (transaction) => {
    const photo = await findInFirm(CameraPhoto, id, actor.firmId, 'That photo', { transaction, lock: true });
    const tag = values.tag;
    let buckId = values.buckId === undefined ? (tag === 'buck' ? photo.buckId : null) : values.buckId;
    if (tag !== 'buck') buckId = null;
    if (buckId) {
      const buck = await Buck.findOne({ where: { id: buckId, firmId: actor.firmId }, attributes: ['id', 'propertyId'], transaction });
      if (!buck || buck.propertyId !== photo.propertyId) throw unprocessable('buckId: that buck is not on this property’s roster. Pick a buck of this property, or add it to the roster first.', [{ path: 'buckId', message: 'not on this roster' }]);
    }
    const featured = tag === 'person' ? false : (values.featured ?? photo.featured);
    await photo.update({ tag, buckId, featured, taggedById: actor.id, taggedAt: new Date() }, { transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'camera-photo.tagged', subjectType: 'CameraPhoto', subjectId: id, data: { tag, buckId }, ip }, transaction);
    return photo;
  });
}
