/**
 * The pool of PDF worker threads (piscina): `PDF_WORKERS` threads (default: the machine's cores
 * less one, at least one, at most four), started on first use or by `warmPdfWorkers()`, so that
 * laying out a document never blocks the event loop. `PDF_WORKERS=0` renders in the calling thread
 * (for debugging only).
 */
import { availableParallelism } from 'node:os';
import { Piscina } from 'piscina';
import { renderFailure } from './pdf';
import type { PdfTask, WorkerAnswer } from './pdf-worker';
import type { DocumentTemplateInput, DocumentTemplateName } from './document-templates';
import { DomainValidationError } from '../../../shared/domain/errors';

/** How many PDF worker threads to run. */
export function pdfWorkerCount(env: NodeJS.ProcessEnv = process.env): number {
  const raw = env.PDF_WORKERS;
  if (raw !== undefined && raw !== '' && /^\d+$/.test(raw)) return Math.min(16, Number(raw));
  return Math.max(1, Math.min(4, availableParallelism() - 1));
}

let pool: Piscina | null = null;

function thePool(): Piscina {
  const threads = pdfWorkerCount();
  pool ??= new Piscina({
    filename: new URL('./pdf-worker-boot.mjs', import.meta.url).href,
    minThreads: threads,
    maxThreads: threads,
    // A document waits its turn rather than starting more threads than the machine has cores.
    idleTimeout: 10 * 60_000,
  });
  return pool;
}

/** Starts the worker threads now (server start), so the first PDF does not wait for them. */
export function warmPdfWorkers(): void {
  if (pdfWorkerCount() > 0) thePool();
}

/** Resolves when a worker has started and rendered a one-line document (tests' set-up, readiness). */
export async function pdfWorkersReady(): Promise<void> {
  const { renderPdf } = await import('./pdf');
  await renderPdf({ content: ['ready'] });
}

/**
 * Renders a task in a worker thread: a named template with its input (the definition is built in
 * the worker) or a packed definition (pdf-functions.ts). A template's refusal of its input comes
 * back as the same DomainValidationError (field and sentence); any other failure as a
 * DocumentRenderError.
 */
export async function runPdfTask(task: PdfTask): Promise<Buffer> {
  if (pdfWorkerCount() === 0) {
    const { renderTaskHere } = await import('./pdf-worker');
    try {
      return await renderTaskHere(task);
    } catch (error) {
      if (error instanceof DomainValidationError) throw error;
      throw renderFailure(error instanceof Error ? error.message : String(error), error);
    }
  }
  let answer: WorkerAnswer;
  try {
    answer = (await thePool().run(task)) as WorkerAnswer;
  } catch (error) {
    throw renderFailure(`the PDF worker stopped (${error instanceof Error ? error.message : String(error)})`, error);
  }
  if (!(answer instanceof Uint8Array)) {
    if (answer.field !== undefined) throw new DomainValidationError(answer.field, answer.message);
    throw renderFailure(answer.message);
  }
  return Buffer.from(answer.buffer, answer.byteOffset, answer.byteLength);
}

/** Renders a packed definition (pdf-functions.ts) in a worker thread. */
export async function renderPacked(packed: unknown): Promise<Buffer> {
  return runPdfTask({ packed });
}

/**
 * Renders a named document template in a worker thread: only its plain-data input crosses over;
 * the definition (map SVG, tables) is built and laid out there, off the request thread.
 */
export async function renderTemplate<N extends DocumentTemplateName>(name: N, input: DocumentTemplateInput<N>): Promise<Buffer> {
  return runPdfTask({ template: name, input });
}

/** Threads running and documents rendered by the pool so far (tests, diagnostics). */
export function pdfWorkerStats(): { threads: number; completed: number } {
  return { threads: pool?.threads.length ?? 0, completed: pool?.completed ?? 0 };
}

/** Stops the worker threads (shutdown and tests). */
export async function closePdfWorkers(): Promise<void> {
  const p = pool;
  pool = null;
  if (p) await p.destroy();
}
