/**
 * Which uploaded files the portal keeps: decided from the bytes, never from the name or the claimed
 * type. Binary documents are recognised by their magic bytes (the caller passes what a sniffer such
 * as `file-type` found); CSV and plain text have no magic bytes, so they are accepted only when the
 * name says .csv/.txt AND the bytes are UTF-8 text with no control characters and nothing a browser
 * could run as markup (HTML, SVG, XML, script).
 */

/** The kinds a shared file may be, with the content type it is served as. */
export const ALLOWED_FILE_KINDS = {
  pdf: { contentType: 'application/pdf', label: 'PDF' },
  png: { contentType: 'image/png', label: 'PNG image' },
  jpg: { contentType: 'image/jpeg', label: 'JPEG image' },
  webp: { contentType: 'image/webp', label: 'WebP image' },
  csv: { contentType: 'text/csv; charset=utf-8', label: 'CSV table' },
  txt: { contentType: 'text/plain; charset=utf-8', label: 'plain text' },
} as const;
export type AllowedFileKind = keyof typeof ALLOWED_FILE_KINDS;

/** What a sniffer found in the first bytes (`file-type`'s answer), or undefined when nothing matched. */
export interface SniffedType {
  ext: string;
  mime: string;
}

export type FileKindDecision = { ok: true; kind: AllowedFileKind; contentType: string; extension: string } | { ok: false; message: string };

/** The sentence every refusal ends with. */
export const ALLOWED_FILES_TEXT = 'Upload a PDF, a PNG, JPEG or WebP image, or a CSV or plain-text (.txt) file.';

const SNIFFED: Record<string, AllowedFileKind> = { pdf: 'pdf', png: 'png', jpg: 'jpg', webp: 'webp' };

/** Text that a browser could treat as markup or script if it were ever served inline. */
const MARKUP = /<\s*(!doctype|html|head|body|script|svg|iframe|object|embed|meta|link|style|\?xml)\b|<!--|javascript:/i;

/** True when the bytes are UTF-8 text without NUL or other control characters (tab, CR and LF allowed). */
export function isPlainUtf8Text(bytes: Uint8Array): boolean {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return false;
  }
  // C0 controls except tab (9), LF (10) and CR (13); DEL (127) and the C1 controls (128–159).
  for (let i = 0; i < text.length; i++) {
    const code = text.charCodeAt(i);
    if ((code < 32 && code !== 9 && code !== 10 && code !== 13) || (code >= 127 && code <= 159)) return false;
  }
  return true;
}

/** The lower-case extension of a file name ("Report.PDF" → "pdf"), or "" without one. */
export function extensionOf(name: string | null | undefined): string {
  const m = /\.([A-Za-z0-9]{1,10})$/.exec(name ?? '');
  return m ? m[1].toLowerCase() : '';
}

/** Decides whether uploaded bytes may be kept, and as what; refusals say what to upload instead. */
export function decideFileKind(bytes: Uint8Array, sniffed: SniffedType | undefined, originalName: string | null | undefined): FileKindDecision {
  if (bytes.length === 0) return { ok: false, message: `The file is empty. ${ALLOWED_FILES_TEXT}` };
  if (sniffed) {
    const kind = SNIFFED[sniffed.ext];
    if (!kind) return { ok: false, message: `This file is a ${sniffed.ext.toUpperCase()} file (${sniffed.mime}), which cannot be shared here. ${ALLOWED_FILES_TEXT}` };
    return { ok: true, kind, contentType: ALLOWED_FILE_KINDS[kind].contentType, extension: kind };
  }
  const ext = extensionOf(originalName);
  if (ext !== 'csv' && ext !== 'txt') {
    return { ok: false, message: `The type of "${originalName ?? 'this file'}" could not be recognised from its content. ${ALLOWED_FILES_TEXT}` };
  }
  if (!isPlainUtf8Text(bytes)) return { ok: false, message: `"${originalName}" is named .${ext} but is not plain UTF-8 text. ${ALLOWED_FILES_TEXT}` };
  const text = new TextDecoder('utf-8').decode(bytes);
  if (MARKUP.test(text)) return { ok: false, message: `"${originalName}" contains web-page markup or script, which cannot be shared. ${ALLOWED_FILES_TEXT}` };
  return { ok: true, kind: ext, contentType: ALLOWED_FILE_KINDS[ext].contentType, extension: ext };
}

/** A safe download name: the title's letters, digits, spaces, dots, dashes and underscores, with the stored extension. */
export function downloadName(title: string, extension: string): string {
  const base = title.normalize('NFKD').replace(/[^\w .-]+/g, '').replace(/\s+/g, ' ').trim().slice(0, 100) || 'file';
  return base.toLowerCase().endsWith(`.${extension}`) ? base : `${base}.${extension}`;
}
