/** Small helpers for benchmarks: timing, medians, a bounded HTTP load loop on loopback. */
import http from 'node:http';
import { performance } from 'node:perf_hooks';

/** Median of numbers. */
export function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const mid = Math.floor(s.length / 2);
  return s.length % 2 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
}

/** Percentile (0–100) by nearest rank. */
export function percentile(values: number[], p: number): number {
  const s = [...values].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil((p / 100) * s.length) - 1))];
}

/** Waits until the server at `base` answers GET /api/health (at most 30 s; a bench then fails on its first request). */
export async function waitForHealth(base: string): Promise<void> {
  for (let i = 0; i < 150; i++) {
    try {
      if ((await fetch(`${base}/api/health`)).ok) return;
    } catch {
      /* starting */
    }
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** Runs fn `runs` times after `warmup` runs; answers the durations in ms. */
export async function timeRuns(fn: () => unknown | Promise<unknown>, runs: number, warmup = 1): Promise<number[]> {
  for (let i = 0; i < warmup; i++) await fn();
  const out: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    await fn();
    out.push(performance.now() - t0);
  }
  return out;
}

/**
 * Keeps `connections` requests in flight against a loopback URL for `durationMs` (and at most
 * `maxRequests`); answers completed requests per second and latency percentiles. Requests go over
 * keep-alive connections through node:http, which reads the body's bytes as sent and does not
 * decompress them (as a load tool does): decompressing is the phone's work, and here it would take
 * CPU from the server being measured on the same machine.
 */
export async function load(url: string, opts: { connections: number; durationMs: number; maxRequests: number; headers?: Record<string, string>; expectStatus?: number }) {
  if (!/^http:\/\/127\.0\.0\.1:/.test(url)) throw new Error('benchmarks only target 127.0.0.1');
  const agent = new http.Agent({ keepAlive: true, maxSockets: opts.connections });
  const get = () =>
    new Promise<number>((resolve, reject) => {
      const req = http.get(url, { agent, headers: opts.headers }, (res) => {
        res.on('data', () => undefined);
        res.on('end', () => resolve(res.statusCode ?? 0));
        res.on('error', reject);
      });
      req.on('error', reject);
    });
  const latencies: number[] = [];
  let done = 0;
  let failed = 0;
  const stopAt = performance.now() + opts.durationMs;
  const worker = async () => {
    while (performance.now() < stopAt && done + failed < opts.maxRequests) {
      const t0 = performance.now();
      const status = await get().catch(() => 0);
      if (status === (opts.expectStatus ?? 200)) done++;
      else failed++;
      latencies.push(performance.now() - t0);
    }
  };
  const t0 = performance.now();
  await Promise.all(Array.from({ length: opts.connections }, worker));
  const seconds = (performance.now() - t0) / 1000;
  agent.destroy();
  return { rps: done / seconds, done, failed, p50: percentile(latencies, 50), p95: percentile(latencies, 95) };
}
