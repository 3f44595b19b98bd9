/**
 * Reads an uploaded wind file: small files in this thread, larger ones (a decade of hourly lines)
 * in a one-off worker thread so the event loop keeps answering other requests.
 */
import { Worker } from 'node:worker_threads';
import { HUNTING_LIMITS } from '../../../shared/schemas/hunting';
import type { WindFilter } from '../../../shared/domain/wind-record';
import { roseFromWindText, type WindFileAnswer } from './wind-file-worker';

/** The rose of a wind file within the filter (parsed off the event loop when the file is large). */
export async function readWindFile(text: string, filter: WindFilter): Promise<WindFileAnswer> {
  if (text.length <= HUNTING_LIMITS.windFileInlineBytes) return roseFromWindText(text, filter);
  return new Promise<WindFileAnswer>((resolve, reject) => {
    const worker = new Worker(new URL('./wind-file-worker-boot.mjs', import.meta.url), { workerData: { kind: 'wind-file', text, filter } });
    worker.once('message', (answer: WindFileAnswer) => {
      resolve(answer);
      void worker.terminate();
    });
    worker.once('error', reject);
    worker.once('exit', (code) => {
      if (code !== 0) reject(new Error(`the wind-file worker stopped with code ${code}`));
    });
  });
}
