import { KIND_STYLES, type UnitKind } from '../../../../shared/domain/unit-kinds';
import { KindSwatch } from './kind-swatch';

/** The legend's entries: the boundary (when drawn) and each kind present, with our swatches. */
export function LegendList({ kinds, hasBoundary, className = '' }: { kinds: readonly UnitKind[]; hasBoundary: boolean; className?: string }) {
  return (
    <ul className={`flex flex-col gap-1 ${className}`}>
      {hasBoundary ? (
        <li className="flex items-center gap-2">
          <KindSwatch kind="boundary" size={14} /> Property boundary
        </li>
      ) : null}
      {kinds.map((k) => (
        <li key={k} className="flex items-center gap-2">
          <KindSwatch kind={k} size={14} /> {KIND_STYLES[k].label}
        </li>
      ))}
    </ul>
  );
}
