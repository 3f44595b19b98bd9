import { KIND_STYLES, type UnitKind } from '../../../../shared/domain/unit-kinds';
import { symbolPath } from '../lib/symbols';

const DASH: Record<string, string | undefined> = { solid: undefined, dashed: '4 2.5', dotted: '1.2 2' };

/** A kind's swatch as on the map: a filled patch for areas, a stroke for lines, our symbol for points. */
export function KindSwatch({ kind, size = 16 }: { kind: UnitKind | 'unassigned' | 'boundary'; size?: number }) {
  if (kind === 'unassigned') {
    return (
      <svg width={size} height={size} viewBox="0 0 16 16" aria-hidden className="shrink-0">
        <rect x="1.5" y="1.5" width="13" height="13" rx="2" fill="#FFFDF7" stroke="#D9D3C3" strokeWidth="1.5" />
      </svg>
    );
  }
  if (kind === 'boundary') {
    return (
      <svg width={size} height={size} viewBox="0 0 16 16" aria-hidden className="shrink-0">
        <rect x="2" y="2" width="12" height="12" rx="1" fill="#FFFDF7" stroke="#1F2A24" strokeWidth="2" />
      </svg>
    );
  }
  const s = KIND_STYLES[kind];
  if (s.family === 'area') {
    return (
      <svg width={size} height={size} viewBox="0 0 16 16" aria-hidden className="shrink-0">
        <rect x="1.5" y="1.5" width="13" height="13" rx="2" fill={s.fill} fillOpacity={Math.max(0.35, s.fillOpacity)} stroke={s.stroke} strokeWidth="1.5" strokeDasharray={DASH[s.dash]} />
      </svg>
    );
  }
  if (s.family === 'line') {
    return (
      <svg width={size} height={size} viewBox="0 0 16 16" aria-hidden className="shrink-0">
        <path d="M1.5 12.5 C5 3, 10 14, 14.5 3.5" fill="none" stroke={s.stroke} strokeWidth={kind === 'fence' ? 1.6 : 2.6} strokeDasharray={DASH[s.dash]} />
      </svg>
    );
  }
  return (
    <svg width={size} height={size} viewBox="0 0 22 22" aria-hidden className="shrink-0">
      <path d={symbolPath(s.symbol ?? 'circle', 22)} fill={s.fill} stroke={s.stroke} strokeWidth="1.6" strokeLinejoin="round" />
      <path d={symbolPath(s.symbol ?? 'circle', 22)} fill="none" stroke="#1F2A24" strokeOpacity="0.35" strokeWidth="0.6" strokeLinejoin="round" />
    </svg>
  );
}
