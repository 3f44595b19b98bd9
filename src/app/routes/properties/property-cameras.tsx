import { useState } from 'react';
import { useParams } from 'react-router-dom';
import { Card, ErrorPanel, Loading } from '../../../components/ui/card';
import { PageHeader } from '../../../components/ui/page-header';
import { Button } from '../../../components/ui/button';
import { parseId } from '../../../lib/route-params';
import { formatDay } from '../../../lib/firm-clock';
import { paths } from '../../../config/paths';
import { useResults } from '../../../features/results/api/get-results';
import { useBucks, useCameras, useCreatePull, useEndDeployment, usePropertyDeployments } from '../../../features/cameras/api/cameras';
import { DeployForm } from '../../../features/cameras/components/deploy-form';
import { CardUpload } from '../../../features/cameras/components/card-upload';
import { ReviewGrid } from '../../../features/cameras/components/review-grid';
import { EventsSummary } from '../../../features/cameras/components/events-summary';
import { BuckRoster } from '../../../features/cameras/components/buck-roster';
import { CameraSitesSummary } from '../../../features/cameras/components/camera-sites-summary';
import { PhotoSurveyForm } from '../../../features/cameras/components/photo-survey-form';
import { firmToday } from '../../../lib/firm-clock';

/** A property's cameras: deployments and card pulls, bringing a card in, the review grid, the numbers, the roster and a survey from photos. */
export function PropertyCamerasPage() {
  const id = parseId(useParams().id) ?? 0;
  const results = useResults(id);
  const deployments = usePropertyDeployments(id);
  const cameras = useCameras();
  const bucks = useBucks(id);
  const pull = useCreatePull();
  const end = useEndDeployment();
  const [open, setOpen] = useState<number | null>(null);
  if (results.isPending || deployments.isPending || cameras.isPending) return <Loading label="Loading cameras…" />;
  if (results.isError) return <ErrorPanel error={results.error} />;
  if (deployments.isError) return <ErrorPanel error={deployments.error} />;
  const property = results.data.property;
  const list = deployments.data;
  const roster = bucks.data ?? [];
  const current = open ?? list[0]?.id ?? null;
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title={`Cameras — ${property.name}`} crumbs={[{ label: 'Properties', to: paths.properties }, { label: property.name, to: paths.property(property.id) }]}>
        Trail cameras, their cards and what they saw
      </PageHeader>
      <Card title="Set a camera">
        <DeployForm cameras={cameras.data ?? []} sites={results.data.cameraSites} />
      </Card>
      <Card title="Deployments">
        {list.length === 0 ? <p className="text-sm text-slate">No camera has been set on this property yet.</p> : null}
        <ul className="flex flex-col gap-2">
          {list.map((d) => (
            <li key={d.id} className={`flex flex-wrap items-center gap-3 rounded border p-2 text-sm ${d.id === current ? 'border-moss' : 'border-rule'}`}>
              <button type="button" className="font-semibold text-moss-deep hover:underline" onClick={() => setOpen(d.id)} aria-pressed={d.id === current}>
                {d.cameraLabel} at {d.unitName}
              </button>
              <span className="text-slate">
                {formatDay(d.startedOn)} – {d.endedOn ? formatDay(d.endedOn) : 'running'} · {d.mode} · {d.photoCount} photos
                {d.lastPulledOn ? ` · card pulled ${formatDay(d.lastPulledOn)}` : ''}
              </span>
              {!d.endedOn ? (
                <>
                  <Button size="sm" variant="secondary" onClick={() => pull.mutate({ deploymentId: d.id, input: { pulledOn: firmToday() } })}>
                    Card pulled today
                  </Button>
                  <Button size="sm" variant="ghost" onClick={() => end.mutate({ id: d.id, endedOn: firmToday() })}>
                    Take down today
                  </Button>
                </>
              ) : null}
            </li>
          ))}
        </ul>
      </Card>
      {current ? (
        <>
          <Card title="Bring the card in">
            <CardUpload deploymentId={current} />
          </Card>
          <Card title="Review">
            <ReviewGrid deploymentId={current} bucks={roster} />
          </Card>
          <Card title="What the camera saw">
            <EventsSummary deploymentId={current} />
          </Card>
        </>
      ) : null}
      {list.length ? (
        <Card title="By site, all deployments">
          <CameraSitesSummary propertyId={id} />
        </Card>
      ) : null}
      <Card title="Buck roster">
        <BuckRoster propertyId={id} bucks={roster} />
      </Card>
      {list.length ? (
        <Card title="Survey from the tagged photos">
          <PhotoSurveyForm propertyId={id} deployments={list} />
        </Card>
      ) : null}
    </div>
  );
}
