/**
 * The type and pixel size of a PNG or JPEG from its bytes alone (headers only, nothing decoded), so a
 * limit on pixels is checked before any work on the image.
 * PNG: the signature then the IHDR chunk (width and height, 4-byte big-endian, at offsets 16 and 20 —
 * PNG specification, W3C REC 2003, §5.2–5.3, §11.2.2). JPEG: the markers are walked to the first
 * start-of-frame (SOF0–SOF15 except DHT C4, JPG C8, DAC CC), whose height and width follow the
 * precision byte (ITU-T T.81, §B.2.2).
 */
export interface ImageSize {
  kind: 'png' | 'jpeg';
  width: number;
  height: number;
}

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

/** The kind and size of a PNG or JPEG, or null when the bytes are neither (or the header is cut short). */
export function readImageSize(bytes: Uint8Array): ImageSize | null {
  if (bytes.length >= 24 && PNG_SIGNATURE.every((b, i) => bytes[i] === b)) {
    const isIhdr = bytes[12] === 0x49 && bytes[13] === 0x48 && bytes[14] === 0x44 && bytes[15] === 0x52;
    if (!isIhdr) return null;
    const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    return { kind: 'png', width: view.getUint32(16), height: view.getUint32(20) };
  }
  if (bytes.length >= 4 && bytes[0] === 0xff && bytes[1] === 0xd8) {
    let at = 2;
    while (at + 4 <= bytes.length) {
      if (bytes[at] !== 0xff) return null;
      const marker = bytes[at + 1]!;
      if (marker === 0xff) {
        at += 1; // fill byte
        continue;
      }
      if (marker === 0xd8 || marker === 0x01 || (marker >= 0xd0 && marker <= 0xd7)) {
        at += 2; // markers without a length
        continue;
      }
      const length = (bytes[at + 2]! << 8) | bytes[at + 3]!;
      if (length < 2) return null;
      const isFrame = marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc;
      if (isFrame) {
        if (at + 9 > bytes.length) return null;
        const height = (bytes[at + 5]! << 8) | bytes[at + 6]!;
        const width = (bytes[at + 7]! << 8) | bytes[at + 8]!;
        return { kind: 'jpeg', width, height };
      }
      if (marker === 0xd9 || marker === 0xda) return null; // end of image or scan before any frame
      at += 2 + length;
    }
  }
  return null;
}
