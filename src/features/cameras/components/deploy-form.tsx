import { useState } from 'react';
import type { CameraDto } from '../../../../shared/schemas/cameras';
import { CAMERA_MODES } from '../../../../shared/schemas/cameras';
import { Button } from '../../../components/ui/button';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import { firmToday } from '../../../lib/firm-clock';
import { useCreateCamera, useCreateDeployment } from '../api/cameras';

/** Sets a camera (an existing one, moved if it runs elsewhere, or a new one) at one of the property's camera sites. */
export function DeployForm({ cameras, sites }: { cameras: CameraDto[]; sites: { id: number; name: string }[] }) {
  const createCamera = useCreateCamera();
  const deploy = useCreateDeployment();
  const [cameraId, setCameraId] = useState<string>(cameras[0] ? String(cameras[0].id) : 'new');
  const [label, setLabel] = useState('');
  const [unitId, setUnitId] = useState<string>(sites[0] ? String(sites[0].id) : '');
  const [startedOn, setStartedOn] = useState(firmToday());
  const [mode, setMode] = useState<(typeof CAMERA_MODES)[number]>('photo');
  const [error, setError] = useState<string | null>(null);
  if (sites.length === 0) return <p className="text-sm text-slate">Add a camera site on the plan map first; cameras are set at camera sites.</p>;
  const moving = cameras.find((c) => String(c.id) === cameraId)?.deployment;
  return (
    <form
      className="flex flex-wrap items-end gap-3"
      onSubmit={async (e) => {
        e.preventDefault();
        setError(null);
        try {
          const id = cameraId === 'new' ? (await createCamera.mutateAsync({ label })).id : Number(cameraId);
          await deploy.mutateAsync({ cameraId: id, input: { unitId: Number(unitId), startedOn, mode } });
          setLabel('');
        } catch (err) {
          setError((err as Error).message);
        }
      }}
    >
      <SelectField label="Camera" value={cameraId} onChange={(e) => setCameraId(e.target.value)}>
        {cameras.filter((c) => !c.retired).map((c) => (
          <option key={c.id} value={c.id}>
            {c.label}
            {c.deployment ? ` (at ${c.deployment.unitName})` : ''}
          </option>
        ))}
        <option value="new">A new camera…</option>
      </SelectField>
      {cameraId === 'new' ? <TextField label="New camera’s label" value={label} onChange={(e) => setLabel(e.target.value)} placeholder="e.g. Cam 4" /> : null}
      <SelectField label="Camera site" value={unitId} onChange={(e) => setUnitId(e.target.value)}>
        {sites.map((s) => (
          <option key={s.id} value={s.id}>
            {s.name}
          </option>
        ))}
      </SelectField>
      <TextField label="Set on" type="date" value={startedOn} onChange={(e) => setStartedOn(e.target.value)} />
      <SelectField label="Mode" value={mode} onChange={(e) => setMode(e.target.value as typeof mode)}>
        {CAMERA_MODES.map((m) => (
          <option key={m} value={m}>
            {m}
          </option>
        ))}
      </SelectField>
      <Button type="submit" busy={createCamera.isPending || deploy.isPending}>
        {moving ? `Move it here (ends the deployment at ${moving.unitName})` : 'Deploy'}
      </Button>
      {error ? <p className="w-full text-sm text-clay" role="alert">{error}</p> : null}
    </form>
  );
}
