/**
 * The pixel size of a HEIC/HEIF photo from its header boxes alone (nothing decoded), so a limit on
 * pixels is checked before any work on the image. The file is a sequence of ISO base media boxes
 * (ISO/IEC 14496-12 §4.2: 32-bit size, 4-character type, 64-bit size when size is 1); the item
 * properties sit in meta → iprp → ipco, and each 'ispe' property (ISO/IEC 23008-12 §6.5.3) holds an
 * image's width and height after a 4-byte version/flags field. A photo stored as a grid of tiles has
 * one ispe for the whole picture and one per tile size, so the largest is the picture's.
 */
export interface HeifSize {
  width: number;
  height: number;
}

interface Box {
  type: string;
  start: number;
  end: number;
}

function* boxes(view: DataView, from: number, to: number): Generator<Box> {
  let at = from;
  while (at + 8 <= to) {
    let size = view.getUint32(at);
    const type = String.fromCharCode(view.getUint8(at + 4), view.getUint8(at + 5), view.getUint8(at + 6), view.getUint8(at + 7));
    let header = 8;
    if (size === 1) {
      if (at + 16 > to) return;
      size = Number(view.getBigUint64(at + 8));
      header = 16;
    } else if (size === 0) {
      size = to - at;
    }
    if (size < header || at + size > to) return;
    yield { type, start: at + header, end: at + size };
    at += size;
  }
}

/** The largest ispe width × height of a HEIF file, or null when the header holds none (or is cut short). */
export function readHeifSize(bytes: Uint8Array): HeifSize | null {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  let best: HeifSize | null = null;
  for (const meta of boxes(view, 0, bytes.length)) {
    if (meta.type !== 'meta') continue;
    for (const iprp of boxes(view, meta.start + 4, meta.end)) {
      if (iprp.type !== 'iprp') continue;
      for (const ipco of boxes(view, iprp.start, iprp.end)) {
        if (ipco.type !== 'ipco') continue;
        for (const prop of boxes(view, ipco.start, ipco.end)) {
          if (prop.type !== 'ispe' || prop.start + 12 > prop.end) continue;
          const width = view.getUint32(prop.start + 4);
          const height = view.getUint32(prop.start + 8);
          if (!best || width * height > best.width * best.height) best = { width, height };
        }
      }
    }
  }
  return best;
}
