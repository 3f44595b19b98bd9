/**
 * The planner's own map: a tile-free SVG of the bedding areas, sanctuaries, food plots, access routes
 * and stands, drawn through the shared projection (`shared/domain/map-projection.ts`, as the PDF plan
 * map and the field sketch are), with each stand's downwind scent cone for the chosen wind, or — in
 * the season view — each stand sized by its sits and coloured when it is over-pressured.
 */
import type { Geometry } from 'geojson';
import { extentOfPositions, fitProjection, positionsOf } from '../../../../shared/domain/map-projection';
import { coneRing, METRES_PER_YARD } from '../../../../shared/domain/scent';
import { downwindBearing, windDegrees, type WindName } from '../../../../shared/domain/stand-winds';
import { KIND_STYLES, type UnitKind } from '../../../../shared/domain/unit-kinds';
import type { PressureRow, StandWindsAnswer } from '../../../../shared/schemas/hunting';

const W = 640;
const H = 420;
/** Room on every side of the drawing, in SVG units. */
const PADDING = 12;
/** A lone stand (no boundary, nothing else) still gets a map this many metres across (common practice, no source). */
const MIN_SPAN_M = 200;

/** The stands-and-wind map as an SVG figure with its caption; nothing when the property has no geometry to draw. */
export function StandWindMap({ answer, wind, pressure, highlightRouteIds = [], title }: { answer: StandWindsAnswer; wind?: WindName | null; pressure?: PressureRow[]; highlightRouteIds?: number[]; title: string }) {
  const drawn: Geometry[] = answer.meta.layout.map((u) => u.geometry);
  if (answer.meta.boundary) drawn.push(answer.meta.boundary);
  const extent = extentOfPositions(drawn.flatMap((g) => [...positionsOf(g)]));
  if (!extent) return null;
  // The shared projection (north up, one scale on both axes, rings drawn as given whatever their winding).
  const projection = fitProjection(extent, { x: 0, y: 0, width: W, height: H }, { padding: PADDING, minSpanM: MIN_SPAN_M, digits: 3 });
  const path = (g: Geometry) => projection.path(g);
  const s = answer.meta.settings;
  const byStand = new Map(answer.data.map((d) => [d.unitId, d]));
  const pressureBy = new Map((pressure ?? []).map((p) => [p.unitId, p]));
  const maxSits = Math.max(1, ...(pressure ?? []).map((p) => p.sits));
  const areas = answer.meta.layout.filter((u) => KIND_STYLES[u.kind as UnitKind]?.family === 'area');
  const routes = answer.meta.layout.filter((u) => u.kind === 'access-route');
  const stands = answer.meta.layout.filter((u) => u.kind === 'stand-site' && u.geometry.type === 'Point');

  return (
    <figure className="m-0">
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-label={title} className="h-auto w-full rounded border border-rule bg-[#F3EEDF]">
        {answer.meta.boundary ? <path d={path(answer.meta.boundary)} fill="none" stroke="#1F2A24" strokeWidth={1.5} strokeDasharray="6 3" /> : null}
        {areas.map((u) => {
          const st = KIND_STYLES[u.kind as UnitKind];
          return <path key={u.id} d={path(u.geometry)} fill={st.fill} fillOpacity={st.fillOpacity + 0.15} stroke={st.stroke} strokeWidth={1.2} strokeDasharray={st.dash === 'dashed' ? '5 3' : undefined}><title>{`${st.label}: ${u.name}`}</title></path>;
        })}
        {wind && !pressure
          ? stands.map((u) => {
              const judged = byStand.get(u.id)?.winds.find((w) => w.from === wind);
              const ring = coneRing({ apex: (u.geometry as unknown as { coordinates: number[] }).coordinates, bearingDeg: downwindBearing(windDegrees(wind)), halfAngleDeg: s.coneHalfAngleDeg, reachM: s.coneReachYd * METRES_PER_YARD });
              return <path key={`cone-${u.id}`} d={path({ type: 'Polygon', coordinates: [ring] })} fill={judged?.suitable ? '#3F6B3A' : '#B5562B'} fillOpacity={0.18} stroke={judged?.suitable ? '#3F6B3A' : '#B5562B'} strokeWidth={0.8} />;
            })
          : null}
        {routes.map((u) => {
          const on = highlightRouteIds.includes(u.id);
          return <path key={u.id} d={path(u.geometry)} fill="none" stroke={on ? '#2E5029' : '#6B4F2A'} strokeWidth={on ? 4 : 2} strokeDasharray={on ? undefined : '6 4'}><title>{`Access route: ${u.name}`}</title></path>;
        })}
        {stands.map((u) => {
          const [lon, lat] = (u.geometry as unknown as { coordinates: [number, number] }).coordinates;
          const [x, y] = projection.project(lon, lat);
          const p = pressureBy.get(u.id);
          const suitable = wind ? byStand.get(u.id)?.winds.find((w) => w.from === wind)?.suitable : undefined;
          const r = pressure ? 6 + 10 * Math.sqrt((p?.sits ?? 0) / maxSits) : 7;
          const fill = pressure ? (p?.overPressured ? '#B5562B' : '#2E5029') : suitable === false ? '#B5562B' : '#2E5029';
          return (
            <g key={u.id} transform={`translate(${x},${y})`}>
              <path d={`M0,${-r} L${r * 0.9},${r * 0.7} L${-r * 0.9},${r * 0.7} Z`} fill={fill} stroke="#FFFDF7" strokeWidth={1.5} />
              <text x={r + 3} y={4} fontSize={12} fill="#1F2A24" stroke="#FFFDF7" strokeWidth={3} paintOrder="stroke">
                {pressure && p ? `${u.name} · ${p.sits} sits` : u.name}
              </text>
            </g>
          );
        })}
        <g transform={`translate(${W - 30},34)`} aria-hidden="true">
          <path d="M0,-18 L6,0 L0,-5 L-6,0 Z" fill="#1F2A24" />
          <text y={14} textAnchor="middle" fontSize={12} fill="#1F2A24">N</text>
        </g>
      </svg>
      <figcaption className="mt-1 text-xs text-slate">
        {pressure ? 'Season view: each stand sized by its sits; clay when sat more than the weekly limit.' : wind ? `Shaded: each stand’s downwind scent (${s.coneHalfAngleDeg}° either side, ${s.coneReachYd} yd) with the wind from ${wind}. Green suits it; clay does not. Bold lines: the way to walk in.` : 'Pick a wind to see each stand’s scent.'}
      </figcaption>
    </figure>
  );
}
