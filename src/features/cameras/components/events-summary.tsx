import { useDeploymentEvents } from '../api/cameras';

const pct = (v: number | null) => (v === null ? '—' : `${Math.round(v * 100)} %`);

/** A deployment's numbers: independent deer events, camera-nights, events per 100 camera-nights and when deer moved. */
export function EventsSummary({ deploymentId }: { deploymentId: number }) {
  const events = useDeploymentEvents(deploymentId);
  if (!events.data) return null;
  const e = events.data;
  return (
    <dl className="grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-4" aria-label="Events of this deployment">
      <dt className="text-slate">Deer events</dt>
      <dd className="font-semibold tabular-nums" data-testid="event-count">{e.eventCount}</dd>
      <dt className="text-slate">Camera-nights</dt>
      <dd className="tabular-nums">{e.cameraNights}</dd>
      <dt className="text-slate">Per 100 camera-nights</dt>
      <dd className="tabular-nums">{e.eventsPer100CameraNights === null ? '—' : e.eventsPer100CameraNights.toFixed(1)}</dd>
      <dt className="text-slate">In daylight</dt>
      <dd className="tabular-nums">{pct(e.activity.daylightShare)}</dd>
      <dt className="text-slate">Dawn · day · dusk · night</dt>
      <dd className="tabular-nums sm:col-span-3">
        {e.activity.bySun.dawn} · {e.activity.bySun.day} · {e.activity.bySun.dusk} · {e.activity.bySun.night}
        <span className="text-slate"> (events within {e.gapMinutes} min at this site count once)</span>
      </dd>
    </dl>
  );
}
