/**
 * The PDF worker: one pdfmake engine per thread, with the fonts read and parsed once (see
 * pdf-engine.ts). It takes a packed definition (pdf-functions.ts) and answers the PDF bytes, moved
 * to the caller without a copy, or the reason the render failed.
 */
import { Piscina } from 'piscina';
import { createPdfEngine, renderWithEngine } from './pdf-engine';
import { unpackDefinition } from '../../../templates/documents/kit/pdf-functions';
import { FONT_FILES } from './pdf'; // also registers the named document functions

/** The worker's answer: the PDF bytes, or why the render failed. */
export type WorkerAnswer = Uint8Array | { ok: false; message: string };

let engine: ReturnType<typeof createPdfEngine> | null = null;

/** Renders a packed definition in this thread. */
export async function renderPackedHere(packed: unknown): Promise<Buffer> {
  engine ??= createPdfEngine(FONT_FILES);
  return renderWithEngine(engine, unpackDefinition(packed));
}

/** The worker's task: a packed definition in, the PDF bytes (moved) or a failure's reason out. */
export async function renderInWorker(packed: unknown): Promise<WorkerAnswer> {
  try {
    const pdf = await renderPackedHere(packed);
    // A fresh ArrayBuffer of exactly the PDF, moved (Buffers may share a pooled one).
    const bytes = new Uint8Array(pdf.length);
    bytes.set(pdf);
    return Piscina.move(bytes) as Uint8Array;
  } catch (error) {
    return { ok: false, message: error instanceof Error ? error.message : String(error) };
  }
}
