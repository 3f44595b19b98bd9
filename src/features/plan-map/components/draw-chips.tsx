import type { ReactNode } from 'react';
import { AREA_KINDS, KIND_STYLES, LINE_KINDS, POINT_KINDS, type UnitKind } from '../../../../shared/domain/unit-kinds';
import type { DrawTarget } from '../lib/plan-map-controller';
import { KindSwatch } from './kind-swatch';
import { kindColour } from '../lib/unit-features';

function sameTarget(a: DrawTarget | null, b: DrawTarget): boolean {
  if (!a || a.type !== b.type) return false;
  if (a.type === 'unit' && b.type === 'unit') return a.kind === b.kind;
  if (a.type === 'measure' && b.type === 'measure') return a.shape === b.shape;
  return true;
}

function Chip({ active, onClick, children, colour, title }: { active: boolean; onClick: () => void; children: ReactNode; colour: string; title: string }) {
  return (
    <button
      type="button"
      aria-pressed={active}
      title={title}
      onClick={onClick}
      style={active ? { borderColor: colour, boxShadow: `inset 0 0 0 1px ${colour}`, backgroundColor: `${colour}22` } : undefined}
      className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border bg-card/95 px-2 py-0.5 text-xs font-semibold shadow-sm transition-colors ${active ? 'text-ink' : 'border-rule text-ink hover:border-slate'}`}
    >
      {children}
    </button>
  );
}

const verbFor = (kind: UnitKind) => (KIND_STYLES[kind].family === 'point' ? 'Place' : 'Draw');

/** The drawing tools along the map's top edge: one chip per kind, coloured as the kind, plus Boundary and Measure. */
export function DrawChips({ active, onChoose }: { active: DrawTarget | null; onChoose: (target: DrawTarget | null) => void }) {
  const toggle = (t: DrawTarget) => onChoose(sameTarget(active, t) ? null : t);
  const group = (kinds: readonly UnitKind[], label: string) => (
    <div role="group" aria-label={label} className="contents">
      {kinds.map((kind) => (
        <Chip key={kind} active={sameTarget(active, { type: 'unit', kind })} onClick={() => toggle({ type: 'unit', kind })} colour={kindColour(kind)} title={`${verbFor(kind)} a ${KIND_STYLES[kind].label.toLowerCase()}`}>
          <KindSwatch kind={kind} size={14} />
          {KIND_STYLES[kind].label}
        </Chip>
      ))}
    </div>
  );
  return (
    <div role="toolbar" aria-label="Drawing tools" className="flex flex-wrap items-center gap-1">
      <div role="group" aria-label="Boundary and measure" className="contents">
        <Chip active={sameTarget(active, { type: 'boundary' })} onClick={() => toggle({ type: 'boundary' })} colour="#1F2A24" title="Draw the property boundary (replaces the current one)">
          <KindSwatch kind="boundary" size={14} />
          Boundary
        </Chip>
        <Chip active={sameTarget(active, { type: 'measure', shape: 'line' })} onClick={() => toggle({ type: 'measure', shape: 'line' })} colour="#3C7A9E" title="Measure a distance (not saved)">
          <span aria-hidden className="text-sky">↔</span>
          Measure distance
        </Chip>
        <Chip active={sameTarget(active, { type: 'measure', shape: 'area' })} onClick={() => toggle({ type: 'measure', shape: 'area' })} colour="#3C7A9E" title="Measure an area (not saved)">
          <span aria-hidden className="text-sky">▱</span>
          Measure area
        </Chip>
      </div>
      <span aria-hidden className="mx-1 h-4 w-px bg-rule" />
      {group(AREA_KINDS, 'Areas')}
      <span aria-hidden className="mx-1 h-4 w-px bg-rule" />
      {group(LINE_KINDS, 'Lines')}
      <span aria-hidden className="mx-1 h-4 w-px bg-rule" />
      {group(POINT_KINDS, 'Points')}
    </div>
  );
}
