import { api } from '../../../lib/api-client';
import { IDEMPOTENCY_HEADER } from '../../../../shared/domain/tasks';
import { completionForm, type QueuedCompletion } from '../lib/completion-queue';
import type { FieldTask } from './get-my-tasks';

/** Sends one queued completion (multipart with photos) under its idempotency key; the same key again answers the first completion. */
export async function sendCompletion(item: QueuedCompletion): Promise<{ replayed: boolean; task: FieldTask }> {
  const body = await api.upload<{ data: FieldTask; replayed: boolean }>(`/api/tasks/${item.taskId}/complete`, completionForm(item), { [IDEMPOTENCY_HEADER]: item.key });
  return { replayed: body.replayed, task: body.data };
}
