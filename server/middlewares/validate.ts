/** Validates body, query and params with the shared zod schemas; the parsed values replace the raw ones. */
import type { NextFunction, Request, Response } from 'express';
import type { ZodType } from 'zod';

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

/** Middleware: parse each part with its schema, or pass the zod error to the error handler (422). */
export function validate(schemas: Schemas) {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (schemas.params) req.params = schemas.params.parse(req.params) as Request['params'];
    if (schemas.query) req.validQuery = schemas.query.parse(req.query);
    if (schemas.body) req.body = schemas.body.parse(req.body ?? {});
    next();
  };
}
