/**
 * The drawing tools along the map's top edge, in ONE compact row: a chip per kind, coloured as the
 * kind, plus Boundary and the two measures. What does not fit the map's width goes into a "More"
 * menu (a menu button: aria-expanded, arrow keys, Escape closes), the least used tools first
 * (`lib/tool-row.ts` decides; the widths are measured from an invisible copy of the chips).
 */
import { useEffect, useId, useLayoutEffect, useMemo, useRef, useState, type KeyboardEvent, type ReactNode } from 'react';
import { AREA_KINDS, KIND_STYLES, LINE_KINDS, POINT_KINDS, type UnitKind } from '../../../../shared/domain/unit-kinds';
import type { DrawTarget } from '../lib/plan-map-controller';
import { splitToolRow, type RowSpacing } from '../lib/tool-row';
import { KindSwatch } from './kind-swatch';
import { kindColour } from '../lib/unit-features';

function sameTarget(a: DrawTarget | null, b: DrawTarget): boolean {
  if (!a || a.type !== b.type) return false;
  if (a.type === 'unit' && b.type === 'unit') return a.kind === b.kind;
  if (a.type === 'measure' && b.type === 'measure') return a.shape === b.shape;
  return true;
}

type Group = 'setup' | 'areas' | 'lines' | 'points';
const GROUP_LABEL: Record<Group, string> = { setup: 'Boundary and measure', areas: 'Areas', lines: 'Lines', points: 'Points' };

interface Tool {
  id: string;
  target: DrawTarget;
  label: string;
  title: string;
  colour: string;
  icon: ReactNode;
  group: Group;
  rank: number;
}

const verbFor = (kind: UnitKind) => (KIND_STYLES[kind].family === 'point' ? 'Place' : 'Draw');

// Lower rank = used more often, kept in the row longest (common practice of the trade, no source):
// the habitat units a plan is made of first, then the way in and the stands, the rest after.
const KIND_RANK: Record<UnitKind, number> = {
  'food-plot': 1,
  'bedding-area': 2,
  sanctuary: 3,
  'stand-site': 4,
  'access-route': 5,
  'cover-planting': 6,
  timber: 7,
  water: 8,
  'camera-site': 9,
  'mock-scrape': 10,
  'water-source': 11,
  firebreak: 12,
  fence: 13,
  gate: 14,
  'other-area': 15,
};

/** Every drawing tool, in the row's own order. Boundary leads while the property has none; afterwards it is rarely needed. */
function buildTools(hasBoundary: boolean): Tool[] {
  const kindTool = (kind: UnitKind, group: Group): Tool => ({
    id: kind,
    target: { type: 'unit', kind },
    label: KIND_STYLES[kind].label,
    title: `${verbFor(kind)} a ${KIND_STYLES[kind].label.toLowerCase()}`,
    colour: kindColour(kind),
    icon: <KindSwatch kind={kind} size={14} />,
    group,
    rank: KIND_RANK[kind],
  });
  return [
    { id: 'boundary', target: { type: 'boundary' }, label: 'Boundary', title: 'Draw the property boundary (replaces the current one)', colour: '#1F2A24', icon: <KindSwatch kind="boundary" size={14} />, group: 'setup', rank: hasBoundary ? 30 : 0 },
    { id: 'measure-line', target: { type: 'measure', shape: 'line' }, label: 'Measure distance', title: 'Measure a distance (not saved)', colour: '#3C7A9E', icon: <span aria-hidden className="text-sky">↔</span>, group: 'setup', rank: 20 },
    { id: 'measure-area', target: { type: 'measure', shape: 'area' }, label: 'Measure area', title: 'Measure an area (not saved)', colour: '#3C7A9E', icon: <span aria-hidden className="text-sky">▱</span>, group: 'setup', rank: 21 },
    ...AREA_KINDS.map((k) => kindTool(k, 'areas')),
    ...LINE_KINDS.map((k) => kindTool(k, 'lines')),
    ...POINT_KINDS.map((k) => kindTool(k, 'points')),
  ];
}

const CHIP = 'inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border px-2 py-0.5 text-xs font-semibold transition-colors';
const SPACING: RowSpacing = { gap: 4, separator: 1 };

function Chip({ tool, active, onClick }: { tool: Tool; active: boolean; onClick: () => void }) {
  return (
    <button
      type="button"
      aria-pressed={active}
      title={tool.title}
      onClick={onClick}
      style={active ? { borderColor: tool.colour, boxShadow: `inset 0 0 0 1px ${tool.colour}`, backgroundColor: `${tool.colour}22` } : undefined}
      className={`${CHIP} ${active ? 'text-ink' : 'border-transparent bg-card text-ink hover:border-slate'}`}
    >
      {tool.icon}
      {tool.label}
    </button>
  );
}

/** The tools that do not fit the row, as a menu button and its menu. */
function MoreMenu({ tools, active, onPick }: { tools: Tool[]; active: DrawTarget | null; onPick: (tool: Tool) => void }) {
  const [open, setOpen] = useState(false);
  const menuId = useId();
  const wrap = useRef<HTMLDivElement>(null);
  const button = useRef<HTMLButtonElement>(null);
  const menu = useRef<HTMLDivElement>(null);
  const activeTool = tools.find((t) => sameTarget(active, t.target));
  const items = () => Array.from(menu.current?.querySelectorAll<HTMLButtonElement>('[role^="menuitem"]') ?? []);
  const focusItem = (index: number) => {
    const all = items();
    if (all.length) all[(index + all.length) % all.length]!.focus();
  };
  const close = (returnFocus: boolean) => {
    setOpen(false);
    if (returnFocus) button.current?.focus();
  };

  // Opening puts the focus on the chosen tool (or the first); a click elsewhere closes the menu.
  useEffect(() => {
    if (!open) return;
    const all = items();
    (all.find((el) => el.getAttribute('aria-checked') === 'true') ?? all[0])?.focus();
    const outside = (e: PointerEvent) => {
      if (!wrap.current?.contains(e.target as Node)) setOpen(false);
    };
    document.addEventListener('pointerdown', outside);
    return () => document.removeEventListener('pointerdown', outside);
  }, [open]);

  const onMenuKey = (e: KeyboardEvent<HTMLDivElement>) => {
    const all = items();
    const at = all.indexOf(document.activeElement as HTMLButtonElement);
    if (e.key === 'ArrowDown') focusItem(at + 1);
    else if (e.key === 'ArrowUp') focusItem(at - 1);
    else if (e.key === 'Home') focusItem(0);
    else if (e.key === 'End') focusItem(all.length - 1);
    else if (e.key === 'Escape') close(true);
    else if (e.key === 'Tab') return setOpen(false);
    else return;
    e.preventDefault();
    e.stopPropagation();
  };

  const groups = (Object.keys(GROUP_LABEL) as Group[]).map((g) => ({ g, list: tools.filter((t) => t.group === g) })).filter((x) => x.list.length > 0);
  return (
    <div ref={wrap} className="relative">
      <button
        ref={button}
        type="button"
        aria-haspopup="menu"
        aria-expanded={open}
        aria-controls={menuId}
        title={activeTool ? `More tools (now: ${activeTool.label})` : 'More drawing tools'}
        onClick={() => setOpen((v) => !v)}
        onKeyDown={(e) => {
          if (e.key === 'ArrowDown' || e.key === 'ArrowUp') {
            e.preventDefault();
            setOpen(true);
          }
        }}
        style={activeTool ? { borderColor: activeTool.colour, boxShadow: `inset 0 0 0 1px ${activeTool.colour}`, backgroundColor: `${activeTool.colour}22` } : undefined}
        className={`${CHIP} ${activeTool ? 'text-ink' : 'border-rule bg-paper text-moss-deep hover:border-slate'}`}
      >
        More <span aria-hidden>▾</span>
      </button>
      <div
        ref={menu}
        id={menuId}
        role="menu"
        aria-label="More drawing tools"
        hidden={!open}
        onKeyDown={onMenuKey}
        className="absolute right-0 top-full z-30 mt-1 w-52 overflow-y-auto rounded-md border border-rule bg-card py-1 text-sm shadow-md"
        style={{ maxHeight: 'min(36rem, calc(100vh - 12rem))' }}
      >
        {groups.map(({ g, list }, i) => (
          <div key={g} role="group" aria-label={GROUP_LABEL[g]} className={i > 0 ? 'mt-1 border-t border-rule pt-1' : undefined}>
            <p aria-hidden className="px-3 pt-0.5 text-[11px] font-semibold uppercase tracking-wide text-slate">{GROUP_LABEL[g]}</p>
            {list.map((t) => {
              const on = sameTarget(active, t.target);
              return (
                <button
                  key={t.id}
                  type="button"
                  role="menuitemradio"
                  aria-checked={on}
                  tabIndex={-1}
                  title={t.title}
                  onClick={() => {
                    onPick(t);
                    close(true);
                  }}
                  className={`flex w-full items-center gap-2 px-3 py-1 text-left text-ink hover:bg-paper focus:bg-paper focus:outline-none focus-visible:ring-2 focus-visible:ring-inset focus-visible:ring-moss ${on ? 'font-semibold' : ''}`}
                >
                  {t.icon}
                  <span className="flex-1">{t.label}</span>
                  {on ? <span aria-hidden className="text-moss">✓</span> : null}
                </button>
              );
            })}
          </div>
        ))}
      </div>
    </div>
  );
}

/**
 * The drawing tools: one row sized to `width` (the room beside the map's edges), the rest in "More".
 * `hasBoundary` moves Boundary from the front of the row to the back of the queue once drawn.
 */
export function DrawChips({ active, onChoose, hasBoundary = false }: { active: DrawTarget | null; onChoose: (target: DrawTarget | null) => void; hasBoundary?: boolean }) {
  const tools = useMemo(() => buildTools(hasBoundary), [hasBoundary]);
  const toggle = (t: DrawTarget) => onChoose(sameTarget(active, t) ? null : t);
  const frame = useRef<HTMLDivElement>(null);
  const ruler = useRef<HTMLDivElement>(null);
  const [widths, setWidths] = useState<{ tools: Record<string, number>; more: number } | null>(null);
  const [available, setAvailable] = useState<number | null>(null);

  // Measure the chips once drawn (again when the fonts arrive) and the room the row has.
  useLayoutEffect(() => {
    const measure = () => {
      const r = ruler.current;
      if (r) {
        const byId: Record<string, number> = {};
        r.querySelectorAll<HTMLElement>('[data-tool]').forEach((el) => (byId[el.dataset.tool!] = el.offsetWidth));
        const more = r.querySelector<HTMLElement>('[data-more]')?.offsetWidth ?? 64;
        setWidths((old) => (old && old.more === more && tools.every((t) => old.tools[t.id] === byId[t.id]) ? old : { tools: byId, more }));
      }
      if (frame.current) setAvailable(frame.current.clientWidth);
    };
    measure();
    const observer = new ResizeObserver(measure);
    if (frame.current) observer.observe(frame.current);
    if (ruler.current) observer.observe(ruler.current);
    return () => observer.disconnect();
  }, [tools]);

  // Toolbar padding (2 × 4 px) and border (2 × 1 px) come off the room.
  const split = useMemo(() => {
    if (!widths || available === null) return { row: tools.map((t) => t.id), more: [] as string[] };
    return splitToolRow(
      tools.map((t) => ({ id: t.id, width: widths.tools[t.id] ?? 0, group: t.group, rank: t.rank })),
      available - 10,
      widths.more,
      SPACING,
    );
  }, [tools, widths, available]);
  const inRow = tools.filter((t) => split.row.includes(t.id));
  const inMore = tools.filter((t) => split.more.includes(t.id));

  return (
    <div ref={frame} className="pointer-events-none relative w-full">
      {/* An invisible copy of every chip, only to measure their widths. */}
      <div aria-hidden className="invisible absolute left-0 top-0 h-0 w-0 overflow-hidden">
        <div ref={ruler} className="flex w-max gap-1">
        {tools.map((t) => (
          <span key={t.id} data-tool={t.id} className={`${CHIP} border-transparent`}>
            {t.icon}
            {t.label}
          </span>
        ))}
        <span data-more className={`${CHIP} border-rule`}>
            More <span>▾</span>
          </span>
        </div>
      </div>
      <div role="toolbar" aria-label="Drawing tools" className="pointer-events-auto inline-flex max-w-full flex-nowrap items-center gap-1 rounded-md border border-rule bg-card/95 p-1 shadow-sm">
        {inRow.map((t, i) => (
          <span key={t.id} className="contents">
            {i > 0 && inRow[i - 1]!.group !== t.group ? <span aria-hidden className="h-4 w-px shrink-0 bg-rule" /> : null}
            <Chip tool={t} active={sameTarget(active, t.target)} onClick={() => toggle(t.target)} />
          </span>
        ))}
        {inMore.length > 0 ? <MoreMenu tools={inMore} active={active} onPick={(t) => toggle(t.target)} /> : null}
      </div>
    </div>
  );
}
