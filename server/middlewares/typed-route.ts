/**
 * A route handler whose params, body and query are typed by their shared zod schemas. The schemas
 * validate first (as `validate` does: unstorable values and schema failures answer 422), then the
 * handler receives the parsed values, so a route never writes `Number(req.params.id)` or a cast.
 *
 *   r.patch('/:id', STAFF, ...typed({ params: IdParamsSchema, body: UnitUpdateSchema }, async ({ params, body }, req, res) => {
 *     res.json({ data: presentUnit(await updateUnit(actor(req), params.id, body, req.ip ?? null)) });
 *   }));
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

/** The validating middleware and the handler that reads the parsed parts; spread into `r.get(...)` etc. */
export function typed<S extends Schemas>(
  schemas: S,
  handler: (input: Parsed<S>, req: Request, res: Response, next: NextFunction) => unknown,
): [RequestHandler, RequestHandler] {
  return [
    validate(schemas),
    (req, res, next) => {
      const input = { params: req.params, body: req.body, query: req.validQuery } as Parsed<S>;
      return Promise.resolve(handler(input, req, res, next)).catch(next);
    },
  ];
}
