import type { DeskSummary } from '../../../../shared/schemas/desk';
import { firmToday } from '../../../lib/firm-clock';
import { formatDateSpan } from '../../../../shared/domain/clock';

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** Day of the year of an ISO date, clamped to `year`. */
function dayOf(iso: string, year: number): number {
  const t = Date.parse(`${iso}T00:00:00Z`);
  const start = Date.UTC(year, 0, 1);
  const end = Date.UTC(year + 1, 0, 1);
  return (Math.min(Math.max(t, start), end) - start) / 86_400_000;
}

/** The months of the year with each practice's window shaded, and today marked in clay. */
export function SeasonStrip({ season }: { season: DeskSummary['season'] }) {
  const daysInYear = (Date.UTC(season.year + 1, 0, 1) - Date.UTC(season.year, 0, 1)) / 86_400_000;
  const todayPct = (dayOf(firmToday(), season.year) / daysInYear) * 100;
  const rows = [...season.windows].sort((a, b) => a.earliest.localeCompare(b.earliest));
  return (
    <figure aria-label={`Planting windows for ${season.year}`} className="overflow-x-auto">
      <div className="min-w-[640px]">
        <div className="flex text-xs text-slate">
          <span className="w-48 shrink-0" />
          <div className="grid flex-1 grid-cols-12 border-b border-rule">
            {MONTHS.map((m) => (
              <span key={m} className="border-l border-rule/70 px-1 py-1">{m}</span>
            ))}
          </div>
        </div>
        <ul>
          {rows.map((w) => {
            const from = (dayOf(w.earliest, season.year) / daysInYear) * 100;
            const to = (dayOf(w.latest, season.year) / daysInYear) * 100;
            return (
              <li key={w.practiceName} className="flex items-center border-b border-rule/40 py-0.5 text-xs">
                <span className="w-48 shrink-0 truncate pr-2 text-ink" title={w.practiceName}>{w.practiceName}</span>
                <span className="relative h-3 flex-1">
                  <span className="absolute inset-y-0 rounded-sm bg-moss/40" style={{ left: `${from}%`, width: `${Math.max(0.6, to - from)}%` }} title={formatDateSpan(w.earliest, w.latest)} />
                  <span aria-hidden className="absolute inset-y-[-2px] w-px bg-clay" style={{ left: `${todayPct}%` }} />
                </span>
              </li>
            );
          })}
        </ul>
        <figcaption className="mt-1 text-xs text-slate">
          Windows of your practices in the {season.region} region, {season.year}. The clay line is today.
        </figcaption>
      </div>
    </figure>
  );
}
