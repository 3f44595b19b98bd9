import type { PressureRow } from '../../../../shared/schemas/hunting';
import { formatDate } from '../../../../shared/domain/clock';

/** Pressure per stand this season: sits, hours, days rested, deer per hour, sits on a wrong wind. */
export function PressureTable({ rows, maxSitsPerWeek }: { rows: PressureRow[]; maxSitsPerWeek: number }) {
  const over = rows.filter((r) => r.overPressured);
  return (
    <div className="flex flex-col gap-2">
      {over.map((r) => (
        <p key={r.unitId} role="alert" className="rounded border-l-4 border-clay bg-clay/5 px-3 py-2 text-sm">
          “{r.name}” was sat {r.sitsThisWeek} times in the last 7 days (more than {maxSitsPerWeek}): rest it so deer do not learn to avoid it.
        </p>
      ))}
      <div className="overflow-x-auto">
        <table className="w-full text-left text-sm">
          <thead>
            <tr className="border-b border-rule">
              <th className="py-1 pr-3">Stand</th><th className="pr-3">Sits</th><th className="pr-3">Hours</th><th className="pr-3">Last sat</th><th className="pr-3">Days rested</th><th className="pr-3">Deer / hour</th><th>On a wrong wind</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.unitId} className="border-b border-rule/60">
                <td className="py-1 pr-3">{r.name}</td>
                <td className="pr-3 tabular-nums">{r.sits}</td>
                <td className="pr-3 tabular-nums">{r.hours}</td>
                <td className="pr-3">{r.lastSitOn ? formatDate(r.lastSitOn) : '—'}</td>
                <td className="pr-3 tabular-nums">{r.daysSinceLastSit ?? '—'}</td>
                <td className="pr-3 tabular-nums">{r.deerPerHour ?? '—'}</td>
                <td className="tabular-nums">{r.sitsOnUnsuitableWind}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
