import { api } from '../../../lib/api-client';
import { IDEMPOTENCY_HEADER } from '../../../../shared/domain/tasks';
import type { UnitCheckDto } from '../../../../shared/schemas/checks';
import type { QueuedCheck } from '../lib/check-queue';

/** Sends one queued check under its idempotency key; the same key again answers the first check (`replayed`). */
export async function sendCheck(item: QueuedCheck): Promise<{ replayed: boolean; check: UnitCheckDto }> {
  const body = await api.postWithHeaders<{ data: UnitCheckDto; replayed?: boolean }>(`/api/units/${item.unitId}/checks`, item.body, { [IDEMPOTENCY_HEADER]: item.key });
  return { replayed: body.replayed === true, check: body.data };
}
