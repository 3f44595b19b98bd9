/**
 * The real server (`server/index.ts`) as a separate process on a free port, for tests that run
 * several instances side by side, and a small cookie-jar client that can talk to any of them.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import http from 'node:http';
import net from 'node:net';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '../..');

/** A free TCP port on 127.0.0.1. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

export interface AppProcess {
  name: string;
  url: string;
  child: ChildProcess;
  /** Everything the process wrote, for failure messages. */
  output: string[];
  /** Resolves with the exit code when the process ends. */
  exited: Promise<number | null>;
}

/** Starts `node --import tsx server/index.ts` with the given environment and waits until its health answers 200. */
export async function startAppProcess(name: string, env: Record<string, string>): Promise<AppProcess> {
  return startProcess(name, 'server/index.ts', env);
}

/** Starts the job worker alone (`server/worker.ts`, what `npm run worker` runs) and waits until it takes jobs. */
export async function startWorkerProcess(name: string, env: Record<string, string>): Promise<AppProcess> {
  return startProcess(name, 'server/worker.ts', { ...env, LOG_LEVEL: 'info' });
}

async function startProcess(name: string, script: string, env: Record<string, string>): Promise<AppProcess> {
  const port = await freePort();
  const output: string[] = [];
  const childEnv: NodeJS.ProcessEnv = { ...process.env, ...env, PORT: String(port), HOST: '127.0.0.1' };
  delete childEnv.VITEST;
  delete childEnv.VITEST_POOL_ID;
  delete childEnv.VITEST_WORKER_ID;
  // node itself with tsx's loader (not the tsx wrapper), so signals reach the server and nothing outlives a kill.
  const child = spawn(process.execPath, ['--import', 'tsx', path.join(root, script)], { cwd: root, env: childEnv, stdio: ['ignore', 'pipe', 'pipe'] });
  child.stdout!.on('data', (d: Buffer) => output.push(d.toString()));
  child.stderr!.on('data', (d: Buffer) => output.push(d.toString()));
  const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
  const url = `http://127.0.0.1:${port}`;
  let ended = false;
  void exited.then(() => (ended = true));
  for (;;) {
    if (ended) throw new Error(`${name} exited before it was ready:\n${output.join('')}`);
    const ok = script.endsWith('worker.ts') ? output.join('').includes('job worker is running') : await fetch(`${url}/api/health`).then((r) => r.status === 200, () => false);
    if (ok) break;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  return { name, url, child, output, exited };
}

/** Stops a process if it still runs (by its own PID). */
export async function stopAppProcess(app: AppProcess | undefined): Promise<void> {
  if (!app || app.child.exitCode !== null || app.child.signalCode !== null) return;
  app.child.kill('SIGKILL');
  await app.exited;
}

/** One browser's cookies and CSRF token, used against any instance. */
export class CookieJar {
  private cookies = new Map<string, string>();
  csrf = '';

  header(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  take(res: Response): void {
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const eq = pair.indexOf('=');
      this.cookies.set(pair.slice(0, eq).trim(), pair.slice(eq + 1).trim());
    }
  }

  /** A request to an instance with this jar's cookies (and CSRF token on writes). */
  async fetch(base: string, pathname: string, init: RequestInit = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    if (this.cookies.size) headers.set('Cookie', this.header());
    if (init.method && init.method !== 'GET' && this.csrf) headers.set('X-CSRF-Token', this.csrf);
    if (typeof init.body === 'string' && !headers.has('Content-Type')) headers.set('Content-Type', 'application/json');
    const res = await fetch(`${base}${pathname}`, { ...init, headers });
    this.take(res);
    return res;
  }
}

/**
 * Starts a multipart upload with `Expect: 100-continue` and resolves once the server has read its
 * headers (the request is then in flight); `finish()` sends the body and answers status and JSON.
 */
export function startUpload(base: string, pathname: string, jar: CookieJar, fields: Record<string, string>, file: { name: string; bytes: Buffer; type: string }): Promise<{ finish(): Promise<{ status: number; body: { data?: { id: number; url: string } } }> }> {
  const boundary = `----browseline${Math.random().toString(16).slice(2)}`;
  const parts: Buffer[] = [];
  for (const [k, v] of Object.entries(fields)) parts.push(Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="${k}"\r\n\r\n${v}\r\n`));
  parts.push(Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${file.name}"\r\nContent-Type: ${file.type}\r\n\r\n`), file.bytes, Buffer.from(`\r\n--${boundary}--\r\n`));
  const body = Buffer.concat(parts);
  const url = new URL(pathname, base);
  return new Promise((resolveStarted, rejectStarted) => {
    const answer = new Promise<{ status: number; body: { data?: { id: number; url: string } } }>((resolve, reject) => {
      const req = http.request(
        { host: url.hostname, port: url.port, path: url.pathname, method: 'POST', agent: false, headers: { Cookie: jar.header(), 'X-CSRF-Token': jar.csrf, 'Content-Type': `multipart/form-data; boundary=${boundary}`, 'Content-Length': body.length, Expect: '100-continue' } },
        (res) => {
          const chunks: Buffer[] = [];
          res.on('data', (c: Buffer) => chunks.push(c));
          res.on('end', () => resolve({ status: res.statusCode ?? 0, body: JSON.parse(Buffer.concat(chunks).toString() || '{}') }));
          res.on('error', reject);
        },
      );
      req.on('error', (err) => {
        reject(err);
        rejectStarted(err);
      });
      req.on('continue', () => resolveStarted({ finish: () => (req.end(body), answer) }));
    });
    answer.catch(() => undefined);
  });
}
