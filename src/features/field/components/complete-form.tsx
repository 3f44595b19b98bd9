import { useEffect, useId, useMemo, useRef, useState } from 'react';
import { useFieldArray, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { useToast } from '../../../components/ui/toast';
import { sentence } from '../../../lib/api-errors';
import type { FieldTask } from '../api/get-my-tasks';
import { useCompletionQueue } from '../hooks/use-completion-queue';
import { newCompletionKey } from '../lib/completion-queue';
import { CompleteFormSchema, completeFormDefaults, completionFields, photoProblem, type CompleteFormInput, type CompleteFormOutput } from '../lib/complete-form';
import { firmToday } from '../../../lib/firm-clock';
import { isHerbicideTask } from '../../../../shared/domain/spray-records';
import { SprayRecordFields } from './spray-record-fields';

/** Photos picked for a completion, with previews. */
function PhotoPicker({ files, onChange, error }: { files: File[]; onChange: (files: File[]) => void; error: string | null }) {
  const inputId = useId();
  const previews = useMemo(() => files.map((f) => ({ file: f, url: URL.createObjectURL(f) })), [files]);
  useEffect(() => () => previews.forEach((p) => URL.revokeObjectURL(p.url)), [previews]);
  return (
    <div className="flex flex-col gap-2">
      <label htmlFor={inputId} className="text-sm font-semibold text-ink">
        Photos
      </label>
      <input
        id={inputId}
        type="file"
        accept="image/*"
        capture="environment"
        multiple
        aria-describedby={`${inputId}-hint`}
        className="text-sm file:mr-3 file:rounded file:border file:border-moss file:bg-card file:px-3 file:py-2 file:font-semibold file:text-moss-deep"
        onChange={(e) => {
          const picked = Array.from(e.target.files ?? []);
          e.target.value = '';
          if (picked.length) onChange([...files, ...picked]);
        }}
      />
      <p id={`${inputId}-hint`} className={`text-sm ${error ? 'text-clay' : 'text-slate'}`}>
        {error ?? 'Take or pick photos of the finished work; the position in the photo shows on the unit map.'}
      </p>
      {previews.length > 0 ? (
        <ul className="grid grid-cols-3 gap-2" aria-label="Photos to send">
          {previews.map((p, i) => (
            <li key={p.url} className="relative">
              <img src={p.url} alt={`Photo ${i + 1}: ${p.file.name}`} className="aspect-square w-full rounded border border-rule bg-paper object-cover" />
              <button type="button" className="absolute right-1 top-1 rounded bg-card/90 px-2 text-sm font-semibold text-clay" aria-label={`Remove photo ${i + 1}`} onClick={() => onChange(files.filter((f) => f !== p.file))}>
                ×
              </button>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

/** "Mark done": date, notes, hours, quantities actually used and photos; kept on the phone first, then sent. */
export function CompleteForm({ task, onCancel }: { task: FieldTask; onCancel: () => void }) {
  const queue = useCompletionQueue();
  const toast = useToast();
  const [photos, setPhotos] = useState<File[]>([]);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const today = useRef(firmToday()).current;
  const form = useForm<CompleteFormInput, unknown, CompleteFormOutput>({ resolver: zodResolver(CompleteFormSchema), defaultValues: completeFormDefaults(task.quantities, today, task) });
  const herbicide = isHerbicideTask(task);
  const quantities = useFieldArray({ control: form.control, name: 'quantitiesUsed' });
  const errors = form.formState.errors;
  const photoError = photoProblem(photos);

  const onSubmit = form.handleSubmit(async (values) => {
    if (photoError) return;
    if (values.doneOn > firmToday()) {
      form.setError('doneOn', { message: 'The day cannot be after today. Pick today or an earlier day.' });
      return;
    }
    setBusy(true);
    setProblem(null);
    try {
      // One key per completion, made now; every retry of this completion sends the same key.
      const outcome = await queue.save({
        key: newCompletionKey(),
        taskId: task.id,
        taskName: task.name,
        unitName: task.unitName,
        fields: completionFields(values),
        photos: photos.map((f) => ({ name: f.name || 'photo.jpg', type: f.type, blob: f })),
      });
      // A queued completion is shown on the page itself ("Done (waiting to send)").
      if (outcome.kind === 'sent') toast('success', `“${task.name}” marked done.`);
      else if (outcome.kind === 'rejected') setProblem(outcome.message);
    } catch {
      setProblem('This phone could not keep the completion (its storage may be full). Free some space, then tap Save again.');
    } finally {
      setBusy(false);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Mark done">
      <TextField label="Done on" type="date" max={today} {...form.register('doneOn')} error={errors.doneOn?.message ? sentence(errors.doneOn.message) : undefined} />
      {quantities.fields.length > 0 ? (
        <fieldset className="flex flex-col gap-3">
          <legend className="mb-1 text-sm font-semibold text-ink">Quantities actually used</legend>
          {quantities.fields.map((q, i) => (
            <TextField
              key={q.id}
              label={`${q.label}${q.unit ? ` (${q.unit})` : ''}`}
              type="number"
              inputMode="decimal"
              step="any"
              min={0}
              {...form.register(`quantitiesUsed.${i}.amount`, { valueAsNumber: true })}
              error={errors.quantitiesUsed?.[i]?.amount?.message ? sentence(errors.quantitiesUsed[i].amount.message) : undefined}
            />
          ))}
        </fieldset>
      ) : null}
      {herbicide ? <SprayRecordFields products={task.quantities.filter((q) => q.rateText !== '')} register={form.register} errors={errors} /> : null}
      <TextField label="Hours worked" type="number" inputMode="decimal" step="0.25" min={0} hint="Optional: your hours on this task." {...form.register('hours')} error={errors.hours?.message ? sentence(errors.hours.message) : undefined} />
      <TextAreaField label="Notes" rows={3} placeholder="Soil, weather, anything the consultant should know" {...form.register('notes')} error={errors.notes?.message ? sentence(errors.notes.message) : undefined} />
      <PhotoPicker files={photos} onChange={setPhotos} error={photoError} />
      {problem ? (
        <p role="alert" className="rounded border border-clay/60 bg-clay/5 px-3 py-2 text-sm text-ink">
          {problem}
        </p>
      ) : null}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" busy={busy} className="min-h-12 flex-1 text-base">
          Save — mark done
        </Button>
        <Button type="button" variant="secondary" onClick={onCancel} disabled={busy} className="min-h-12">
          Cancel
        </Button>
      </div>
    </form>
  );
}
