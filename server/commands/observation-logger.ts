/**
 * Logs a field observation: who may log where, the position (the phone's, a tap on the map, or the
 * first photo's EXIF GPS), the time (given, else the first photo's EXIF time read in the firm's
 * zone, else now), the unit it falls in (PostGIS + shared placement rule), a confirmation when it
 * lies far outside the property, and the photos — stored through the shared photo intake, written
 * with the row in one transaction, and removed again if that transaction fails. The phone's
 * Idempotency-Key makes a repeated send answer the first observation and store nothing.
 */
import type { Transaction } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { Client, Firm, Observation, ObservationPhoto, Property } from '../models';
import type { SessionUser } from '../../shared/schemas/auth';
import type { ObservationCreateInput } from '../../shared/schemas/observation';
import { observationSnapFt, placeObservation, type PositionSource } from '../../shared/domain/observations';
import { exifInstant } from '../../shared/domain/photo-exif';
import { formatDate } from '../../shared/domain/clock';
import { forbidden, notFound, unprocessable } from '../errors';
import { usableZone } from '../services/clock';
import { discardStoredPhoto, storePhoto, type InspectedPhoto, type StoredPhoto } from '../services/photos';
import { placementMeasures } from '../queries/observations';
import { recordAudit } from './audit-recorder';

/** Storage folders of observation photos and their thumbnails. */
export const OBSERVATION_PHOTO_FOLDERS = { photos: 'observation-photos', thumbnails: 'observation-thumbs' } as const;

/** How far ahead of the server's clock an observation time may be (a phone clock a little fast; common practice, no source). */
const FUTURE_SLACK_MS = 10 * 60 * 1000;

/**
 * The property an actor may read observations of: staff and crew, any property of the firm; a
 * client's contact, only its own client's property. Anything else is a 404 (nothing revealed).
 */
export async function propertyForObservations(actor: SessionUser, propertyId: number, transaction?: Transaction): Promise<Property> {
  const property = await Property.findOne({ where: { id: propertyId, firmId: actor.firmId }, transaction });
  if (!property) throw notFound('That property');
  if (actor.role === 'client' && property.clientId !== actor.clientId) throw notFound('That property');
  return property;
}

/** Like propertyForObservations, and a client's contact must have been allowed to log by the consultant (403 otherwise). */
export async function propertyToLogOn(actor: SessionUser, propertyId: number, transaction?: Transaction): Promise<Property> {
  const property = await propertyForObservations(actor, propertyId, transaction);
  if (actor.role === 'client') {
    const client = await Client.findByPk(property.clientId, { attributes: ['id', 'portalObservationsAllowed'], transaction });
    if (!client?.portalObservationsAllowed) throw forbidden('Logging observations is not turned on for your account. Ask your consultant to allow it, or send them the photo and a note.');
  }
  return property;
}

export interface LoggedObservation {
  id: number;
  replayed: boolean;
}

async function earlier(actor: SessionUser, propertyId: number, key: string): Promise<LoggedObservation | null> {
  const row = await Observation.findOne({ where: { firmId: actor.firmId, idempotencyKey: key }, attributes: ['id', 'propertyId'] });
  if (!row) return null;
  if (row.propertyId !== propertyId) throw unprocessable('This Idempotency-Key was used for an observation on another property. Make a new key for each new observation.');
  return { id: row.id, replayed: true };
}

function choosePosition(input: ObservationCreateInput, photos: InspectedPhoto[]): { position: [number, number]; source: PositionSource } {
  if (input.lon !== undefined && input.lat !== undefined) return { position: [input.lon, input.lat], source: input.positionSource ?? 'device' };
  const fromPhoto = photos.find((p) => p.exif.position);
  if (fromPhoto?.exif.position) return { position: fromPhoto.exif.position, source: 'photo' };
  const why = photos.flatMap((p) => p.exif.problems.filter((x) => x.tag === 'GPS').map((x) => x.message));
  throw unprocessable(
    why.length
      ? `Where was this? ${why[0]}`
      : photos.length
        ? 'Where was this? The photos carry no GPS position. Use the phone\u2019s position or tap the map.'
        : 'Where was this? Use the phone\u2019s position or tap the map (or attach a photo that carries its GPS position).',
    { field: 'lon' },
  );
}

function chooseTime(input: ObservationCreateInput, photos: InspectedPhoto[], zone: string, now: Date): Date {
  let at: Date | null = input.observedAt ? new Date(input.observedAt) : null;
  if (!at) {
    const withTime = photos.find((p) => p.exif.takenAtLocal);
    if (withTime?.exif.takenAtLocal) at = exifInstant(withTime.exif.takenAtLocal, withTime.exif.takenAtOffset, zone);
  }
  at ??= now;
  if (at.getTime() > now.getTime() + FUTURE_SLACK_MS) throw unprocessable(`observedAt: ${formatDate(at.toISOString().slice(0, 10))} is in the future. Give the time you saw it.`, { field: 'observedAt' });
  if (at.getUTCFullYear() < 1990) throw unprocessable('observedAt: the time is before 1990. Give the time you saw it.', { field: 'observedAt' });
  return at;
}

/** Logs one observation (or answers the earlier one for the same key); see the module comment. */
export async function logObservation(actor: SessionUser, propertyId: number, input: ObservationCreateInput, photos: InspectedPhoto[], key: string, ip: string | null, now = new Date()): Promise<LoggedObservation> {
  const replay = await earlier(actor, propertyId, key);
  if (replay) return replay;
  await propertyToLogOn(actor, propertyId);
  const firm = await Firm.findByPk(actor.firmId, { attributes: ['id', 'settings', 'timezone'] });
  const { position, source } = choosePosition(input, photos);
  const observedAt = chooseTime(input, photos, usableZone(firm?.timezone), now);
  const placement = placeObservation(await placementMeasures(propertyId, position[0], position[1]), observationSnapFt(firm?.settings));
  if (placement.farAwayFt !== null && !input.confirmFarAway) {
    const miles = placement.farAwayFt / 5280;
    const distance = miles >= 0.5 ? `${miles.toFixed(1)} miles` : `${placement.farAwayFt.toLocaleString('en-US')} ft`;
    throw unprocessable(`This position is ${distance} outside the property. Check the property and the position; if it is right, send it again with confirmFarAway.`, { field: 'confirmFarAway', distanceFt: placement.farAwayFt });
  }
  const stored: StoredPhoto[] = [];
  try {
    for (const photo of photos) stored.push(await storePhoto(photo, OBSERVATION_PHOTO_FOLDERS));
    const id = await sequelize.transaction(async (transaction) => {
      const row = await Observation.create(
        {
          firmId: actor.firmId,
          propertyId,
          unitId: placement.unitId,
          kind: input.kind,
          observedAt,
          notes: input.notes,
          position: { type: 'Point', coordinates: position },
          positionSource: source,
          insideBoundary: placement.insideBoundary,
          idempotencyKey: key,
          createdById: actor.id,
        },
        { transaction },
      );
      await ObservationPhoto.bulkCreate(
        stored.map((p) => ({
          firmId: actor.firmId,
          observationId: row.id,
          storageKey: p.storageKey,
          thumbnailKey: p.thumbnailKey,
          originalName: p.originalName?.slice(0, 200) ?? null,
          contentType: p.contentType,
          byteSize: p.byteSize,
          width: p.width,
          height: p.height,
          sha256: p.sha256,
          takenAt: p.exif.takenAtLocal ? exifInstant(p.exif.takenAtLocal, p.exif.takenAtOffset, usableZone(firm?.timezone)) : null,
          latitude: p.exif.position?.[1] ?? null,
          longitude: p.exif.position?.[0] ?? null,
          exifProblems: p.exif.problems.map((x) => x.message),
        })),
        { transaction },
      );
      await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'observation.logged', subjectType: 'Observation', subjectId: row.id, data: { kind: input.kind, photos: stored.length, positionSource: source, idempotencyKey: key }, ip }, transaction);
      return row.id;
    });
    return { id, replayed: false };
  } catch (error) {
    await Promise.all(stored.map((p) => discardStoredPhoto(p)));
    // A concurrent copy with the same key won the unique index: answer its observation.
    if ((error as { name?: string }).name === 'SequelizeUniqueConstraintError') {
      const again = await earlier(actor, propertyId, key);
      if (again) return again;
    }
    throw error;
  }
}
