/** multer in memory with a size cap; the route checks the content (magic bytes), never the claimed type. */
import multer from 'multer';
import type { RequestHandler } from 'express';
import { badRequest, payloadTooLarge } from '../errors';

/** A single-file upload in field `field`, at most `maxBytes`; with `what`, a file over the size answers 413 naming the limit. */
export function singleUpload(field: string, maxBytes: number, what?: string): RequestHandler {
  const inner = multer({ storage: multer.memoryStorage(), limits: { fileSize: maxBytes, files: 1, fields: 20 } }).single(field);
  if (!what) return inner;
  return (req, res, next) =>
    inner(req, res, (err?: unknown) => {
      if (err instanceof multer.MulterError && err.code === 'LIMIT_FILE_SIZE') {
        return next(payloadTooLarge(`The ${what} is larger than ${Math.round(maxBytes / 1024 / 1024)} MB, the most one upload may be. Split it or export a smaller one.`));
      }
      next(err);
    });
}

/** Up to `maxCount` files in field `field`, each at most `maxBytes`; limit breaches answer with the limit in words. */
export function arrayUpload(field: string, maxBytes: number, maxCount: number, what = 'file'): RequestHandler {
  const inner = multer({ storage: multer.memoryStorage(), limits: { fileSize: maxBytes, files: maxCount, fields: 30 } }).array(field, maxCount);
  return (req, res, next) =>
    inner(req, res, (err?: unknown) => {
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(payloadTooLarge(`A ${what} is larger than ${Math.round(maxBytes / 1024 / 1024)} MB. Send a smaller one (most phones can share a reduced size).`));
        if (err.code === 'LIMIT_FILE_COUNT' || err.code === 'LIMIT_UNEXPECTED_FILE') return next(badRequest(`Send at most ${maxCount} ${what}s in the "${field}" field.`));
      }
      next(err);
    });
}
