import { KIND_STYLES, type UnitKind } from '../../../../shared/domain/unit-kinds';
import { KindSwatch } from './kind-swatch';

/** The legend of the kinds on the map, with our swatches and symbols. */
export function MapLegend({ kinds, hasBoundary }: { kinds: UnitKind[]; hasBoundary: boolean }) {
  if (kinds.length === 0 && !hasBoundary) return null;
  return (
    <details open aria-label="Legend" className="group max-h-64 overflow-y-auto rounded border border-rule bg-card/95 px-3 py-1.5 text-xs shadow-sm">
      <summary className="cursor-pointer font-semibold uppercase tracking-wide text-slate">Legend</summary>
      <ul className="mt-1 flex flex-col gap-1 pb-0.5">
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
    </details>
  );
}
