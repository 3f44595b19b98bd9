import type { ReactNode } from 'react';
import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import type { HarvestSummary, SeasonSummary } from '../../../../shared/domain/survey-estimates';
import { AGE_CLASS_LABELS, type SurveyTrendPoint } from '../../../../shared/schemas/results';
import { EmptyState } from '../../../components/ui/card';
import { formatNumber } from '../../../lib/format';

const COLORS = { buck: '#3F6B3A', doe: '#B5562B', fawn: '#C99A2E', grid: '#D9D3C3', ink: '#1F2A24' };
const AXIS = { fontSize: 12, fill: '#5B6770' };

/** A chart with its caption and the same figures as a table for screen readers. */
function ChartFigure({ title, caption, table, children }: { title: string; caption?: string; table: { head: string[]; rows: (string | number)[][] }; children: ReactNode }) {
  return (
    <figure className="flex min-w-0 flex-col gap-2" aria-label={title}>
      <figcaption>
        <span className="font-serif text-sm font-bold text-ink">{title}</span>
        {caption ? <span className="block text-xs text-slate">{caption}</span> : null}
      </figcaption>
      <div className="h-56 w-full overflow-hidden" aria-hidden>
        {children}
      </div>
      {/* A table box grows to its content whatever its width, so the visually-hidden wrapper is a div. */}
      <div className="sr-only">
        <table>
          <caption>{title}</caption>
          <thead>
            <tr>{table.head.map((h) => <th key={h}>{h}</th>)}</tr>
          </thead>
          <tbody>
            {table.rows.map((r, i) => (
              <tr key={i}>{r.map((c, j) => <td key={j}>{c}</td>)}</tr>
            ))}
          </tbody>
        </table>
      </div>
    </figure>
  );
}

/** Estimated bucks, does and fawns from each season's latest survey, season over season. */
export function SurveyTrendChart({ trend }: { trend: readonly SurveyTrendPoint[] }) {
  if (trend.length === 0) return <EmptyState title="No survey yet">Record a camera survey to see the herd season over season.</EmptyState>;
  const data = trend.map((t) => ({ label: t.label, bucks: Math.round(t.bucks), does: Math.round(t.does), fawns: Math.round(t.fawns) }));
  return (
    <ChartFigure
      title="Estimated deer by season"
      caption="Each season’s latest camera survey."
      table={{ head: ['Season', 'Bucks', 'Does', 'Fawns', 'Deer per mi²'], rows: trend.map((t) => [t.label, Math.round(t.bucks), Math.round(t.does), Math.round(t.fawns), formatNumber(t.deerPerSqMi, 1)]) }}
    >
      <ResponsiveContainer width="100%" height="100%">
        <BarChart data={data} margin={{ top: 8, right: 8, bottom: 0, left: -16 }}>
          <CartesianGrid stroke={COLORS.grid} vertical={false} />
          <XAxis dataKey="label" tick={AXIS} />
          <YAxis allowDecimals={false} tick={AXIS} />
          <Tooltip />
          <Legend />
          <Bar dataKey="bucks" name="Bucks" fill={COLORS.buck} isAnimationActive={false} />
          <Bar dataKey="does" name="Does" fill={COLORS.doe} isAnimationActive={false} />
          <Bar dataKey="fawns" name="Fawns" fill={COLORS.fawn} isAnimationActive={false} />
        </BarChart>
      </ResponsiveContainer>
    </ChartFigure>
  );
}

/** Deer per square mile and does per buck from each season's survey. */
export function SurveyRatioChart({ trend }: { trend: readonly SurveyTrendPoint[] }) {
  if (trend.length === 0) return null;
  const data = trend.map((t) => ({ label: t.label, doesPerBuck: Math.round(t.buckDoeRatio * 10) / 10, fawnsPerDoe: t.fawnDoeRatio === null ? null : Math.round(t.fawnDoeRatio * 100) / 100 }));
  return (
    <ChartFigure
      title="Does per buck and fawns per doe (surveys)"
      table={{ head: ['Season', 'Does per buck', 'Fawns per doe'], rows: data.map((d) => [d.label, d.doesPerBuck, d.fawnsPerDoe ?? 'n/a']) }}
    >
      <ResponsiveContainer width="100%" height="100%">
        <BarChart data={data} margin={{ top: 8, right: 8, bottom: 0, left: -16 }}>
          <CartesianGrid stroke={COLORS.grid} vertical={false} />
          <XAxis dataKey="label" tick={AXIS} />
          <YAxis tick={AXIS} />
          <Tooltip />
          <Legend />
          <Bar dataKey="doesPerBuck" name="Does per buck" fill={COLORS.doe} isAnimationActive={false} />
          <Bar dataKey="fawnsPerDoe" name="Fawns per doe" fill={COLORS.fawn} isAnimationActive={false} />
        </BarChart>
      </ResponsiveContainer>
    </ChartFigure>
  );
}

/** Bucks and does taken by age class. */
export function AgeStructureChart({ summary }: { summary: HarvestSummary }) {
  if (summary.total === 0) return <EmptyState title="No harvest recorded">Add the deer taken this season to see the age structure.</EmptyState>;
  // The axis takes the short form of the oldest class so that the labels fit a phone's width.
  const data = summary.ageClasses.map((c) => ({ label: c.ageClass === '5.5+' ? '5½+' : AGE_CLASS_LABELS[c.ageClass], bucks: c.bucks, does: c.does }));
  return (
    <ChartFigure title="Harvest by age class" caption="All seasons recorded." table={{ head: ['Age class', 'Bucks', 'Does'], rows: data.map((d) => [d.label, d.bucks, d.does]) }}>
      <ResponsiveContainer width="100%" height="100%">
        <BarChart data={data} margin={{ top: 8, right: 8, bottom: 0, left: -16 }}>
          <CartesianGrid stroke={COLORS.grid} vertical={false} />
          <XAxis dataKey="label" tick={AXIS} interval={0} />
          <YAxis allowDecimals={false} tick={AXIS} />
          <Tooltip />
          <Legend />
          <Bar dataKey="bucks" name="Bucks" fill={COLORS.buck} isAnimationActive={false} />
          <Bar dataKey="does" name="Does" fill={COLORS.doe} isAnimationActive={false} />
        </BarChart>
      </ResponsiveContainer>
    </ChartFigure>
  );
}

/** Adult does taken per adult buck, season by season. */
export function BuckDoeTrendChart({ seasons }: { seasons: readonly SeasonSummary[] }) {
  const rows = seasons.filter((s) => s.doesPerBuck !== null);
  if (rows.length === 0) return null;
  const data = rows.map((s) => ({ label: s.label, doesPerBuck: Math.round((s.doesPerBuck ?? 0) * 10) / 10 }));
  return (
    <ChartFigure
      title="Harvest buck:doe by season"
      caption="Adult does taken per adult buck (fawns left out)."
      table={{ head: ['Season', 'Buck:doe', 'Bucks', 'Does'], rows: rows.map((s) => [s.label, s.buckDoeRatio, s.adultBucks, s.adultDoes]) }}
    >
      <ResponsiveContainer width="100%" height="100%">
        <BarChart data={data} margin={{ top: 8, right: 8, bottom: 0, left: -16 }}>
          <CartesianGrid stroke={COLORS.grid} vertical={false} />
          <XAxis dataKey="label" tick={AXIS} />
          <YAxis tick={AXIS} />
          <Tooltip />
          <Bar dataKey="doesPerBuck" name="Does per buck" fill={COLORS.doe} isAnimationActive={false} />
        </BarChart>
      </ResponsiveContainer>
    </ChartFigure>
  );
}
