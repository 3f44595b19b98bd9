/**
 * Browseline's PDF engine: pdfmake 0.3 on the server with our shipped fonts, a locked-down
 * resource policy (no remote URL is ever fetched; the only local files read are our fonts). The
 * look and the document definitions live in templates/documents (kit/ and one file per document);
 * this module renders them. Fonts come from the .woff files of @fontsource (latin subset; see fonts.ts).
 */
import type { TDocumentDefinitions, TFontDictionary } from 'pdfmake/interfaces';
import { packDefinition } from '../../../templates/documents/kit/pdf-functions';
import { FONT_BODY, FONT_HEADING, withDocumentDefaults } from '../../../templates/documents/kit/layout'; // also registers the named document functions
import { documentFontFiles } from './fonts';

export * from '../../../templates/documents/kit/layout';

/** Thrown when a document cannot be rendered; the message says what to change. */
export class DocumentRenderError extends Error {
  readonly code = 'document-render-failed';
  constructor(message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = 'DocumentRenderError';
  }
}

const fontFiles = documentFontFiles();

/** Paths of the font files (TrueType unwrapped from @fontsource's .woff), the only local files read. */
export const FONT_FILES = {
  [FONT_HEADING]: fontFiles.heading,
  [FONT_BODY]: fontFiles.body,
} satisfies TFontDictionary;

/** The sentence a render failure answers with. */
export function renderFailure(reason: string, cause?: unknown): DocumentRenderError {
  return new DocumentRenderError(
    `The PDF could not be rendered: ${reason}. Images must be embedded as data URLs, fonts must be ${FONT_HEADING} or ${FONT_BODY}, and SVG must be well-formed.`,
    { cause },
  );
}

/**
 * Renders a document definition to PDF bytes in a worker thread (server/services/documents/pdf-pool.ts),
 * so the event loop never waits on layout. The definition is consumed: build a fresh one for every
 * render. Styles and the default style of the shared look are filled in where it does not set them.
 * Functions in it must be table layouts or made with `pdfFunction` (see pdf-functions.ts).
 */
export async function renderPdf(docDefinition: TDocumentDefinitions): Promise<Buffer> {
  let packed: unknown;
  try {
    packed = packDefinition(withDocumentDefaults(docDefinition));
  } catch (error) {
    throw renderFailure(error instanceof Error ? error.message : String(error), error);
  }
  const { renderPacked } = await import('./pdf-pool');
  return renderPacked(packed);
}
