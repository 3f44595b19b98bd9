import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, getData } from '../../../lib/api-client';
import { IDEMPOTENCY_HEADER } from '../../../../shared/domain/tasks';
import type { SitDto } from '../../../../shared/schemas/hunting';
import type { QueuedSit } from '../lib/sit-queue';
import { huntingKeys } from './keys';

export const getSitsQueryOptions = (propertyId: number) => queryOptions({ queryKey: huntingKeys.sits(propertyId), queryFn: ({ signal }) => getData<SitDto[]>(`/api/properties/${propertyId}/sits`, signal) });

/** The property's sits, newest first. */
export const useSits = (propertyId: number) => useQuery({ ...getSitsQueryOptions(propertyId), enabled: propertyId > 0 });

/** Sends one queued sit under its idempotency key; the same key again answers the first sit. */
export async function sendSit(item: QueuedSit): Promise<{ replayed: boolean; sit: SitDto }> {
  const body = await api.postWithHeaders<{ data: SitDto; replayed: boolean }>(`/api/properties/${item.propertyId}/sits`, item.body, { [IDEMPOTENCY_HEADER]: item.key });
  return { replayed: body.replayed, sit: body.data };
}
