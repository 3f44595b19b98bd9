/**
 * JSON answers compressed once and sent many times: a cached answer keeps its identity, gzip and
 * brotli bytes, and each request gets the encoding it accepts, with Content-Encoding and Vary set
 * here (so a compression middleware further out leaves it alone).
 */
import { promisify } from 'node:util';
import { brotliCompress, constants, gzip } from 'node:zlib';
import type { Request, Response } from 'express';

const gzipAsync = promisify(gzip);
const brotliAsync = promisify(brotliCompress);

/** One answer in the encodings a browser may ask for. */
export interface Precompressed {
  identity: Buffer;
  gzip: Buffer;
  br: Buffer;
}

/**
 * Compresses a body in the libuv thread pool (the event loop does not wait): gzip level 6,
 * brotli quality 5 (close to gzip's speed, smaller; quality 11 takes seconds on a large plan).
 */
export async function precompress(identity: Buffer): Promise<Precompressed> {
  const [gz, br] = await Promise.all([
    gzipAsync(identity, { level: 6 }),
    brotliAsync(identity, { params: { [constants.BROTLI_PARAM_QUALITY]: 5, [constants.BROTLI_PARAM_MODE]: constants.BROTLI_MODE_TEXT, [constants.BROTLI_PARAM_SIZE_HINT]: identity.length } }),
  ]);
  return { identity, gzip: gz, br };
}

/** Sends a precompressed JSON answer in the best encoding the request accepts (br, gzip, or none). */
export function sendPrecompressed(req: Request, res: Response, body: Precompressed): void {
  // Brotli when acceptable at all (smaller), then gzip; browsers list gzip first with equal weight.
  const encoding = req.acceptsEncodings('br') === 'br' ? 'br' : req.acceptsEncodings('gzip') === 'gzip' ? 'gzip' : 'identity';
  const bytes = encoding === 'br' ? body.br : encoding === 'gzip' ? body.gzip : body.identity;
  res.vary('Accept-Encoding');
  res.type('application/json');
  if (encoding === 'br' || encoding === 'gzip') res.setHeader('Content-Encoding', encoding);
  res.setHeader('Content-Length', bytes.length);
  res.end(req.method === 'HEAD' ? undefined : bytes);
}

/** True when an If-None-Match header names the ETag (a list, weak or not, or "*"). */
export function etagMatches(header: string | undefined, etag: string): boolean {
  if (!header) return false;
  const bare = (tag: string) => tag.trim().replace(/^W\//, '');
  return header.split(',').some((tag) => tag.trim() === '*' || bare(tag) === bare(etag));
}
