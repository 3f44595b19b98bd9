/** The parts of piexifjs (EXIF writer, no types published) the test fixtures use. */
declare module 'piexifjs' {
  type IfdValue = string | number | number[] | [number, number] | [number, number][];
  export interface ExifObject {
    '0th'?: Record<number, IfdValue>;
    Exif?: Record<number, IfdValue>;
    GPS?: Record<number, IfdValue>;
    '1st'?: Record<number, IfdValue>;
    thumbnail?: string | null;
  }
  /** EXIF bytes as a binary string. */
  export function dump(exif: ExifObject): string;
  /** A JPEG (binary string or data URL) with the EXIF inserted. */
  export function insert(exifBytes: string, jpeg: string): string;
  export function load(jpeg: string): ExifObject;
  export const ImageIFD: Record<string, number>;
  export const ExifIFD: Record<string, number>;
  export const GPSIFD: Record<string, number>;
  export const GPSHelper: { degToDmsRational(degrees: number): [number, number][] };
  const piexif: { dump: typeof dump; insert: typeof insert; load: typeof load; ImageIFD: typeof ImageIFD; ExifIFD: typeof ExifIFD; GPSIFD: typeof GPSIFD; GPSHelper: typeof GPSHelper };
  export default piexif;
}
