import { Card } from '../../../components/ui/card';
import { formatDay } from '../../../lib/firm-clock';
import { usePlotStatuses } from '../api/get-plot-statuses';
import { PlotStatusBadge } from './plot-status-badge';

/** Read-only: how each checked plot came up or is browsed, for the portal's Progress. Nothing until a plot is checked. */
export function PlotChecksCard({ propertyId }: { propertyId: number }) {
  const statuses = usePlotStatuses(propertyId);
  if (!statuses.data || statuses.data.length === 0) return null;
  return (
    <Card title="How the plots are doing">
      <ul className="flex flex-col gap-2 text-sm">
        {statuses.data.map((s) => (
          <li key={s.unitId} className="flex flex-wrap items-center justify-between gap-2">
            <span>{s.unitName}</span>
            <span className="flex items-center gap-2">
              <span className="text-xs text-slate">checked {formatDay(s.checkedOn)}</span>
              <PlotStatusBadge status={s.status} />
            </span>
          </li>
        ))}
      </ul>
    </Card>
  );
}
