/** Development only: the owner reads the mail the local capture server caught. */
import type { NextFunction, Request, Response } from 'express';
import { defineRoutes, OWNER } from '../middlewares/access';
import { validate } from '../middlewares/validate';
import { IdParamsSchema } from '../../shared/schemas/common';
import { config } from '../config';
import { notFound, serviceUnavailable } from '../errors';

const r = defineRoutes('/dev/mail');

const developmentOnly = (_req: Request, _res: Response, next: NextFunction) => next(config.isProduction ? notFound('That page') : undefined);

async function fromCapture(path: string): Promise<unknown> {
  try {
    const answer = await fetch(`${config.mailCaptureUrl}${path}`, { signal: AbortSignal.timeout(3000) });
    if (answer.status === 404) throw notFound('That message');
    return await answer.json();
  } catch (err) {
    if ((err as { status?: number }).status === 404) throw err;
    throw serviceUnavailable('The local mail capture server is not running. Start the product with its start command.');
  }
}

r.get('/', OWNER, developmentOnly, async (_req, res) => {
  res.json(await fromCapture('/messages'));
});

r.get('/:id', OWNER, developmentOnly, validate({ params: IdParamsSchema }), async (req, res) => {
  res.json(await fromCapture(`/messages/${Number(req.params.id)}`));
});

export const devMailRouter = r.router;
