import { api } from '../../../lib/api-client';
import { IDEMPOTENCY_HEADER } from '../../../../shared/domain/tasks';
import type { ObservationDto } from '../../../../shared/schemas/observation';
import { observationForm, type QueuedObservation } from '../lib/observation-queue';

/** Sends one queued observation (multipart with photos) under its idempotency key; the same key again answers the first observation. */
export async function sendObservation(item: QueuedObservation): Promise<{ replayed: boolean; observation: ObservationDto }> {
  const body = await api.upload<{ data: ObservationDto; replayed: boolean }>(`/api/properties/${item.propertyId}/observations`, observationForm(item), { [IDEMPOTENCY_HEADER]: item.key });
  return { replayed: body.replayed, observation: body.data };
}
