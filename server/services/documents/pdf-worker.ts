/**
 * The PDF worker: one pdfmake engine per thread, with the fonts read and parsed once (see
 * pdf-engine.ts). It takes a task — a named template with its plain-data input, built here
 * (document-templates.ts), or a packed definition (pdf-functions.ts) — and answers the PDF bytes,
 * moved to the caller without a copy, or the reason the render failed.
 */
import { Piscina } from 'piscina';
import type { TDocumentDefinitions } from 'pdfmake/interfaces';
import { createPdfEngine, renderWithEngine } from './pdf-engine';
import { unpackDefinition } from '../../../templates/documents/kit/pdf-functions';
import { buildDocument, isDocumentTemplateName, type DocumentTemplateName } from './document-templates';
import { FONT_FILES, withDocumentDefaults } from './pdf'; // also registers the named document functions
import { DomainValidationError } from '../../../shared/domain/errors';

/** A render task: a named template and its input (built in the worker), or a packed definition. */
export type PdfTask = { template: DocumentTemplateName; input: unknown } | { packed: unknown };

/** The worker's answer: the PDF bytes, or why the render failed (`field` when the input was refused). */
export type WorkerAnswer = Uint8Array | { ok: false; message: string; field?: string };

let engine: ReturnType<typeof createPdfEngine> | null = null;

/** The complete definition of a task. */
function definitionOf(task: PdfTask): TDocumentDefinitions {
  if ('template' in task) {
    if (!isDocumentTemplateName(task.template)) throw new Error(`there is no document template named "${String(task.template)}"`);
    return withDocumentDefaults(buildDocument(task.template, task.input as never));
  }
  return unpackDefinition(task.packed);
}

/** Renders a task in this thread. Throws DomainValidationError when a template refuses its input. */
export async function renderTaskHere(task: PdfTask): Promise<Buffer> {
  const definition = definitionOf(task);
  engine ??= createPdfEngine(FONT_FILES);
  return renderWithEngine(engine, definition);
}

/** The worker's task: a template or packed definition in, the PDF bytes (moved) or a failure's reason out. */
export async function renderInWorker(task: PdfTask): Promise<WorkerAnswer> {
  try {
    const pdf = await renderTaskHere(task);
    // A fresh ArrayBuffer of exactly the PDF, moved (Buffers may share a pooled one).
    const bytes = new Uint8Array(pdf.length);
    bytes.set(pdf);
    return Piscina.move(bytes) as Uint8Array;
  } catch (error) {
    if (error instanceof DomainValidationError) return { ok: false, message: error.message, field: error.field };
    return { ok: false, message: error instanceof Error ? error.message : String(error) };
  }
}
