/**
 * Browser journeys: a fresh database with the demo data (named for this run, dropped at the end), the local SMTP capture server and the real
 * server (production mode, serving the built client) on free loopback ports.
 */
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { dropDatabase, freshDatabase, startTestCluster } from './test-db';
import { startSmtpCapture } from '../../server/scripts/smtp-capture';

const root = path.resolve(import.meta.dirname, '../..');
const tsx = path.join(root, 'node_modules/.bin/tsx');

/** A free TCP port on loopback. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });
}

async function waitForHealth(url: string, child: ChildProcess, log: () => string): Promise<void> {
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`server exited early:\n${log()}`);
    try {
      const res = await fetch(`${url}/api/health`);
      if (res.ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`server did not become healthy:\n${log()}`);
}

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
    mailUrl: string;
    paymentsUrl: string;
  }
}

export default async function setup(project: TestProject) {
  if (!fs.existsSync(path.join(root, 'dist/index.html'))) {
    execFileSync(path.join(root, 'node_modules/.bin/vite'), ['build', '--logLevel', 'warn'], { cwd: root, stdio: 'inherit' });
  }
  startTestCluster();
  const databaseUrl = await freshDatabase('browseline_e2e');
  const capture = await startSmtpCapture({ smtpPort: 0, httpPort: 0, quiet: true });
  const port = await freePort();
  const paymentsPort = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const env = {
    ...process.env,
    NODE_ENV: 'test',
    VITEST: '',
    LOG_LEVEL: 'warn',
    DATABASE_URL: databaseUrl,
    PORT: String(port),
    PUBLIC_URL: baseUrl,
    SMTP_PORT: String(capture.smtpPort),
    MAIL_CAPTURE_URL: `http://127.0.0.1:${capture.httpPort}`,
    PAYMENTS_FAKE_PORT: String(paymentsPort),
    PAYMENTS_WEBHOOK_URL: `${baseUrl}/api/webhooks/payments`,
    OUTBOX_POLL_MS: '300',
  };
  execFileSync(tsx, [path.join(root, 'server/scripts/seed-demo.ts')], { cwd: root, env, stdio: ['ignore', 'ignore', 'inherit'] });

  let output = '';
  const children: ChildProcess[] = [];
  const fake = spawn(tsx, [path.join(root, 'server/scripts/payments-fake/main.ts')], { cwd: root, env, stdio: ['ignore', 'pipe', 'pipe'] });
  fake.stderr?.on('data', (d) => (output += d));
  children.push(fake);
  const server = spawn(tsx, [path.join(root, 'server/index.ts')], { cwd: root, env: { ...env, NODE_ENV: 'production' }, stdio: ['ignore', 'pipe', 'pipe'] });
  server.stdout?.on('data', (d) => (output += d));
  server.stderr?.on('data', (d) => (output += d));
  children.push(server);
  await waitForHealth(baseUrl, server, () => output);

  project.provide('baseUrl', baseUrl);
  project.provide('mailUrl', `http://127.0.0.1:${capture.httpPort}`);
  project.provide('paymentsUrl', `http://127.0.0.1:${paymentsPort}`);

  return async () => {
    for (const child of children) child.kill('SIGTERM');
    await Promise.all(children.map((c) => (c.exitCode !== null ? Promise.resolve() : new Promise((r) => c.once('exit', r)))));
    await capture.close();
    await dropDatabase(databaseUrl);
  };
}
