/** Validates body, query and params with the shared zod schemas; the parsed values replace the raw ones. */
import type { NextFunction, Request, Response } from 'express';
import { ZodError, type ZodType } from 'zod';
import { findUnstorableValue } from '../../shared/schemas/common';

interface Schemas {
  body?: ZodType;
  query?: ZodType;
  params?: ZodType;
}

declare module 'express-serve-static-core' {
  interface Request {
    /** Parsed, validated query (Express 5 makes req.query read-only). */
    validQuery?: unknown;
  }
}

/**
 * Refuses, before any schema, a value no column can store (NUL, lone surrogates, denormal numbers),
 * as a zod error naming its place, so every route answers 422 instead of reaching the database.
 */
export function refuseUnstorable(part: 'body' | 'query' | 'params', value: unknown): void {
  const found = findUnstorableValue(value);
  if (found) throw new ZodError([{ code: 'custom', path: part === 'body' ? found.path : [...found.path], message: found.message, input: undefined }]);
}

/** Middleware: parse each part with its schema, or pass the zod error to the error handler (422). */
export function validate(schemas: Schemas) {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (schemas.params) refuseUnstorable('params', req.params);
    if (schemas.query) refuseUnstorable('query', req.query);
    if (schemas.body) refuseUnstorable('body', req.body);
    if (schemas.params) req.params = schemas.params.parse(req.params) as Request['params'];
    if (schemas.query) req.validQuery = schemas.query.parse(req.query);
    if (schemas.body) req.body = schemas.body.parse(req.body ?? {});
    next();
  };
}
