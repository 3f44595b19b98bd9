import { Link, useNavigate } from 'react-router-dom';
import { usePlotStatuses } from '../api/get-plot-statuses';
import { useCheckableUnits } from '../hooks/use-checkable-units';
import { PlotStatusBadge } from './plot-status-badge';
import { formatDay } from '../../../lib/firm-clock';
import { paths } from '../../../config/paths';

/**
 * The latest check of each plot of a property, for the plan map's ledger: one line per checked unit
 * with its status, and a picker that opens any area unit's page to record a check.
 */
export function PlotStatusPanel({ propertyId }: { propertyId: number }) {
  const statuses = usePlotStatuses(propertyId);
  const units = useCheckableUnits(propertyId);
  const navigate = useNavigate();
  return (
    <section aria-labelledby={`plot-checks-${propertyId}`} className="mt-4 border-t border-rule pt-3">
      <h2 id={`plot-checks-${propertyId}`} className="mb-2 text-sm font-bold text-ink">
        Plot checks
      </h2>
      {statuses.data && statuses.data.length > 0 ? (
        <ul className="mb-2 flex flex-col gap-1.5 text-sm">
          {statuses.data.map((s) => (
            <li key={s.unitId} className="flex items-center justify-between gap-2">
              <Link to={paths.unitChecks(propertyId, s.unitId)} className="text-moss underline-offset-2 hover:underline">
                {s.unitName}
              </Link>
              <span className="flex items-center gap-2">
                <span className="text-xs text-slate">{formatDay(s.checkedOn)}</span>
                <PlotStatusBadge status={s.status} />
              </span>
            </li>
          ))}
        </ul>
      ) : null}
      {units.length > 0 ? (
        <label className="flex flex-col gap-1 text-sm">
          <span className="text-slate">Record a check on</span>
          <select className="rounded border border-rule bg-white px-2 py-1.5" value="" onChange={(e) => e.target.value && navigate(paths.unitChecks(propertyId, e.target.value))}>
            <option value="">Choose a unit…</option>
            {units.map((u) => (
              <option key={u.id} value={u.id}>
                {u.name}
              </option>
            ))}
          </select>
        </label>
      ) : null}
      <Link to={paths.nextSeason(propertyId)} className="mt-3 inline-block text-sm text-moss underline-offset-2 hover:underline">
        Plan next season
      </Link>
    </section>
  );
}
