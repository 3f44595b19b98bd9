import express, { type NextFunction, type Request, type Response } from 'express';
import request from 'supertest';
import { z, ZodError } from 'zod';
import { describe, expect, it } from 'vitest';
import { typed } from '../../../server/middlewares/typed-route';
import { IdParamsSchema } from '../../../shared/schemas/common';

/** An app with one typed route and an error handler that answers 422 for zod errors and the error's status otherwise. */
function appWith(...handlers: express.RequestHandler[]) {
  const app = express();
  app.use(express.json());
  app.post('/things/:id', ...handlers);
  app.use((err: unknown, _req: Request, res: Response, _next: NextFunction) => {
    if (err instanceof ZodError) return res.status(422).json({ error: err.issues[0]?.message, path: err.issues[0]?.path });
    const status = (err as { status?: number }).status ?? 500;
    res.status(status).json({ error: (err as Error).message });
  });
  return app;
}

const Body = z.object({ name: z.string().min(1, 'name the thing') });

describe('typed route helper', () => {
  it('hands the handler the parsed params and body', async () => {
    const app = appWith(...typed({ params: IdParamsSchema, body: Body }, ({ params, body }, _req, res) => res.json({ id: params.id, idType: typeof params.id, name: body.name })));
    const answer = await request(app).post('/things/42').send({ name: 'Oak' });
    expect(answer.status).toBe(200);
    expect(answer.body).toEqual({ id: 42, idType: 'number', name: 'Oak' });
  });

  it('answers a bad id before the handler runs', async () => {
    let ran = false;
    const app = appWith(...typed({ params: IdParamsSchema }, (_input, _req, res) => { ran = true; res.end(); }));
    expect((await request(app).post('/things/abc').send({})).status).toBe(422);
    expect(ran).toBe(false);
  });

  it('passes a rejected handler to the error handler', async () => {
    const app = appWith(...typed({ params: IdParamsSchema }, async () => { throw Object.assign(new Error('That thing'), { status: 404 }); }));
    const answer = await request(app).post('/things/1').send({});
    expect(answer.status).toBe(404);
    expect(answer.body.error).toBe('That thing');
  });

  describe('with steps (a multipart route)', () => {
    const order: string[] = [];
    const upload: express.RequestHandler = (_req, _res, next) => { order.push('upload'); next(); };

    it('runs params, the before step, the upload, the body check, then the handler, in that order', async () => {
      order.length = 0;
      const app = appWith(...typed({ params: IdParamsSchema, body: Body }, ({ params, body }, _req, res) => { order.push('handler'); res.json({ id: params.id, name: body.name }); }, {
        before: (params) => { order.push(`before ${params.id} ${typeof params.id}`); },
        upload,
      }));
      const answer = await request(app).post('/things/7').send({ name: 'Cedar' });
      expect(answer.body).toEqual({ id: 7, name: 'Cedar' });
      expect(order).toEqual(['before 7 number', 'upload', 'handler']);
    });

    it('reads no upload when the before step refuses, and checks no body either', async () => {
      order.length = 0;
      const app = appWith(...typed({ params: IdParamsSchema, body: Body }, (_input, _req, res) => { order.push('handler'); res.end(); }, {
        before: async () => { throw Object.assign(new Error('That thing'), { status: 404 }); },
        upload,
      }));
      const answer = await request(app).post('/things/7').send({ name: '' });
      expect(answer.status).toBe(404);
      expect(order).toEqual([]);
    });

    it('checks the body after the upload, so a bad body is a 422 naming the field', async () => {
      order.length = 0;
      const app = appWith(...typed({ params: IdParamsSchema, body: Body }, (_input, _req, res) => { order.push('handler'); res.end(); }, { upload }));
      const answer = await request(app).post('/things/7').send({ name: '' });
      expect(answer.status).toBe(422);
      expect(answer.body).toEqual({ error: 'name the thing', path: ['name'] });
      expect(order).toEqual(['upload']);
    });
  });
});
