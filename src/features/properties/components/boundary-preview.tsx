import type { MultiPolygon, Polygon, Position } from 'geojson';

export interface BoundaryDrawing {
  /** SVG path data of every ring, in box pixels (y down). */
  d: string;
  width: number;
  height: number;
}

/**
 * Projects a lon/lat boundary into a box for a small static picture: x = lon·cos(midLat),
 * y = −lat (an equirectangular projection about the middle latitude; good enough for a
 * property-sized outline), scaled to fit the box with `paddingPx` around and centred.
 * Answers null when there is nothing to draw.
 */
export function drawBoundary(boundary: Polygon | MultiPolygon, widthPx: number, heightPx: number, paddingPx = 8): BoundaryDrawing | null {
  const polygons: Position[][][] = boundary.type === 'Polygon' ? [boundary.coordinates] : boundary.coordinates;
  const rings = polygons.flat().filter((ring) => ring.length >= 3);
  if (rings.length === 0) return null;
  let minLat = Infinity;
  let maxLat = -Infinity;
  for (const ring of rings)
    for (const [, lat] of ring) {
      minLat = Math.min(minLat, lat);
      maxLat = Math.max(maxLat, lat);
    }
  const k = Math.cos((((minLat + maxLat) / 2) * Math.PI) / 180);
  const projected = rings.map((ring) => ring.map(([lon, lat]) => [lon * k, -lat] as const));
  let minX = Infinity;
  let maxX = -Infinity;
  let minY = Infinity;
  let maxY = -Infinity;
  for (const ring of projected)
    for (const [x, y] of ring) {
      minX = Math.min(minX, x);
      maxX = Math.max(maxX, x);
      minY = Math.min(minY, y);
      maxY = Math.max(maxY, y);
    }
  const spanX = maxX - minX;
  const spanY = maxY - minY;
  if (!(spanX > 0) && !(spanY > 0)) return null;
  const innerW = widthPx - 2 * paddingPx;
  const innerH = heightPx - 2 * paddingPx;
  const scale = Math.min(spanX > 0 ? innerW / spanX : Infinity, spanY > 0 ? innerH / spanY : Infinity);
  const offsetX = paddingPx + (innerW - spanX * scale) / 2;
  const offsetY = paddingPx + (innerH - spanY * scale) / 2;
  const r = (n: number) => Math.round(n * 10) / 10;
  const d = projected
    .map((ring) => ring.map(([x, y], i) => `${i === 0 ? 'M' : 'L'}${r(offsetX + (x - minX) * scale)} ${r(offsetY + (y - minY) * scale)}`).join('') + 'Z')
    .join('');
  return { d, width: widthPx, height: heightPx };
}

/** A small static picture of a property's boundary on paper, in moss, with north up. */
export function BoundaryPreview({ boundary, label, widthPx = 320, heightPx = 220 }: { boundary: Polygon | MultiPolygon | null; label: string; widthPx?: number; heightPx?: number }) {
  const drawing = boundary ? drawBoundary(boundary, widthPx, heightPx, 16) : null;
  return (
    <svg
      viewBox={`0 0 ${widthPx} ${heightPx}`}
      role="img"
      aria-label={drawing ? label : 'No boundary yet'}
      className="h-auto w-full max-w-full rounded border border-rule bg-paper"
      preserveAspectRatio="xMidYMid meet"
    >
      {drawing ? (
        <>
          <path d={drawing.d} fill="#3F6B3A" fillOpacity={0.18} fillRule="evenodd" stroke="#2E5029" strokeWidth={1.5} strokeLinejoin="round" />
          <g transform={`translate(${widthPx - 18} 8)`} aria-hidden>
            <path d="M0 14 L5 0 L10 14 L5 10 Z" fill="#5B6770" />
            <text x="5" y="26" textAnchor="middle" fontSize="10" fill="#5B6770" fontFamily="sans-serif">
              N
            </text>
          </g>
        </>
      ) : (
        <text x={widthPx / 2} y={heightPx / 2} textAnchor="middle" dominantBaseline="middle" fontSize="13" fill="#5B6770" fontFamily="sans-serif">
          No boundary yet
        </text>
      )}
    </svg>
  );
}
