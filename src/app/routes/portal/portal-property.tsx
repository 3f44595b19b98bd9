import { OfflineNotice } from '../../../components/ui/offline-notice';
import { lazy, Suspense } from 'react';
import { Link, useParams } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { KIND_STYLES, isUnitKind, type UnitKind } from '../../../../shared/domain/unit-kinds';
import type { PortalUnit } from '../../../../shared/schemas/portal';
import { usePortalProperties } from '../../../features/portal/api/get-portal-properties';
import { usePortalProperty } from '../../../features/portal/api/get-portal-property';
import { usePortalScope } from '../../../features/portal/api/portal-scope';
import { PropertySwitcher } from '../../../features/portal/components/property-switcher';
import { PortalMissing } from '../../../features/portal/components/portal-missing';
import { dayText } from '../../../features/portal/components/dates';
import { KindSwatch } from '../../../features/plan-map/components/kind-swatch';
import { Card, CautionBox, ErrorPanel, Loading } from '../../../components/ui/card';
import { ApiError } from '../../../lib/api-client';
import { formatAcres, formatFeet } from '../../../lib/format';
import { parseId } from '../../../lib/route-params';

const PortalPlanMap = lazy(() => import('./portal-plan-map'));
// recharts loads only with the chart.
const ShareChart = lazy(() => import('../../../features/portal/components/share-chart').then((m) => ({ default: m.ShareChart })));

const WORK: Record<PortalUnit['workStatus'], string> = { 'no-work': '', 'not-started': 'Not started', 'in-progress': 'Under way', done: 'Done' };

function measure(u: PortalUnit): string | null {
  if (u.family === 'area' && u.acres !== null) return formatAcres(u.acres, u.acres < 10 ? 2 : 1);
  if (u.family === 'line' && u.lengthFt !== null) return formatFeet(u.lengthFt);
  return null;
}

/** One unit in plain words: what it is, its size, what will be done, when, and how far it is. */
function UnitEntry({ unit }: { unit: PortalUnit }) {
  const kind = isUnitKind(unit.kind) ? (unit.kind as UnitKind) : null;
  const size = measure(unit);
  return (
    <li className="flex flex-col gap-1 py-3">
      <div className="flex flex-wrap items-center gap-x-2 gap-y-1">
        {kind ? <KindSwatch kind={kind} size={16} /> : null}
        <h3 className="font-semibold">{unit.name}</h3>
        <span className="text-sm text-slate">
          {kind ? KIND_STYLES[kind].label : unit.kind}
          {size ? ` · ${size}` : ''}
        </span>
        {unit.workStatus !== 'no-work' ? (
          <span className={`ml-auto rounded-full border px-2 py-0.5 text-xs font-semibold ${unit.workStatus === 'done' ? 'border-moss bg-moss/10 text-moss-deep' : 'border-rule text-ink'}`}>
            {WORK[unit.workStatus]}
            {unit.progress && unit.workStatus === 'in-progress' ? ` · ${Math.round(unit.progress.percentByCost)} %` : ''}
          </span>
        ) : null}
      </div>
      {unit.prescriptions.map((p) => (
        <div key={p.id} className="text-sm">
          <p>
            <span className="font-semibold">{p.practiceName}. </span>
            {p.summary}
          </p>
          {p.windowStart && p.windowEnd ? (
            <p className="text-slate">
              Main work window: {dayText(p.windowStart)} to {dayText(p.windowEnd)}
            </p>
          ) : null}
        </div>
      ))}
    </li>
  );
}

/** Your land: one property's plan map with legend, its units and prescriptions in plain words, the share by kind and the cautions. */
export function PortalPropertyPage() {
  const id = parseId(useParams().id);
  const scope = usePortalScope();
  const list = usePortalProperties();
  const detail = usePortalProperty(id ?? 0);
  if (id === null || (detail.error instanceof ApiError && detail.error.status === 404)) return <PortalMissing backTo={scope.links.home} />;
  if (detail.isPending) return <Loading label="Loading the plan…" />;
  if (detail.isError && !detail.data) return <ErrorPanel error={detail.error} onRetry={() => void detail.refetch()} />;
  const d = detail.data;
  const planned = d.units.filter((u) => u.prescriptions.length > 0);
  const others = d.units.filter((u) => u.prescriptions.length === 0);
  return (
    <div className="flex flex-col gap-5">
      <OfflineNotice updatedAt={detail.dataUpdatedAt} refreshFailed={detail.isRefetchError} />
      <div className="flex flex-col gap-3 sm:flex-row sm:items-start sm:justify-between">
        <div className="min-w-0">
          <nav aria-label="Breadcrumb" className="text-sm">
            <Link to={scope.links.home} className="text-moss-deep underline">
              Your land
            </Link>
          </nav>
          <h1 className="break-words text-2xl font-bold">{d.property.name}</h1>
          <p className="text-slate">
            <span className="figure text-ink">{formatAcres(d.property.acres)}</span>
            {d.property.county ? ` · ${d.property.county} County` : ''}
            {d.property.state ? `, ${d.property.state}` : ''}
          </p>
        </div>
        <PropertySwitcher properties={list.data?.properties ?? []} currentId={d.property.id} linkFor={scope.links.property} />
      </div>
      {d.property.objectives ? (
        <p>
          <span className="font-semibold">What we are working toward: </span>
          {d.property.objectives}
        </p>
      ) : null}

      <Card title="The plan map">
        <Suspense fallback={<div className="flex h-72 items-center justify-center rounded-md border border-rule bg-paper text-sm text-slate">Drawing the map…</div>}>
          <PortalPlanMap detail={d} />
        </Suspense>
      </Card>

      <Card title="How the land is used">
        <Suspense fallback={<p className="text-sm text-slate">Drawing the chart…</p>}>
          <ShareChart rows={d.shareByKind} />
        </Suspense>
      </Card>

      {scope.readOnly ? null : <Link to={paths.portalPropertyStands(d.property.id)} className="text-sm font-semibold text-moss-deep underline">Stands &amp; wind: today’s wind, the sit log and pressure</Link>}
      <Link to={scope.links.seasons(d.property.id)} className="text-sm font-semibold text-moss-deep underline">This season and last, side by side</Link>
      <Card
        title="The plan, place by place"
        action={
          <Link to={scope.links.progress(d.property.id)} className="text-sm font-semibold text-moss-deep underline">
            Progress: {Math.round(d.progress.percentByCost)} % done
          </Link>
        }
      >
        {planned.length === 0 ? <p className="text-sm text-slate">No work is written for this property yet. Your consultant will add it to the plan.</p> : null}
        <ul className="divide-y divide-rule">
          {planned.map((u) => (
            <UnitEntry key={u.id} unit={u} />
          ))}
        </ul>
        {others.length ? (
          <details className="mt-2 text-sm">
            <summary className="cursor-pointer font-semibold text-moss-deep">Other places on the map ({others.length})</summary>
            <ul className="divide-y divide-rule">
              {others.map((u) => (
                <UnitEntry key={u.id} unit={u} />
              ))}
            </ul>
          </details>
        ) : null}
      </Card>

      {d.cautions.length ? (
        <section aria-labelledby="cautions" className="flex flex-col gap-2">
          <h2 id="cautions" className="text-lg font-bold">
            Before the work: cautions that concern you
          </h2>
          {d.cautions.map((c) => (
            <CautionBox key={c.id} title={c.title}>
              <p>{c.text}</p>
            </CautionBox>
          ))}
        </section>
      ) : null}
    </div>
  );
}
