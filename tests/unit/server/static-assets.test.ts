import fs from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import express from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { clientAssets, compressAnswers, pickEncoding } from '../../../server/middlewares/static-assets';
import { precompressFolder } from '../../../server/scripts/build/vite-precompress';

let dist: string;
const JS = `export const plan = ${JSON.stringify(Array.from({ length: 400 }, (_, i) => ({ unit: `Unit ${i}`, acres: i * 1.5 })))};\n`;

/** GET over a real socket, the body left as the server encoded it (supertest and fetch would decode it). */
async function raw(a: express.Express, url: string, acceptEncoding: string): Promise<{ status: number; headers: http.IncomingHttpHeaders; body: Buffer }> {
  const server = a.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const { port } = server.address() as AddressInfo;
  try {
    return await new Promise((resolve, reject) => {
      http
        .get({ host: '127.0.0.1', port, path: url, headers: { 'Accept-Encoding': acceptEncoding } }, (res) => {
          const chunks: Buffer[] = [];
          res.on('data', (c: Buffer) => chunks.push(c));
          res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
        })
        .on('error', reject);
    });
  } finally {
    server.close();
  }
}

function app(production: boolean) {
  const a = express();
  a.use(compressAnswers());
  a.get('/api/plan', (_req, res) => {
    res.json({ data: Array.from({ length: 500 }, (_, i) => ({ id: i, name: `Unit ${i}`, kind: 'food-plot', acres: 2.25 })) });
  });
  a.get('/api/precompressed', (_req, res) => {
    res.set('Content-Encoding', 'gzip').type('application/json').send(zlib.gzipSync(JSON.stringify({ data: 'x'.repeat(5000) })));
  });
  a.use(clientAssets(dist, { production }));
  return a;
}

beforeAll(() => {
  dist = fs.mkdtempSync(path.join(os.tmpdir(), 'browseline-dist-'));
  fs.mkdirSync(path.join(dist, 'assets'));
  fs.writeFileSync(path.join(dist, 'index.html'), '<!doctype html><title>Sign in</title>');
  fs.mkdirSync(path.join(dist, 'src'));
  fs.writeFileSync(path.join(dist, 'src/app.html'), '<!doctype html><title>App</title>');
  fs.writeFileSync(path.join(dist, 'sw.js'), 'self.addEventListener("fetch", () => {});');
  fs.writeFileSync(path.join(dist, 'assets/app-abc123.js'), JS);
  fs.writeFileSync(path.join(dist, 'assets/app-abc123.js.map'), '{"version":3}');
  fs.writeFileSync(path.join(dist, 'assets/font-x1.woff2'), Buffer.from([0x77, 0x4f, 0x46, 0x32]));
  expect(precompressFolder(path.join(dist, 'assets'))).toBe(1); // the .js; not the source map or the font
});
afterAll(() => fs.rmSync(dist, { recursive: true, force: true }));

describe('pre-compressed hashed assets', () => {
  it('sends the brotli twin to a browser that accepts it, immutable, and its bytes decode to the file', async () => {
    const res = await raw(app(true), '/assets/app-abc123.js', 'gzip, deflate, br');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['content-type']).toMatch(/javascript/);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(res.headers.vary).toMatch(/Accept-Encoding/);
    expect(zlib.brotliDecompressSync(res.body).toString()).toBe(JS);
    expect((res.body).length).toBeLessThan(JS.length / 4);
  });

  it('sends gzip when brotli is not accepted, and the plain file when nothing is', async () => {
    const gz = await raw(app(true), '/assets/app-abc123.js', 'gzip');
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(zlib.gunzipSync(gz.body).toString()).toBe(JS);
    const plain = await raw(app(true), '/assets/app-abc123.js', 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect((plain.body).toString()).toBe(JS);
  });

  it('answers 404 for a missing asset, never the HTML page', async () => {
    const res = await request(app(true)).get('/assets/app-old999.js');
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/text\/plain/);
    expect(res.text).toMatch(/not part of this version/);
    expect((await request(app(true)).get('/assets/..%2f..%2fetc%2fpasswd')).status).toBe(404);
  });

  it('keeps source maps private in production only', async () => {
    expect((await request(app(true)).get('/assets/app-abc123.js.map')).status).toBe(404);
    expect((await request(app(false)).get('/assets/app-abc123.js.map')).status).toBe(200);
  });
});

describe('pages', () => {
  it('answers the sign-in page at /login and the app elsewhere, both revalidated', async () => {
    const login = await request(app(true)).get('/login?next=%2Ffield');
    expect(login.text).toMatch(/Sign in/);
    expect(login.headers['cache-control']).toBe('no-cache');
    expect(login.headers.etag).toBeTruthy();
    const field = await request(app(true)).get('/field/tasks/3');
    expect(field.text).toMatch(/App/);
    expect(field.headers['cache-control']).toBe('no-cache');
    expect((await request(app(true)).get('/sw.js')).headers['cache-control']).toBe('no-cache');
  });
});

describe('compressed answers', () => {
  it('compresses a large JSON answer with brotli (the 500-unit plan shrinks about tenfold)', async () => {
    const res = await raw(app(true), '/api/plan', 'br, gzip');
    expect(res.headers['content-encoding']).toBe('br');
    const json = zlib.brotliDecompressSync(res.body).toString();
    expect(JSON.parse(json).data).toHaveLength(500);
    expect((res.body).length).toBeLessThan(json.length / 8);
  });

  it('leaves an answer that is already encoded alone (no double compression)', async () => {
    const res = await raw(app(true), '/api/precompressed', 'br, gzip');
    expect(res.headers['content-encoding']).toBe('gzip');
    expect(JSON.parse(zlib.gunzipSync(res.body).toString()).data).toHaveLength(5000);
  });
});

describe('choosing an encoding', () => {
  const all = () => true;
  it('prefers brotli, honours q=0 and what the build wrote (RFC 9110 section 12.5.3)', () => {
    expect(pickEncoding('gzip, deflate, br', all)?.encoding).toBe('br');
    expect(pickEncoding('br;q=0, gzip', all)?.encoding).toBe('gzip');
    expect(pickEncoding('br, gzip', (s) => s === '.gz')?.encoding).toBe('gzip');
    expect(pickEncoding(undefined, all)).toBeNull();
    expect(pickEncoding('identity', all)).toBeNull();
  });
});
