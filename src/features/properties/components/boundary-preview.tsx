import type { MultiPolygon, Polygon } from 'geojson';
import { extentOfPositions, fitProjection, positionsOf } from '../../../../shared/domain/map-projection';

export interface BoundaryDrawing {
  /** SVG path data of every ring, in box pixels (y down). */
  d: string;
  width: number;
  height: number;
}

/**
 * Projects a lon/lat boundary into a box for a small static picture through the shared map
 * projection (shared/domain/map-projection.ts: north up, one scale on both axes), fitted to the box
 * with `paddingPx` around and centred. Answers null when there is nothing to draw.
 */
export function drawBoundary(boundary: Polygon | MultiPolygon, widthPx: number, heightPx: number, paddingPx = 8): BoundaryDrawing | null {
  const extent = extentOfPositions(positionsOf(boundary));
  if (!extent || (extent[2] - extent[0] <= 0 && extent[3] - extent[1] <= 0)) return null;
  const projection = fitProjection(extent, { x: 0, y: 0, width: widthPx, height: heightPx }, { padding: paddingPx, digits: 1 });
  const d = projection.path(boundary);
  return d ? { d, width: widthPx, height: heightPx } : null;
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
