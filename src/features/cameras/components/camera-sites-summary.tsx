/**
 * The camera summary by site: camera-nights summed over every deployment at a site, independent
 * events by kind and per 100 camera-nights, and an activity-by-hour chart (24 bars on the firm's
 * clock) for a chosen site and kind.
 */
import { lazy, Suspense, useState } from 'react';
import type { CameraSitesAnswer } from '../../../../shared/schemas/cameras';
import { useCameraSites } from '../api/cameras';
import { ErrorPanel, Loading } from '../../../components/ui/card';

const HourChart = lazy(() => import('./hour-chart'));

type Kind = keyof CameraSitesAnswer['data'][number]['eventsByKind'];
const KINDS: { key: Kind; label: string; colour: string }[] = [
  { key: 'deer', label: 'Deer', colour: '#3F6B3A' },
  { key: 'other-species', label: 'Other species', colour: '#3C7A9E' },
  { key: 'person', label: 'People', colour: '#B5562B' },
];
const rate = (v: number | null) => (v === null ? '—' : v.toFixed(1));
const pct = (v: number | null) => (v === null ? '—' : `${Math.round(v * 100)} %`);

/** Sites of a property, summed over their deployments, with the hour chart. */
export function CameraSitesSummary({ propertyId }: { propertyId: number }) {
  const sites = useCameraSites(propertyId);
  const [siteId, setSiteId] = useState<number | null>(null);
  const [kind, setKind] = useState<Kind>('deer');
  if (sites.isPending) return <Loading label="Adding up the sites…" />;
  if (sites.isError) return <ErrorPanel error={sites.error} />;
  const { data, meta } = sites.data;
  if (data.length === 0) return <p className="text-sm text-slate">No camera has been set at a camera site yet.</p>;
  const chosen = data.find((s) => s.unitId === siteId) ?? data[0]!;
  const kindInfo = KINDS.find((k) => k.key === kind)!;
  const input = 'rounded border border-rule bg-card px-2 py-1 text-sm';
  return (
    <div className="flex flex-col gap-4">
      <div className="overflow-x-auto">
        <table className="w-full text-sm tabular-nums" aria-label="Camera sites, all deployments">
          <thead className="text-left text-slate">
            <tr className="border-b border-rule">
              <th className="py-1 pr-3 font-normal">Site</th>
              <th className="py-1 pr-3 text-right font-normal">Deployments</th>
              <th className="py-1 pr-3 text-right font-normal">Camera-nights</th>
              <th className="py-1 pr-3 text-right font-normal">Deer events</th>
              <th className="py-1 pr-3 text-right font-normal">Deer per 100 camera-nights</th>
              <th className="py-1 pr-3 text-right font-normal">Other species</th>
              <th className="py-1 pr-3 text-right font-normal">People</th>
              <th className="py-1 text-right font-normal">Deer in daylight</th>
            </tr>
          </thead>
          <tbody>
            {data.map((s) => (
              <tr key={s.unitId} className="border-b border-rule/60">
                <th scope="row" className="py-1 pr-3 text-left font-semibold">{s.name}</th>
                <td className="py-1 pr-3 text-right">{s.deploymentCount}</td>
                <td className="py-1 pr-3 text-right">{s.cameraNights}</td>
                <td className="py-1 pr-3 text-right">{s.eventsByKind.deer}</td>
                <td className="py-1 pr-3 text-right font-semibold">{rate(s.eventsPer100CameraNights.deer)}</td>
                <td className="py-1 pr-3 text-right">{s.eventsByKind['other-species']}</td>
                <td className="py-1 pr-3 text-right">{s.eventsByKind.person}</td>
                <td className="py-1 text-right">{pct(s.deerDaylightShare)}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <p className="mt-1 text-xs text-slate">
          Camera-nights add up every camera that ran at the site; photos of one kind within {meta.gapMinutes} min of each other at a site count as one event.
        </p>
      </div>
      <section aria-label="Activity by hour" className="flex flex-col gap-2">
        <div className="flex flex-wrap items-end gap-3">
          <h3 className="mr-auto text-sm font-semibold">Activity by hour</h3>
          <label className="flex flex-col gap-1 text-xs text-slate">
            Site
            <select className={input} value={chosen.unitId} onChange={(e) => setSiteId(Number(e.target.value))}>
              {data.map((s) => (
                <option key={s.unitId} value={s.unitId}>{s.name}</option>
              ))}
            </select>
          </label>
          <label className="flex flex-col gap-1 text-xs text-slate">
            Kind
            <select className={input} value={kind} onChange={(e) => setKind(e.target.value as Kind)}>
              {KINDS.map((k) => (
                <option key={k.key} value={k.key}>{k.label}</option>
              ))}
            </select>
          </label>
        </div>
        <Suspense fallback={<div className="h-52" />}>
          <HourChart counts={chosen.byHour[kind]} colour={kindInfo.colour} label={`${kindInfo.label} events by hour at ${chosen.name} (${meta.timezone} time)`} />
        </Suspense>
        <p className="text-xs text-slate">
          {chosen.eventsByKind[kind]} {kindInfo.label.toLowerCase()} event{chosen.eventsByKind[kind] === 1 ? '' : 's'} by the hour each began, {meta.timezone} time ({rate(chosen.eventsPer100CameraNights[kind])} per 100 camera-nights).
        </p>
      </section>
    </div>
  );
}
