/**
 * The owner reads the mail the local capture server caught — only mail the owner's own firm sent
 * (matched through the outbox id each message carries), and only when DEV_MAIL_READER=true outside
 * production. Otherwise the address answers 404, as if it did not exist.
 */
import type { NextFunction, Request, Response } from 'express';
import { defineRoutes, OWNER } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { IdParamsSchema } from '../../shared/schemas/common';
import { config } from '../config';
import { AppError, notFound, serviceUnavailable } from '../errors';
import { OutboxMessage } from '../models';
import { actor } from '../policies/firm-scope';

const r = defineRoutes('/dev/mail');

const readerOff = () => new AppError(404, 'not_found', 'The captured-mail reader is off. It works only in development, started with DEV_MAIL_READER=true.');
const readerOn = (_req: Request, _res: Response, next: NextFunction) => next(config.devMailReader && !config.isProduction ? undefined : readerOff());

interface CapturedSummary {
  id: number;
  outboxId?: number | null;
}

async function fromCapture<T>(path: string): Promise<T> {
  try {
    const answer = await fetch(`${config.mailCaptureUrl}${path}`, { signal: AbortSignal.timeout(3000) });
    if (answer.status === 404) throw notFound('That message');
    return (await answer.json()) as T;
  } catch (err) {
    if ((err as { status?: number }).status === 404) throw err;
    throw serviceUnavailable('The local mail capture server is not running. Start the product with its start command.');
  }
}

/** The outbox ids among `ids` that the firm sent. */
async function firmOutboxIds(firmId: number, ids: number[]): Promise<Set<number>> {
  if (!ids.length) return new Set();
  const rows = await OutboxMessage.findAll({ where: { firmId, id: ids }, attributes: ['id'] });
  return new Set(rows.map((m) => m.id));
}

r.get('/', OWNER, readerOn, async (req, res) => {
  const { data } = await fromCapture<{ data: CapturedSummary[] }>('/messages');
  const ours = await firmOutboxIds(actor(req).firmId, data.map((m) => m.outboxId).filter((id): id is number => typeof id === 'number'));
  res.json({ data: data.filter((m) => typeof m.outboxId === 'number' && ours.has(m.outboxId)) });
});

r.get('/:id', OWNER, readerOn, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const message = await fromCapture<{ data: CapturedSummary }>(`/messages/${params.id}`);
  const outboxId = message.data.outboxId;
  if (typeof outboxId !== 'number' || !(await firmOutboxIds(actor(req).firmId, [outboxId])).has(outboxId)) throw notFound('That message');
  res.json(message);
}));

export const devMailRouter = r.router;
