/**
 * Reads one photo of a camera card through the shared photo intake (type by content, size, pixels
 * from the header, EXIF judged, SHA-256). A refusal becomes a skip with its sentence, so one bad
 * file never loses the rest of the batch.
 */
import { AppError } from '../../errors';
import { inspectPhoto, type InspectedPhoto } from '../photos';
import { CARD_LIMITS, type SkipReason } from '../../../shared/schemas/cameras';

export type CardPhotoReading = { ok: true; photo: InspectedPhoto } | { ok: false; name: string | null; reason: SkipReason; message: string };

const REASONS: Record<number, SkipReason> = { 413: 'too-large', 415: 'not-a-photo', 422: 'too-many-pixels' };

/** Checks one uploaded file and reads what the card upload needs; a refusal says why in a sentence. */
export async function readCardPhoto(bytes: Buffer, name: string | null, now = new Date()): Promise<CardPhotoReading> {
  try {
    return { ok: true, photo: await inspectPhoto({ bytes, originalName: name }, { maxBytes: CARD_LIMITS.maxBytes, maxPixels: CARD_LIMITS.maxPixels }, now) };
  } catch (err) {
    if (err instanceof AppError && REASONS[err.status]) return { ok: false, name, reason: REASONS[err.status], message: `${err.message} It was skipped.` };
    throw err;
  }
}
