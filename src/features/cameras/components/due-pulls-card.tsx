import { Card } from '../../../components/ui/card';
import { formatDay } from '../../../lib/firm-clock';
import { useDuePulls } from '../api/cameras';

/** Cameras whose card is due for a pull (the firm's interval, default 21 days), with the access route to walk in on. */
export function DuePullsCard({ linkTo }: { linkTo?: (propertyId: number) => string }) {
  const due = useDuePulls();
  if (!due.data || due.data.length === 0) return null;
  return (
    <Card title="Cards to pull">
      <ul className="flex flex-col gap-2 text-sm" aria-label="Cards to pull">
        {due.data.map((d) => (
          <li key={d.deploymentId} className="flex flex-col">
            <span className="font-semibold">
              {linkTo ? <a href={linkTo(d.propertyId)} className="text-moss-deep hover:underline">{d.cameraLabel} at {d.unitName}</a> : `${d.cameraLabel} at ${d.unitName}`}
              <span className="font-normal text-slate"> · {d.propertyName}</span>
            </span>
            <span className="text-slate">
              {d.daysSince} days since {formatDay(d.since)} (due {formatDay(d.dueOn)})
              {d.accessRoute ? ` · walk in on ${d.accessRoute.name} (${d.accessRoute.distanceFt.toLocaleString('en-US')} ft from the camera)` : ' · no access route on the plan'}
            </span>
          </li>
        ))}
      </ul>
    </Card>
  );
}
