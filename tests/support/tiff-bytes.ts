/**
 * A TIFF that is only a header: one image file directory declaring a size, its strips tiny and
 * deflate-compressed, so the file is a few hundred bytes while the image it declares can be any
 * size. Layout from the TIFF 6.0 specification (Adobe, 1992), section 2 (header, IFD entries) and
 * section 8 (baseline tags); GeoTIFF tags from OGC GeoTIFF 1.1 (ModelPixelScale 33550,
 * ModelTiepoint 33922, GeoKeyDirectory 34735).
 */

/** A little-endian TIFF declaring `width` × `height` pixels of `samples` 8-bit bands, with a WGS84 georeference. */
export function tiffHeaderOnly(width: number, height: number, samples = 3): Buffer {
  const entries: [tag: number, type: number, count: number, value: number | number[]][] = [
    [256, 4, 1, width], // ImageWidth, LONG
    [257, 4, 1, height], // ImageLength
    [258, 3, samples, Array(samples).fill(8)], // BitsPerSample, SHORT
    [259, 3, 1, 8], // Compression: Deflate (Adobe)
    [262, 3, 1, samples >= 3 ? 2 : 1], // PhotometricInterpretation: RGB or black is zero
    [273, 4, 1, 0], // StripOffsets (filled below)
    [277, 3, 1, samples], // SamplesPerPixel
    [278, 4, 1, height], // RowsPerStrip: one strip
    [279, 4, 1, 8], // StripByteCounts
    [284, 3, 1, 1], // PlanarConfiguration: chunky
    [33550, 12, 3, [1e-6, 1e-6, 0]], // ModelPixelScale, DOUBLE
    [33922, 12, 6, [0, 0, 0, -90.94, 43.27, 0]], // ModelTiepoint
    [34735, 3, 8, [1, 1, 0, 1, 2048, 0, 1, 4326]], // GeoKeyDirectory: GeographicTypeGeoKey = 4326
  ];
  const sizeOf = (type: number) => (type === 3 ? 2 : type === 4 ? 4 : 8);
  const ifdOffset = 8;
  const ifdBytes = 2 + entries.length * 12 + 4;
  let extra = ifdOffset + ifdBytes;
  const extras: { offset: number; type: number; values: number[] }[] = [];
  const buf = Buffer.alloc(4096);
  buf.write('II', 0, 'latin1');
  buf.writeUInt16LE(42, 2);
  buf.writeUInt32LE(ifdOffset, 4);
  buf.writeUInt16LE(entries.length, ifdOffset);
  const stripOffsetAt: number[] = [];
  entries.forEach(([tag, type, count, value], i) => {
    const at = ifdOffset + 2 + i * 12;
    buf.writeUInt16LE(tag, at);
    buf.writeUInt16LE(type, at + 2);
    buf.writeUInt32LE(count, at + 4);
    const values = Array.isArray(value) ? value : [value];
    if (sizeOf(type) * count <= 4) {
      values.forEach((v, k) => (type === 3 ? buf.writeUInt16LE(v, at + 8 + 2 * k) : buf.writeUInt32LE(v, at + 8)));
      if (tag === 273) stripOffsetAt.push(at + 8);
    } else {
      buf.writeUInt32LE(extra, at + 8);
      extras.push({ offset: extra, type, values });
      extra += sizeOf(type) * count;
    }
  });
  for (const e of extras) e.values.forEach((v, k) => (e.type === 12 ? buf.writeDoubleLE(v, e.offset + 8 * k) : buf.writeUInt16LE(v, e.offset + 2 * k)));
  // One 8-byte strip of junk: the header is all a size check may read.
  buf.writeUInt32LE(extra, stripOffsetAt[0]);
  return buf.subarray(0, extra + 8);
}
