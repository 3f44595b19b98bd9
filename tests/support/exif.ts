/**
 * Writes a minimal EXIF block (TIFF 6.0 / EXIF 2.3 layout: IFD0 → GPS IFD with GPSLatitudeRef,
 * GPSLatitude, GPSLongitudeRef, GPSLongitude as degree/minute/second rationals, plus DateTime) into
 * a JPEG after its SOI marker, so tests can check that the photo's location is read back.
 */

function rational(value: number, denominator: number): [number, number] {
  return [Math.round(value * denominator), denominator];
}

function dms(decimal: number): [number, number][] {
  const abs = Math.abs(decimal);
  const deg = Math.floor(abs);
  const minFloat = (abs - deg) * 60;
  const min = Math.floor(minFloat);
  const sec = (minFloat - min) * 60;
  return [rational(deg, 1), rational(min, 1), rational(sec, 10000)];
}

/** A copy of `jpeg` carrying GPS latitude/longitude (decimal degrees) and a DateTime "YYYY:MM:DD HH:MM:SS". */
export function withGpsExif(jpeg: Buffer, latitude: number, longitude: number, dateTime = '2026:06:14 09:30:00'): Buffer {
  // Little-endian TIFF. Layout: header(8) | IFD0 (2 entries) | GPS IFD (4 entries) | data area.
  const entries0 = 2;
  const entriesGps = 4;
  const ifd0Offset = 8;
  const ifd0Size = 2 + entries0 * 12 + 4;
  const gpsOffset = ifd0Offset + ifd0Size;
  const gpsSize = 2 + entriesGps * 12 + 4;
  let dataOffset = gpsOffset + gpsSize;
  const data: Buffer[] = [];
  const put = (buf: Buffer): number => {
    const at = dataOffset;
    data.push(buf);
    dataOffset += buf.length;
    return at;
  };
  const rationals = (list: [number, number][]): Buffer => {
    const b = Buffer.alloc(list.length * 8);
    list.forEach(([n, d], i) => {
      b.writeUInt32LE(n, i * 8);
      b.writeUInt32LE(d, i * 8 + 4);
    });
    return b;
  };
  const dateBytes = Buffer.from(`${dateTime}\0`, 'ascii');
  const dateAt = put(dateBytes);
  const latAt = put(rationals(dms(latitude)));
  const lonAt = put(rationals(dms(longitude)));

  const tiff = Buffer.alloc(dataOffset);
  tiff.write('II', 0, 'ascii');
  tiff.writeUInt16LE(42, 2);
  tiff.writeUInt32LE(ifd0Offset, 4);
  const entry = (at: number, tag: number, type: number, count: number, valueOrOffset: number | Buffer) => {
    tiff.writeUInt16LE(tag, at);
    tiff.writeUInt16LE(type, at + 2);
    tiff.writeUInt32LE(count, at + 4);
    if (typeof valueOrOffset === 'number') tiff.writeUInt32LE(valueOrOffset, at + 8);
    else valueOrOffset.copy(tiff, at + 8, 0, 4);
  };
  // IFD0: DateTime (0x0132, ASCII), GPSInfo pointer (0x8825, LONG).
  tiff.writeUInt16LE(entries0, ifd0Offset);
  entry(ifd0Offset + 2, 0x0132, 2, dateBytes.length, dateAt);
  entry(ifd0Offset + 14, 0x8825, 4, 1, gpsOffset);
  tiff.writeUInt32LE(0, ifd0Offset + 2 + entries0 * 12);
  // GPS IFD: LatitudeRef (1), Latitude (2), LongitudeRef (3), Longitude (4).
  tiff.writeUInt16LE(entriesGps, gpsOffset);
  entry(gpsOffset + 2, 0x0001, 2, 2, Buffer.from(latitude >= 0 ? 'N\0\0\0' : 'S\0\0\0', 'ascii'));
  entry(gpsOffset + 14, 0x0002, 5, 3, latAt);
  entry(gpsOffset + 26, 0x0003, 2, 2, Buffer.from(longitude >= 0 ? 'E\0\0\0' : 'W\0\0\0', 'ascii'));
  entry(gpsOffset + 38, 0x0004, 5, 3, lonAt);
  tiff.writeUInt32LE(0, gpsOffset + 2 + entriesGps * 12);
  let cursor = gpsOffset + gpsSize;
  for (const b of data) {
    b.copy(tiff, cursor);
    cursor += b.length;
  }
  const payload = Buffer.concat([Buffer.from('Exif\0\0', 'ascii'), tiff]);
  const app1 = Buffer.alloc(4);
  app1.writeUInt16BE(0xffe1, 0);
  app1.writeUInt16BE(payload.length + 2, 2);
  return Buffer.concat([jpeg.subarray(0, 2), app1, payload, jpeg.subarray(2)]);
}
