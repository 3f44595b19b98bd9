/**
 * Photos the tests make themselves: a real JPEG or PNG drawn by sharp, with EXIF capture time and
 * GPS written by piexifjs (DateTimeOriginal, GPSLatitude/LongitudeRef as degree,
 * minute, second rationals — CIPA DC-008 EXIF 2.3 §4.6.6).
 */
import piexif from 'piexifjs';
import sharp from 'sharp';

export interface JpegOptions {
  width?: number;
  height?: number;
  /** Fill colour; different colours make different bytes (and hashes). */
  rgb?: [number, number, number];
  /** EXIF DateTimeOriginal as "YYYY:MM:DD HH:MM:SS". */
  takenAt?: string;
  latitude?: number;
  longitude?: number;
}

/** A JPEG of a plain colour with the given EXIF tags (none when no tag option is given). */
export async function makeJpeg(options: JpegOptions = {}): Promise<Buffer> {
  const { width = 64, height = 48, rgb = [90, 120, 60] } = options;
  const jpeg = await sharp({ create: { width, height, channels: 3, background: { r: rgb[0], g: rgb[1], b: rgb[2] } } }).jpeg({ quality: 80 }).toBuffer();
  if (options.takenAt === undefined && options.latitude === undefined) return jpeg;
  const exif: { Exif: Record<number, string>; GPS: Record<number, string | [number, number][]> } = { Exif: {}, GPS: {} };
  if (options.takenAt !== undefined) exif.Exif[piexif.ExifIFD.DateTimeOriginal] = options.takenAt;
  if (options.latitude !== undefined && options.longitude !== undefined) {
    exif.GPS[piexif.GPSIFD.GPSLatitudeRef] = options.latitude < 0 ? 'S' : 'N';
    exif.GPS[piexif.GPSIFD.GPSLatitude] = piexif.GPSHelper.degToDmsRational(Math.abs(options.latitude));
    exif.GPS[piexif.GPSIFD.GPSLongitudeRef] = options.longitude < 0 ? 'W' : 'E';
    exif.GPS[piexif.GPSIFD.GPSLongitude] = piexif.GPSHelper.degToDmsRational(Math.abs(options.longitude));
  }
  const withExif = piexif.insert(piexif.dump(exif), jpeg.toString('binary'));
  return Buffer.from(withExif, 'binary');
}

/** A PNG of a plain colour. */
export async function makePng(width = 64, height = 48): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 4, background: { r: 30, g: 80, b: 140, alpha: 1 } } }).png().toBuffer();
}

/** The smallest well-formed HEIC header: ftyp 'heic' then meta → iprp → ipco → ispe with the given size (no picture data). */
export function makeHeicHeader(width: number, height: number): Buffer {
  const box = (type: string, body: Buffer) => {
    const head = Buffer.alloc(8);
    head.writeUInt32BE(8 + body.length, 0);
    head.write(type, 4, 'ascii');
    return Buffer.concat([head, body]);
  };
  const ispeBody = Buffer.alloc(12);
  ispeBody.writeUInt32BE(width, 4);
  ispeBody.writeUInt32BE(height, 8);
  const ftyp = box('ftyp', Buffer.concat([Buffer.from('heic', 'ascii'), Buffer.alloc(4), Buffer.from('mif1heic', 'ascii')]));
  const meta = box('meta', Buffer.concat([Buffer.alloc(4), box('iprp', box('ipco', box('ispe', ispeBody)))]));
  return Buffer.concat([ftyp, meta]);
}
