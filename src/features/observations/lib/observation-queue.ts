/**
 * Observations waiting on the phone: the shared offline queue (src/lib/offline-queue.ts) with an
 * observation's fields and photos. Stored in IndexedDB (idb-keyval, db "browseline-observations")
 * before anything is sent.
 */
import { browserStore, type OfflineStore, type QueuedItem } from '../../../lib/offline-queue';
import type { ObservationKind } from '../../../../shared/domain/observations';

/** A photo as it waits on the phone. */
export interface QueuedObservationPhoto {
  name: string;
  type: string;
  blob: Blob;
}

/** What the log form gave. Position: with source device or map, or none (the photo's GPS). */
export interface ObservationFields {
  kind: ObservationKind;
  /** ISO instant with zone. */
  observedAt: string;
  notes: string;
  position: { lon: number; lat: number; source: 'device' | 'map' } | null;
  confirmFarAway?: boolean;
}

export interface QueuedObservation extends QueuedItem {
  propertyId: number;
  propertyName: string;
  fields: ObservationFields;
  photos: QueuedObservationPhoto[];
}

/** A new idempotency key for one observation (fits the server's 8–200 [A-Za-z0-9_.:-] rule). */
export function newObservationKey(randomUuid: () => string = () => crypto.randomUUID()): string {
  return `obs-${randomUuid()}`;
}

/** The multipart body: kind, observedAt, notes, lon/lat/positionSource when given, the photos. */
export function observationForm(item: QueuedObservation): FormData {
  const form = new FormData();
  form.append('kind', item.fields.kind);
  form.append('observedAt', item.fields.observedAt);
  if (item.fields.notes.trim()) form.append('notes', item.fields.notes.trim());
  if (item.fields.position) {
    form.append('lon', String(item.fields.position.lon));
    form.append('lat', String(item.fields.position.lat));
    form.append('positionSource', item.fields.position.source);
  }
  if (item.fields.confirmFarAway) form.append('confirmFarAway', 'true');
  for (const photo of item.photos) form.append('photos', photo.blob, photo.name);
  return form;
}

/** The phone's observation store (one per page). */
export function observationStore(): OfflineStore<QueuedObservation> {
  return browserStore<QueuedObservation>('browseline-observations', 'observations');
}

/** An instant with the phone's own offset, as the server wants it: "2026-10-14T07:31:00-05:00". */
export function localInstant(date: Date): string {
  const pad = (n: number) => String(Math.abs(n)).padStart(2, '0');
  const offset = -date.getTimezoneOffset();
  const sign = offset >= 0 ? '+' : '-';
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}T${pad(date.getHours())}:${pad(date.getMinutes())}:${pad(date.getSeconds())}${sign}${pad(Math.trunc(offset / 60))}:${pad(offset % 60)}`;
}
