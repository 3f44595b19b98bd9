/**
 * A route handler whose params, body and query are typed by their shared zod schemas. The schemas
 * validate first (as `validate` does: unstorable values and schema failures answer 422), then the
 * handler receives the parsed values, so a route never writes `Number(req.params.id)` or a cast.
 *
 *   r.patch('/:id', STAFF, ...typed({ params: IdParamsSchema, body: UnitUpdateSchema }, async ({ params, body }, req, res) => {
 *     res.json({ data: presentUnit(await updateUnit(actor(req), params.id, body, req.ip ?? null)) });
 *   }));
 *
 * A multipart route passes its upload as a step, after the params and before the body:
 *
 *   ...typed({ params: IdParamsSchema, body: PhotoNoteSchema }, handler, { before: (params, req) => refuseOthers(params.id, req), upload })
 */
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { z, ZodType } from 'zod';
import { validate } from './validate';

interface Schemas {
  params?: ZodType;
  body?: ZodType;
  query?: ZodType;
}

type Out<S> = S extends ZodType ? z.output<S> : undefined;

/** The parsed parts a typed handler receives. */
export interface Parsed<S extends Schemas> {
  params: Out<S['params']>;
  body: Out<S['body']>;
  query: Out<S['query']>;
}

/**
 * Steps between the params and the body, for a multipart route: `before` runs once the params are
 * parsed (refuse another firm's record, a missing key…) so nothing is read for a request that will
 * be refused; `upload` then reads the files; the body and query are validated after it.
 */
export interface TypedSteps<S extends Schemas> {
  before?: (params: Out<S['params']>, req: Request) => unknown;
  upload?: RequestHandler;
}

/** The validating middleware and the handler that reads the parsed parts; spread into `r.get(...)` etc. */
export function typed<S extends Schemas>(
  schemas: S,
  handler: (input: Parsed<S>, req: Request, res: Response, next: NextFunction) => unknown,
  steps?: TypedSteps<S>,
): RequestHandler[] {
  const run: RequestHandler = (req, res, next) => {
    const input = { params: req.params, body: req.body, query: req.validQuery } as Parsed<S>;
    return Promise.resolve(handler(input, req, res, next)).catch(next);
  };
  if (!steps) return [validate(schemas), run];
  const { params, ...rest } = schemas;
  const before: RequestHandler = (req, _res, next) => {
    Promise.resolve(steps.before?.(req.params as Out<S['params']>, req)).then(() => next(), next);
  };
  return [validate({ params }), before, ...(steps.upload ? [steps.upload] : []), validate(rest), run];
}
