import { useState } from 'react';
import type { DeploymentDto } from '../../../../shared/schemas/cameras';
import type { SurveyDto } from '../../../../shared/schemas/results';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { formatAcres } from '../../../lib/format';
import { useCreateSurveyFromPhotos } from '../api/cameras';

/** Makes a camera survey from the tagged photos of chosen deployments and dates; shows the estimates it gives. */
export function PhotoSurveyForm({ propertyId, deployments }: { propertyId: number; deployments: DeploymentDto[] }) {
  const create = useCreateSurveyFromPhotos(propertyId);
  const [picked, setPicked] = useState<number[]>(deployments.map((d) => d.id));
  const [from, setFrom] = useState(deployments.length ? deployments.map((d) => d.startedOn).sort()[0] : '');
  const [to, setTo] = useState(deployments.length ? (deployments.map((d) => d.lastPulledOn ?? d.endedOn ?? d.startedOn).sort().at(-1) ?? '') : '');
  const [name, setName] = useState('Survey from camera photos');
  const [made, setMade] = useState<SurveyDto | null>(null);
  return (
    <form
      className="flex flex-col gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        create.mutate({ name, fromPhotos: { deploymentIds: picked, from, to } }, { onSuccess: setMade });
      }}
    >
      <fieldset className="flex flex-col gap-1">
        <legend className="text-sm font-semibold">Deployments</legend>
        {deployments.map((d) => (
          <label key={d.id} className="flex items-center gap-2 text-sm">
            <input type="checkbox" checked={picked.includes(d.id)} onChange={(e) => setPicked((p) => (e.target.checked ? [...p, d.id] : p.filter((x) => x !== d.id)))} />
            {d.cameraLabel} at {d.unitName}
          </label>
        ))}
      </fieldset>
      <div className="flex flex-wrap gap-3">
        <TextField label="Survey name" value={name} onChange={(e) => setName(e.target.value)} />
        <TextField label="From" type="date" value={from} onChange={(e) => setFrom(e.target.value)} />
        <TextField label="To" type="date" value={to} onChange={(e) => setTo(e.target.value)} />
      </div>
      {create.error ? <p className="text-sm text-clay" role="alert">{create.error.message}</p> : null}
      <div>
        <Button type="submit" busy={create.isPending} disabled={picked.length === 0}>
          Make the survey from tagged photos
        </Button>
      </div>
      {made ? (
        <div role="status" className="rounded border border-moss p-3 text-sm" data-testid="photo-survey">
          <p className="font-semibold">{made.name} saved with the property’s results.</p>
          <p>
            Buck photos {made.buckPhotos} · unique bucks {made.uniqueBucks} · doe photos {made.doePhotos} · fawn photos {made.fawnPhotos}
          </p>
          {made.display ? (
            <p>
              Estimate: <span data-testid="survey-total">{made.display.total}</span> deer ({made.display.bucks} bucks, {made.display.does} does, {made.display.fawns} fawns), buck:doe {made.display.buckDoeRatio},{' '}
              <span data-testid="survey-density">{made.display.deerPerSqMi}</span> per square mile over {made.areaAcres ? formatAcres(made.areaAcres) : 'the property'} (the area the cameras cover).
            </p>
          ) : null}
        </div>
      ) : null}
    </form>
  );
}
