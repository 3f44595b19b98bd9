/**
 * The geo worker pool (piscina): geometry-file imports and GeoTIFF overlays are parsed in worker
 * threads, so a 10 MB KML or a large image never holds up other requests. `GEO_WORKERS` threads
 * (default: cores less one, between 1 and 2); each thread's heap is capped (`GEO_WORKER_HEAP_MB`,
 * default 512) so one upload cannot exhaust the machine; threads run at a lower scheduling priority
 * than the request thread, collect their garbage after each task, and stop when idle.
 */
import { availableParallelism } from 'node:os';
import { Piscina } from 'piscina';
import { AppError } from '../../errors';
import type { ImportAnswer, ImportTask, OverlayAnswer, OverlayTask, TaskFailure } from './geo-worker';

/** How many geo worker threads to run. */
export function geoWorkerCount(env: NodeJS.ProcessEnv = process.env): number {
  const raw = env.GEO_WORKERS;
  if (raw !== undefined && /^\d+$/.test(raw) && Number(raw) > 0) return Math.min(8, Number(raw));
  return Math.max(1, Math.min(2, availableParallelism() - 1));
}

/** The heap cap of one geo worker thread, MB. */
export function geoWorkerHeapMb(env: NodeJS.ProcessEnv = process.env): number {
  const raw = env.GEO_WORKER_HEAP_MB;
  return raw !== undefined && /^\d+$/.test(raw) && Number(raw) >= 64 ? Number(raw) : 512;
}

let pool: Piscina | null = null;

function thePool(): Piscina {
  if (!pool) {
    const threads = geoWorkerCount();
    pool = new Piscina({
      filename: new URL('./geo-worker-boot.mjs', import.meta.url).href,
      minThreads: 1,
      maxThreads: threads,
      idleTimeout: 60_000,
      // Below the request thread in the scheduler: on a busy machine, answering requests comes first.
      niceIncrement: 10,
      // Uploads wait their turn rather than piling up work: a queue of a few per thread.
      maxQueue: threads * 8,
      // geotiff's web-worker shim reads workerData when it loads inside a thread: give it an object.
      workerData: {},
      resourceLimits: { maxOldGenerationSizeMb: geoWorkerHeapMb(), maxYoungGenerationSizeMb: 64 },
    });
    pool.on('error', () => undefined); // a worker that dies is replaced; its task rejects (below)
  }
  return pool;
}

/** Starts a worker now (server start), so the first upload does not wait for one. */
export function warmGeoWorkers(): void {
  thePool();
}

/** Stops the worker threads (tests, shutdown). */
export async function closeGeoWorkers(): Promise<void> {
  const p = pool;
  pool = null;
  await p?.destroy();
}

function asAppError(f: TaskFailure): AppError {
  return new AppError(f.status, f.code, f.message, f.details);
}

async function run<T>(task: unknown, name: string, what: string): Promise<T> {
  try {
    return (await thePool().run(task, { name })) as T;
  } catch (error) {
    const message = (error as Error).message ?? '';
    if (/out of memory|ERR_WORKER_OUT_OF_MEMORY/i.test(message) || (error as { code?: string }).code === 'ERR_WORKER_OUT_OF_MEMORY') {
      throw new AppError(413, 'too-large', `This ${what} needs more memory to read than one upload may use (${geoWorkerHeapMb()} MB). Split it or simplify it, and upload again.`);
    }
    if (/queue is full/i.test(message)) {
      throw new AppError(503, 'service_unavailable', `The server is reading many uploads right now; nothing was saved. Try the ${what} again in a minute.`);
    }
    throw error;
  }
}

/** Read an uploaded geometry file in a worker: the compact preview and the full geometries, as JSON text. */
export async function runGeoImport(task: ImportTask): Promise<Extract<ImportAnswer, { ok: true }>> {
  const answer = await run<ImportAnswer>(task, 'importGeoFile', 'file');
  if (!answer.ok) throw asAppError(answer);
  return answer;
}

/** Check and convert an overlay image in a worker. */
export async function runOverlayPrep(task: OverlayTask): Promise<Extract<OverlayAnswer, { ok: true }>> {
  const answer = await run<OverlayAnswer>(task, 'prepareOverlayImage', 'image');
  if (!answer.ok) throw asAppError(answer);
  return answer;
}
