/**
 * A throw-away PostgreSQL cluster on a free loopback port, for tests that stop and start the
 * database (they must not disturb the shared test cluster). Runs as the postgres user when root.
 */
import { execFile, execFileSync } from 'node:child_process';
import { promisify } from 'node:util';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';

const PGBIN = process.env.PGBIN ?? '/usr/lib/postgresql/15/bin';
const isRoot = process.getuid?.() === 0;

/** A free TCP port on 127.0.0.1 (asked from the kernel). */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

const run = promisify(execFile);

/** Runs a PostgreSQL program as the postgres user (as is, when not root); async, so the caller's load goes on. */
async function asPg(cmd: string, args: string[]): Promise<void> {
  if (isRoot) await run('runuser', ['-u', 'postgres', '--', cmd, ...args], { cwd: '/' });
  else await run(cmd, args);
}

export interface ScratchCluster {
  port: number;
  url(database: string): string;
  start(): Promise<void>;
  /** Fast shutdown: open connections are cut, as in a real restart. */
  stop(): Promise<void>;
  destroy(): Promise<void>;
}

/** Initialises a new cluster in a temporary folder and starts it (fsync off: test data only). */
export async function startScratchCluster(): Promise<ScratchCluster> {
  const base = fs.mkdtempSync(path.join(os.tmpdir(), 'browseline-scratch-pg-'));
  const data = path.join(base, 'data');
  fs.mkdirSync(data);
  if (isRoot) {
    fs.chmodSync(base, 0o755);
    execFileSync('chown', ['-R', 'postgres:postgres', base]);
  }
  await asPg(path.join(PGBIN, 'initdb'), ['-D', data, '-U', 'postgres', '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8']);
  const port = await freePort();
  const opts = `-c listen_addresses=127.0.0.1 -p ${port} -k ${base} -c fsync=off -c synchronous_commit=off -c full_page_writes=off`;
  const cluster: ScratchCluster = {
    port,
    url: (database) => `postgres://postgres@127.0.0.1:${port}/${database}`,
    start: () => asPg(path.join(PGBIN, 'pg_ctl'), ['-D', data, '-l', path.join(base, 'server.log'), '-w', '-o', opts, 'start']),
    stop: () => asPg(path.join(PGBIN, 'pg_ctl'), ['-D', data, '-m', 'fast', '-w', 'stop']),
    destroy: async () => {
      await cluster.stop().catch(() => undefined); // already stopped
      fs.rmSync(base, { recursive: true, force: true });
    },
  };
  await cluster.start();
  return cluster;
}
