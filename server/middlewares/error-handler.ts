/** The one error middleware: maps known errors to JSON answers and never leaks internals. */
import type { NextFunction, Request, Response } from 'express';
import { ZodError } from 'zod';
import { MulterError } from 'multer';
import { BaseError, UniqueConstraintError, ValidationError as SequelizeValidationError, ForeignKeyConstraintError, DatabaseError } from 'sequelize';
import { AppError } from '../errors';
import { DomainValidationError } from '../../shared/domain/errors';
import { logger } from '../logger';
import { isDatabaseOutage, sqlState } from '../db/outage';

/** Values PostgreSQL refused that validation should have caught: a 422, never a 500 (SQLSTATE, PostgreSQL appendix A). */
const REFUSED_VALUE_STATES: Record<string, string> = {
  '22001': 'a text is longer than allowed',
  '22003': 'a number is out of range',
  '22007': 'a date or time is not valid',
  '22008': 'a date or time is out of range',
  '22021': 'a text holds characters that cannot be stored',
  '22P02': 'a value has the wrong type',
  '22P05': 'a text holds characters that cannot be stored',
  '23502': 'a required value is missing',
  '23514': 'a value is outside what is allowed',
};

interface Answer {
  status: number;
  body: { error: string; code: string; details?: unknown };
}

/** A person-readable sentence from zod issues: "name: enter the person’s name; email: …". */
export function describeZodError(err: ZodError): { message: string; details: { path: string; message: string }[] } {
  const details = err.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
  const first = details.slice(0, 3).map((d) => (d.path ? `${d.path}: ${d.message}` : d.message));
  const more = details.length > 3 ? ` (and ${details.length - 3} more)` : '';
  return { message: `Please correct the form — ${first.join('; ')}${more}.`, details };
}

function toAnswer(err: unknown): Answer {
  if (isDatabaseOutage(err)) {
    return { status: 503, body: { error: 'The database is not reachable right now, so nothing was saved. Try again in a moment.', code: 'database_unavailable' } };
  }
  if (err instanceof AppError) return { status: err.status, body: { error: err.message, code: err.code, details: err.details } };
  if (err instanceof ZodError) {
    const { message, details } = describeZodError(err);
    return { status: 422, body: { error: message, code: 'validation', details } };
  }
  if (err instanceof DomainValidationError) {
    return { status: 422, body: { error: `${err.field}: ${err.message}`, code: 'validation', details: [{ path: err.field, message: err.message }] } };
  }
  if (err instanceof MulterError) {
    if (err.code === 'LIMIT_FILE_SIZE') return { status: 413, body: { error: 'That file is too large. Check the size limit and try a smaller file.', code: 'payload_too_large' } };
    return { status: 400, body: { error: `The upload was not accepted: ${err.message}.`, code: 'upload' } };
  }
  // multer marks the errors of the multipart parser (a body cut off, a malformed part) with storageErrors.
  if (err && typeof err === 'object' && Array.isArray((err as { storageErrors?: unknown }).storageErrors)) {
    return { status: 400, body: { error: 'The upload arrived incomplete or malformed. Send the form again.', code: 'upload' } };
  }
  if (err instanceof UniqueConstraintError) {
    const fields = Object.keys(err.fields ?? {}).join(', ');
    return { status: 409, body: { error: `A record with that ${fields || 'value'} already exists.`, code: 'conflict' } };
  }
  if (err instanceof ForeignKeyConstraintError) {
    return { status: 409, body: { error: 'That record is linked to another one that does not exist or still uses it.', code: 'conflict' } };
  }
  if (err instanceof SequelizeValidationError) {
    return { status: 422, body: { error: err.errors.map((e) => e.message).join('; '), code: 'validation' } };
  }
  const e = err as { type?: string; status?: number; statusCode?: number; expose?: boolean; message?: string };
  if (err instanceof URIError) {
    return { status: 400, body: { error: 'The address holds characters that are not valid (a broken %-escape). Check the link.', code: 'bad_request' } };
  }
  if (e && e.type === 'entity.parse.failed') {
    return { status: 400, body: { error: 'The request body is not valid JSON. Check for a missing quote, comma or brace.', code: 'malformed_json' } };
  }
  if (e && e.type === 'entity.too.large') {
    return { status: 413, body: { error: 'The request is too large. Send less data at once.', code: 'payload_too_large' } };
  }
  if (e && typeof e.status === 'number' && e.status >= 400 && e.status < 500 && e.expose) {
    return { status: e.status, body: { error: e.message ?? 'The request was not accepted.', code: 'bad_request' } };
  }
  const state = sqlState(err);
  if (state && REFUSED_VALUE_STATES[state]) {
    return { status: 422, body: { error: `The values were not accepted: ${REFUSED_VALUE_STATES[state]}. Check the form and try again.`, code: 'validation' } };
  }
  if (state === '40001' || state === '40P01') {
    return { status: 503, body: { error: 'Another change to the same records got in the way, so nothing was saved. Try again.', code: 'retry' } };
  }
  if (err instanceof DatabaseError || err instanceof BaseError) {
    return { status: 500, body: { error: 'Something went wrong on our side. Your data is unchanged; please try again.', code: 'internal' } };
  }
  return { status: 500, body: { error: 'Something went wrong on our side. Your data is unchanged; please try again.', code: 'internal' } };
}

/** Express error middleware (register last). */
export function errorHandler(err: unknown, req: Request, res: Response, next: NextFunction) {
  if (res.headersSent) return next(err);
  const answer = toAnswer(err);
  if (answer.status === 503) logger.warn({ err: (err as Error)?.message, path: req.path, method: req.method }, 'service unavailable');
  else if (answer.status >= 500) logger.error({ err, path: req.path, method: req.method }, 'unhandled error');
  else if (sqlState(err)) logger.warn({ err: (err as Error)?.message, path: req.path, method: req.method }, 'database refused a value that validation let through');
  if (answer.status === 503) res.setHeader('Retry-After', '5');
  res.status(answer.status).json(answer.body);
}
