/**
 * Cheap looks into shapefile members before anything is parsed: record and vertex counts from the
 * .shp (ESRI Shapefile Technical Description, July 1998), and the text encoding the .dbf's
 * language-driver byte names (dBASE IV header, byte 29).
 */

/** Records and coordinate positions of a .shp main file, counted from the record headers alone. */
export function shapefileCounts(bytes: Uint8Array): { records: number; vertices: number } {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  let records = 0;
  let vertices = 0;
  let offset = 100;
  while (offset + 12 <= bytes.length) {
    const contentBytes = view.getInt32(offset + 4, false) * 2; // content length in 16-bit words, big-endian
    const content = offset + 8;
    if (contentBytes < 4 || content + contentBytes > bytes.length) break;
    records += 1;
    const type = view.getInt32(content, true);
    if (type === 1 || type === 11 || type === 21) vertices += 1; // Point, PointZ, PointM
    else if ([3, 5, 13, 15, 23, 25, 31].includes(type) && contentBytes >= 44) vertices += view.getInt32(content + 40, true); // NumPoints after box and NumParts
    else if ([8, 18, 28].includes(type) && contentBytes >= 40) vertices += view.getInt32(content + 36, true); // MultiPoint: NumPoints after box
    offset = content + contentBytes;
  }
  return { records, vertices };
}

/**
 * dBASE language-driver ids and the WHATWG encoding labels TextDecoder knows for them. Code pages
 * from the ArcPad 10 help, "Setting the code page for shapefiles" (LDID → code page table); 0x57
 * (87) is what GDAL writes by default (its Shapefile driver's ENCODING option defaults to
 * "LDID/87"), which GDAL reads as ISO-8859-1.
 */
const LDID_ENCODINGS: Record<number, string> = {
  0x03: 'windows-1252', // Windows ANSI
  0x57: 'iso-8859-1', // ANSI, GDAL's default
  0x58: 'windows-1252', // Western European ANSI
  0x59: 'windows-1252', // Spanish ANSI
  0x13: 'shift_jis', // Japanese, code page 932
  0x7b: 'shift_jis',
  0x4d: 'gbk', // Chinese, code page 936
  0x7a: 'gbk',
  0x4e: 'euc-kr', // Korean, code page 949
  0x79: 'euc-kr',
  0x4f: 'big5', // Chinese (Taiwan), code page 950
  0x78: 'big5',
  0x50: 'windows-874', // Thai
  0x7c: 'windows-874',
  0x26: 'ibm866', // Russian OEM
  0x65: 'ibm866',
  0xc8: 'windows-1250', // Eastern European ANSI
  0xc9: 'windows-1251', // Russian ANSI
  0xca: 'windows-1254', // Turkish ANSI
  0xcb: 'windows-1253', // Greek ANSI
  0xcc: 'windows-1257', // Baltic ANSI
};

/**
 * The text encoding a .dbf names in its language-driver byte: a TextDecoder label, or a warning
 * when it names a DOS code page the reader cannot decode (accented letters may come out wrong).
 */
export function dbfEncoding(dbf: Uint8Array): { ldid: number; label?: string; warning?: string } {
  if (dbf.length < 32) return { ldid: 0 };
  const ldid = dbf[29];
  if (ldid === 0) return { ldid };
  const label = LDID_ENCODINGS[ldid];
  if (label) return { ldid, label };
  return {
    ldid,
    warning: `its language-driver byte (0x${ldid.toString(16).padStart(2, '0')}) names an old DOS code page, so accented letters in names may be wrong. Export the shapefile with a .cpg file (UTF-8) to keep them.`,
  };
}
