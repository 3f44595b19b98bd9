import type { Geometry } from 'geojson';
import { isUnitKind, KIND_STYLES } from '../../../../shared/domain/unit-kinds';
import { sketchUnit } from '../lib/unit-sketch';
import type { TaskPhotoDto } from '../../../../shared/schemas/task';

const DASH: Record<string, string | undefined> = { solid: undefined, dashed: '6 4', dotted: '1.5 3' };

/** The unit as a small static map in its kind's colours, north up, with a dot where each photo with a position was taken. Works with no signal. */
export function UnitMap({ geometry, kind, name, photos = [], widthPx = 320, heightPx = 200 }: { geometry: Geometry | null | undefined; kind: string | null; name: string; photos?: TaskPhotoDto[]; widthPx?: number; heightPx?: number }) {
  const located = photos.filter((p) => p.latitude !== null && p.longitude !== null);
  const sketch = sketchUnit(geometry ?? null, widthPx, heightPx, located.map((p) => ({ id: p.id, position: [p.longitude as number, p.latitude as number] })), 30);
  const style = kind && isUnitKind(kind) ? KIND_STYLES[kind] : KIND_STYLES['other-area'];
  const label = sketch
    ? `Map of ${name} (${style.label.toLowerCase()})${sketch.placed.length ? `, with ${sketch.placed.length} photo position${sketch.placed.length === 1 ? '' : 's'}` : ''}`
    : `No map of ${name}`;
  return (
    <figure className="flex flex-col gap-1">
      <svg viewBox={`0 0 ${widthPx} ${heightPx}`} role="img" aria-label={label} className="h-auto w-full rounded border border-rule bg-paper" preserveAspectRatio="xMidYMid meet">
        {sketch ? (
          <>
            {sketch.areaPath ? <path d={sketch.areaPath} fill={style.fill} fillOpacity={Math.max(0.35, style.fillOpacity)} fillRule="evenodd" stroke={style.stroke} strokeWidth={2} strokeDasharray={DASH[style.dash]} strokeLinejoin="round" /> : null}
            {sketch.linePath ? <path d={sketch.linePath} fill="none" stroke={style.stroke} strokeWidth={4} strokeDasharray={DASH[style.dash]} strokeLinecap="round" strokeLinejoin="round" /> : null}
            {sketch.points.map((p, i) => (
              <circle key={i} cx={p.x} cy={p.y} r={8} fill={style.fill} stroke="#1F2A24" strokeWidth={1.5} />
            ))}
            {sketch.placed.map((p) => (
              <g key={p.id} data-photo-dot={p.id}>
                <circle cx={p.x} cy={p.y} r={6} fill="#3C7A9E" stroke="#FFFDF7" strokeWidth={2} />
              </g>
            ))}
            <g transform={`translate(${widthPx - 18} 8)`} aria-hidden>
              <path d="M0 14 L5 0 L10 14 L5 10 Z" fill="#5B6770" />
              <text x="5" y="26" textAnchor="middle" fontSize="10" fill="#5B6770" fontFamily="sans-serif">
                N
              </text>
            </g>
          </>
        ) : (
          <text x={widthPx / 2} y={heightPx / 2} textAnchor="middle" dominantBaseline="middle" fontSize="13" fill="#5B6770" fontFamily="sans-serif">
            No map for this unit
          </text>
        )}
      </svg>
      {sketch && (sketch.placed.length > 0 || sketch.offMap.length > 0) ? (
        <figcaption className="flex items-center gap-2 text-xs text-slate">
          {sketch.placed.length > 0 ? (
            <>
              <span className="inline-block size-3 rounded-full border-2 border-card bg-sky" aria-hidden /> where a photo was taken
            </>
          ) : null}
          {sketch.offMap.length > 0 ? <span>{sketch.offMap.length} photo{sketch.offMap.length === 1 ? ' was' : 's were'} taken away from this unit.</span> : null}
        </figcaption>
      ) : null}
    </figure>
  );
}
