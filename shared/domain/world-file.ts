/**
 * ESRI world files (.jgw, .pgw, .tfw): six numbers, one a line — A (pixel width in x), D (rotation),
 * B (rotation), E (pixel height in y, negative for north-up), C and F (x and y of the CENTRE of the
 * top-left pixel). A pixel (col, row) maps to x = A·col + B·row + C, y = D·col + E·row + F.
 * Source: ESRI, "World files for raster datasets" (ArcGIS help).
 */

export interface WorldFile {
  a: number;
  d: number;
  b: number;
  e: number;
  c: number;
  f: number;
}

/** Reads a world file's text; answers a sentence when it is not six numbers. */
export function parseWorldFile(text: string): WorldFile | { error: string } {
  const lines = text
    .split(/\r?\n/)
    .map((l) => l.trim())
    .filter((l) => l !== '');
  if (lines.length !== 6) return { error: `A world file has six lines of numbers; this one has ${lines.length}. Upload the .jgw (or .pgw) that came with the image.` };
  const values = lines.map((l) => (/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(l) ? Number(l) : NaN));
  const bad = values.findIndex((v) => !Number.isFinite(v));
  if (bad >= 0) return { error: `Line ${bad + 1} of the world file is not a number (“${lines[bad]!.slice(0, 40)}”).` };
  const [a, d, b, e, c, f] = values as [number, number, number, number, number, number];
  if (a * e - b * d === 0) return { error: 'The world file’s pixel size is zero, so the image has no extent. Export the world file again.' };
  return { a, d, b, e, c, f };
}

/**
 * The map coordinates of the image's four outer corners (top-left, top-right, bottom-right,
 * bottom-left) — the pixel edges, half a pixel out from the centres the world file gives.
 */
export function worldFileCorners(w: WorldFile, width: number, height: number): [[number, number], [number, number], [number, number], [number, number]] {
  const at = (col: number, row: number): [number, number] => [w.a * col + w.b * row + w.c, w.d * col + w.e * row + w.f];
  return [at(-0.5, -0.5), at(width - 0.5, -0.5), at(width - 0.5, height - 0.5), at(-0.5, height - 0.5)];
}
