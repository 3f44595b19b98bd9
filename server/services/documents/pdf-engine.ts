/**
 * The pdfmake engine of one thread (the PDF worker's, see pdf-worker.ts): our fonts, a locked-down
 * resource policy (no remote URL is ever fetched; the only local files read are our fonts) and two
 * caches that make every document after the first cheap:
 *
 * - fonts are read and parsed once per thread: pdfkit parses a font file (cmap, glyph metrics,
 *   GSUB/GPOS) for every document; here the font bytes stay in memory and fontkit answers the
 *   same parsed font for them again, also when the same bytes are read again from disk (the
 *   plan map's SVG labels name a font file; each document still writes its own subset);
 * - text layout (shaping a word into glyphs and advances) is kept per font across documents;
 *   pdfkit keeps it only within one document, and not at all for runs with OpenType features
 *   such as our tabular figures, which is most of a table.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import pdfmake from 'pdfmake';
import type { TDocumentDefinitions, TFontDictionary } from 'pdfmake/interfaces';

type PdfmakeServer = typeof pdfmake & {
  setLocalAccessPolicy(cb: (path: string) => boolean): void;
  virtualfs: { writeFileSync(name: string, content: Buffer): void; existsSync(name: string): boolean };
};

const requireHere = createRequire(import.meta.url);
const requireFromPdfmake = createRequire(requireHere.resolve('pdfmake'));
const requireFromPdfkit = createRequire(requireFromPdfmake.resolve('pdfkit'));

interface FontkitFont {
  constructor: { probe(buffer: Uint8Array): boolean };
}
interface LayoutRun {
  glyphs: unknown[];
  positions: unknown[];
  advanceWidth: number;
}
interface EmbeddedFontProto {
  font: object;
  layoutRun(text: string, features?: unknown): LayoutRun;
}

/** Parsed fonts by the identity of their bytes (the buffers held in the engine's virtual files). */
const parsedFonts = new Map<Uint8Array, FontkitFont>();
/** The same fonts by byte length, for bytes read again from disk (the SVG map's labels name a font file, which pdfkit reads anew). */
const parsedByLength = new Map<number, { bytes: Uint8Array; font: FontkitFont }[]>();

/** The parsed font of these bytes: the same buffer, or a buffer with the very same bytes. */
function parsedFontOf(bytes: Uint8Array): FontkitFont | undefined {
  const same = parsedFonts.get(bytes);
  if (same) return same;
  for (const entry of parsedByLength.get(bytes.length) ?? []) {
    if (Buffer.compare(Buffer.from(entry.bytes.buffer, entry.bytes.byteOffset, entry.bytes.length), Buffer.from(bytes.buffer, bytes.byteOffset, bytes.length)) === 0) return entry.font;
  }
  return undefined;
}
/** Shaped runs per parsed font: "features\u0000text" → run (bounded). */
const runCache = new WeakMap<object, Map<string, LayoutRun>>();
const MAX_RUNS_PER_FONT = 50_000;
let cachesInstalled = false;

/**
 * Teaches fontkit and pdfkit to reuse parsed fonts and shaped runs. fontkit's `create` tries each
 * font format's `probe` in turn; a format registered here claims the buffers parsed before and
 * answers the parsed font (a constructor may return another object), and the TrueType probe steps
 * aside for them.
 */
function installFontCaches(fontBuffers: Buffer[]): void {
  if (cachesInstalled) return;
  cachesInstalled = true;
  const fontkit = requireFromPdfkit('fontkit') as { create(buffer: Uint8Array): FontkitFont; registerFormat(format: unknown): void };
  for (const buffer of fontBuffers) {
    if (parsedFonts.has(buffer)) continue;
    const font = fontkit.create(buffer);
    const format = font.constructor;
    const probe = format.probe.bind(format);
    if (!(probe as { patched?: boolean }).patched) {
      const guarded = (b: Uint8Array) => !parsedFontOf(b) && probe(b);
      (guarded as { patched?: boolean }).patched = true;
      format.probe = guarded;
    }
    parsedFonts.set(buffer, font);
    const sameLength = parsedByLength.get(buffer.length) ?? [];
    sameLength.push({ bytes: buffer, font });
    parsedByLength.set(buffer.length, sameLength);
  }
  class ParsedFont {
    static probe(buffer: Uint8Array): boolean {
      return parsedFontOf(buffer) !== undefined;
    }
    constructor(stream: { buffer: Uint8Array }) {
      return parsedFontOf(stream.buffer) as object;
    }
  }
  fontkit.registerFormat(ParsedFont);

  // The EmbeddedFont class is not exported: reach its prototype through a document's font.
  const PDFKit = requireFromPdfkit('pdfkit') as new (options?: object) => { font(src: Buffer): { _font: EmbeddedFontProto }; end(): void };
  const probeDoc = new PDFKit({ autoFirstPage: false });
  const embedded = Object.getPrototypeOf(probeDoc.font(fontBuffers[0])._font) as EmbeddedFontProto;
  probeDoc.end();
  const layoutRun = embedded.layoutRun;
  embedded.layoutRun = function cachedLayoutRun(this: EmbeddedFontProto, text: string, features?: unknown) {
    let runs = runCache.get(this.font);
    if (!runs) runCache.set(this.font, (runs = new Map()));
    const key = `${Array.isArray(features) ? features.join(',') : features ? JSON.stringify(features) : ''}\u0000${text}`;
    let run = runs.get(key);
    if (!run) {
      // Runs are read, never changed, by pdfkit (its own per-document cache shares them the same way).
      run = layoutRun.call(this, text, features);
      if (runs.size >= MAX_RUNS_PER_FONT) runs.clear();
      runs.set(key, run);
    }
    return run;
  };
}

/**
 * Our own pdfmake instance, so that no other module can change its fonts or loosen its access
 * policies (the package exports one shared instance; its constructor makes a fresh one). The font
 * files are read once into the engine's virtual files, which pdfmake consults before the disk.
 */
export function createPdfEngine(fonts: TFontDictionary): PdfmakeServer {
  const Engine = (pdfmake as unknown as { constructor: new () => PdfmakeServer }).constructor;
  const engine = new Engine();
  const paths = [...new Set(Object.values(fonts).flatMap((f) => Object.values(f) as string[]))];
  const buffers: Buffer[] = [];
  for (const path of paths) {
    const bytes = readFileSync(path);
    engine.virtualfs.writeFileSync(path, bytes);
    buffers.push(bytes);
  }
  // Read back through the virtual files, so the cache is keyed on the very buffers pdfmake hands out.
  installFontCaches(paths.map((p) => (engine.virtualfs as unknown as { readFileSync(p: string): Buffer }).readFileSync(p)));
  engine.setFonts(structuredClone(fonts));
  engine.setUrlAccessPolicy(() => false); // never fetch: images must be data URLs
  const allowed = new Set(paths);
  engine.setLocalAccessPolicy((path) => allowed.has(path));
  engine.clearTableLayouts();
  return engine;
}

/** Renders a complete definition with an engine, in the calling thread. */
export async function renderWithEngine(engine: PdfmakeServer, definition: TDocumentDefinitions): Promise<Buffer> {
  return (await engine.createPdf(definition).getBuffer()) as Buffer;
}
