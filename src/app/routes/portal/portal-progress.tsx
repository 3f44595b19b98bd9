import { Link, Navigate, useParams } from 'react-router-dom';
import { KIND_STYLES, isUnitKind, type UnitKind } from '../../../../shared/domain/unit-kinds';
import { usePortalProperties } from '../../../features/portal/api/get-portal-properties';
import { usePortalProperty } from '../../../features/portal/api/get-portal-property';
import { usePortalScope } from '../../../features/portal/api/portal-scope';
import { PropertySwitcher } from '../../../features/portal/components/property-switcher';
import { ProgressRing } from '../../../features/portal/components/progress-ring';
import { TaskTimeline } from '../../../features/portal/components/task-timeline';
import { PortalMissing } from '../../../features/portal/components/portal-missing';
import { KindSwatch } from '../../../features/plan-map/components/kind-swatch';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { ApiError } from '../../../lib/api-client';
import { parseId } from '../../../lib/route-params';
import { PlotChecksCard } from '../../../features/checks/components/plot-checks-card';

/** /portal/progress: the first property's progress (the switcher moves between properties). */
export function PortalProgressHomePage() {
  const scope = usePortalScope();
  const list = usePortalProperties();
  if (list.isPending) return <Loading />;
  if (list.isError) return <ErrorPanel error={list.error} onRetry={() => void list.refetch()} />;
  const first = list.data.properties[0];
  if (!first) return <EmptyState title="No property shared with you yet">Progress appears here once your consultant schedules the work.</EmptyState>;
  return <Navigate to={scope.links.progress(first.id)} replace />;
}

/** Progress: percent done, each place's ring and the crew's photos, and the season's timeline. */
export function PortalProgressPage() {
  const id = parseId(useParams().id);
  const scope = usePortalScope();
  const list = usePortalProperties();
  const detail = usePortalProperty(id ?? 0);
  if (id === null || (detail.error instanceof ApiError && detail.error.status === 404)) return <PortalMissing backTo={scope.links.home} />;
  if (detail.isPending) return <Loading label="Loading the progress…" />;
  if (detail.isError) return <ErrorPanel error={detail.error} onRetry={() => void detail.refetch()} />;
  const d = detail.data;
  const withWork = d.units.filter((u) => u.progress);
  const photosByUnit = withWork
    .map((u) => ({ unit: u, photos: d.tasks.filter((t) => t.unitId === u.id).flatMap((t) => t.photos.map((p) => ({ ...p, task: t.name }))) }))
    .filter((g) => g.photos.length > 0);
  const p = d.progress;
  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-col gap-3 sm:flex-row sm:items-start sm:justify-between">
        <div className="min-w-0">
          <nav aria-label="Breadcrumb" className="text-sm">
            <Link to={scope.links.property(d.property.id)} className="text-moss-deep underline">
              {d.property.name}
            </Link>
          </nav>
          <h1 className="text-2xl font-bold">Progress</h1>
        </div>
        <PropertySwitcher properties={list.data?.properties ?? []} currentId={d.property.id} linkFor={scope.links.progress} />
      </div>

      {p.total === 0 ? (
        <EmptyState title="No work scheduled yet">Once you approve a proposal, your consultant schedules the work and you can follow it here.</EmptyState>
      ) : (
        <>
          <Card>
            <div className="flex items-center gap-4">
              <ProgressRing percent={p.percentByCost} size={88} label={`${d.property.name} this season`} />
              <div>
                <p className="figure text-2xl font-bold text-moss-deep" data-figure="percent-done">
                  {Math.round(p.percentByCost)} % done
                </p>
                <p className="text-sm text-slate">
                  {p.done} of {p.total - p.skipped} steps finished{p.skipped ? `, ${p.skipped} skipped` : ''}. The share counts each step by its part of the work.
                </p>
              </div>
            </div>
          </Card>

          <PlotChecksCard propertyId={d.property.id} />

          <Card title="Place by place">
            <ul className="grid gap-3 sm:grid-cols-2">
              {withWork.map((u) => {
                const kind = isUnitKind(u.kind) ? (u.kind as UnitKind) : null;
                return (
                  <li key={u.id} className="flex items-center gap-3 rounded border border-rule p-2">
                    <ProgressRing percent={u.progress!.percentByCost} size={48} label={u.name} />
                    <div className="min-w-0">
                      <p className="flex items-center gap-2 font-semibold">
                        {kind ? <KindSwatch kind={kind} size={14} /> : null}
                        <span className="break-words">{u.name}</span>
                      </p>
                      <p className="text-sm text-slate">
                        {kind ? KIND_STYLES[kind].label : u.kind} · {u.progress!.done} of {u.progress!.total - u.progress!.skipped} steps done
                      </p>
                    </div>
                  </li>
                );
              })}
            </ul>
          </Card>

          <Card title="Photos from the crew">
            {photosByUnit.length === 0 ? (
              <p className="text-sm text-slate">The crew adds photos when they finish a step; none yet.</p>
            ) : (
              <div className="flex flex-col gap-4">
                {photosByUnit.map((g) => (
                  <section key={g.unit.id} aria-label={`Photos of ${g.unit.name}`}>
                    <h3 className="mb-2 font-semibold">{g.unit.name}</h3>
                    <ul className="grid grid-cols-2 gap-2 sm:grid-cols-4">
                      {g.photos.map((ph) => (
                        <li key={ph.id}>
                          <a href={ph.url} target="_blank" rel="noreferrer" className="block rounded focus:outline-none focus:ring-2 focus:ring-moss">
                            <img src={ph.url} alt={`Crew photo: ${ph.task} on ${g.unit.name}`} loading="lazy" className="aspect-[3/2] w-full rounded border border-rule object-cover" />
                          </a>
                        </li>
                      ))}
                    </ul>
                  </section>
                ))}
              </div>
            )}
          </Card>

          <Card title="The season, step by step">
            <TaskTimeline tasks={d.tasks} />
          </Card>
        </>
      )}
    </div>
  );
}
