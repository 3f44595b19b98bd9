/** A large synthetic KML (areas, lines, points) for the import sanity test and the import benchmark. */

export interface LargeKmlOptions {
  /** Approximate size of the document in bytes; 10 MB unless told. */
  targetBytes?: number;
  /** Seed of the deterministic pseudo-random layout. */
  seed?: number;
  /** Corners per generated polygon. */
  cornersPerPolygon?: number;
}

export interface LargeKml {
  buffer: Buffer;
  placemarkCount: number;
  counts: { area: number; line: number; point: number };
}

/** Park–Miller minimal standard generator: deterministic, good enough for a layout. */
function lcg(seed: number): () => number {
  let state = seed % 2147483647 || 1;
  return () => {
    state = (state * 48271) % 2147483647;
    return state / 2147483647;
  };
}

/**
 * Generate a KML 2.2 document of many placemarks (every third an area with a ring of
 * `cornersPerPolygon` corners, a line or a point) scattered over a township-sized block in the
 * US Midwest, until the text reaches `targetBytes`.
 */
export function generateLargeKml(options: LargeKmlOptions = {}): LargeKml {
  const targetBytes = options.targetBytes ?? 10 * 1024 * 1024;
  const corners = options.cornersPerPolygon ?? 24;
  const random = lcg(options.seed ?? 20240611);
  const chunks: string[] = [
    '<?xml version="1.0" encoding="UTF-8"?>\n<kml xmlns="http://www.opengis.net/kml/2.2"><Document><name>Large test plan</name>\n',
  ];
  let bytes = chunks[0].length;
  const counts = { area: 0, line: 0, point: 0 };
  const closing = '</Document></kml>\n';
  const f = (n: number) => n.toFixed(7);
  for (let i = 0; bytes < targetBytes - closing.length; i += 1) {
    const lon = -93.5 + random() * 0.1;
    const lat = 41.5 + random() * 0.1;
    let geometry: string;
    if (i % 3 === 0) {
      const radius = 0.0005 + random() * 0.001;
      const ring: string[] = [];
      for (let k = 0; k < corners; k += 1) {
        const angle = (2 * Math.PI * k) / corners;
        ring.push(`${f(lon + radius * Math.cos(angle))},${f(lat + radius * Math.sin(angle))}`);
      }
      ring.push(ring[0]);
      geometry = `<Polygon><outerBoundaryIs><LinearRing><coordinates>${ring.join(' ')}</coordinates></LinearRing></outerBoundaryIs></Polygon>`;
      counts.area += 1;
    } else if (i % 3 === 1) {
      const line: string[] = [];
      for (let k = 0; k < 12; k += 1) line.push(`${f(lon + k * 0.0002)},${f(lat + (random() - 0.5) * 0.0004)}`);
      geometry = `<LineString><coordinates>${line.join(' ')}</coordinates></LineString>`;
      counts.line += 1;
    } else {
      geometry = `<Point><coordinates>${f(lon)},${f(lat)}</coordinates></Point>`;
      counts.point += 1;
    }
    const chunk = `<Placemark><name>Feature ${i + 1}</name><description>Generated test feature ${i + 1} &amp; friends</description>${geometry}</Placemark>\n`;
    chunks.push(chunk);
    bytes += chunk.length;
  }
  chunks.push(closing);
  return { buffer: Buffer.from(chunks.join(''), 'utf8'), placemarkCount: counts.area + counts.line + counts.point, counts };
}
