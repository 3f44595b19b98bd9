/** multer in memory with a size cap; the route checks the content (magic bytes), never the claimed type. */
import multer from 'multer';

/** A single-file upload in field `field`, at most `maxBytes`. */
export function singleUpload(field: string, maxBytes: number) {
  return multer({ storage: multer.memoryStorage(), limits: { fileSize: maxBytes, files: 1, fields: 20 } }).single(field);
}
