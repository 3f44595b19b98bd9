import { useFieldArray, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { AGE_CLASSES, AGE_CLASS_LABELS, SurveyCreateSchema, type CameraSiteDto, type SurveyDto } from '../../../../shared/schemas/results';
import { LIMITS } from '../../../../shared/limits';
import { useCreateSurvey } from '../api/create-survey';
import { TextField } from '../../../components/ui/text-field';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { SelectField } from '../../../components/ui/select-field';
import { Button } from '../../../components/ui/button';
import { useToast } from '../../../components/ui/toast';
import { applyServerErrors } from './apply-server-errors';

type Input = z.input<typeof SurveyCreateSchema>;
type Output = z.output<typeof SurveyCreateSchema>;
const FIELDS = ['name', 'startDate', 'endDate', 'buckPhotos', 'uniqueBucks', 'doePhotos', 'fawnPhotos', 'bucks', 'cameraUnitIds', 'cameraCount', 'notes'];

const numberOrNull = (v: unknown) => (v === '' || v === null || v === undefined ? null : Number(v));

/** The camera survey form: dates, the camera sites used, the tallies and the bucks told apart. */
export function SurveyForm({ propertyId, cameraSites, onSaved }: { propertyId: number; cameraSites: readonly CameraSiteDto[]; onSaved: (survey: SurveyDto) => void }) {
  const create = useCreateSurvey(propertyId);
  const toast = useToast();
  const form = useForm<Input, unknown, Output>({
    resolver: zodResolver(SurveyCreateSchema),
    defaultValues: { name: '', startDate: '', endDate: '', cameraUnitIds: cameraSites.map((c) => c.id), cameraCount: null, bucks: [], notes: '' },
  });
  const bucks = useFieldArray({ control: form.control, name: 'bucks' });
  const errors = form.formState.errors;
  const picked = form.watch('cameraUnitIds') ?? [];
  const submit = form.handleSubmit((values) =>
    create.mutate(
      { propertyId, input: values },
      {
        onSuccess: (survey) => {
          toast('success', `${survey.name} saved: about ${survey.display?.total ?? '?'} deer.`);
          form.reset();
          onSaved(survey);
        },
        onError: (e) => {
          if (!applyServerErrors(e, FIELDS, form.setError)) toast('error', `The survey was not saved: ${e.message}`);
        },
      },
    ),
  );
  const count = (name: 'buckPhotos' | 'uniqueBucks' | 'doePhotos' | 'fawnPhotos', label: string, hint?: string) => (
    <TextField label={label} type="number" inputMode="numeric" min={0} step={1} hint={hint} error={errors[name]?.message} {...form.register(name, { valueAsNumber: true })} />
  );
  return (
    <form onSubmit={submit} noValidate aria-label="New camera survey" className="grid gap-3 sm:grid-cols-2">
      <TextField label="Survey name" className="sm:col-span-2" maxLength={LIMITS.nameMax} placeholder="Late-summer survey" error={errors.name?.message} {...form.register('name')} />
      <TextField label="First day" type="date" error={errors.startDate?.message} {...form.register('startDate')} />
      <TextField label="Last day" type="date" hint="The method calls for 10–14 days." error={errors.endDate?.message} {...form.register('endDate')} />
      <fieldset className="flex flex-col gap-1 sm:col-span-2">
        <legend className="text-sm font-semibold text-ink">Camera sites used</legend>
        {cameraSites.length === 0 ? (
          <p className="text-sm text-slate">No camera site is on the plan map yet. Add them there, or enter the number of cameras below.</p>
        ) : (
          <div className="flex flex-wrap gap-x-4 gap-y-1">
            {cameraSites.map((c) => (
              <label key={c.id} className="flex items-center gap-2 text-sm">
                <input
                  type="checkbox"
                  className="size-4 accent-moss"
                  checked={picked.includes(c.id)}
                  onChange={(e) =>
                    form.setValue('cameraUnitIds', e.target.checked ? [...picked, c.id] : picked.filter((x) => x !== c.id), { shouldValidate: form.formState.isSubmitted })
                  }
                />
                {c.name}
              </label>
            ))}
          </div>
        )}
        {errors.cameraUnitIds?.message ? <p className="text-sm text-clay">{errors.cameraUnitIds.message}</p> : null}
      </fieldset>
      <TextField
        label="Cameras that ran (if not all are on the map)"
        type="number"
        inputMode="numeric"
        min={1}
        hint="About one camera per 100 acres."
        error={errors.cameraCount?.message}
        {...form.register('cameraCount', { setValueAs: numberOrNull })}
      />
      <span className="hidden sm:block" />
      {count('buckPhotos', 'Buck photos')}
      {count('uniqueBucks', 'Unique bucks', 'Bucks you can tell apart by their antlers.')}
      {count('doePhotos', 'Doe photos')}
      {count('fawnPhotos', 'Fawn photos')}
      <fieldset className="flex flex-col gap-2 sm:col-span-2">
        <legend className="text-sm font-semibold text-ink">Bucks told apart (optional)</legend>
        <p className="text-sm text-slate">List one entry per unique buck with its age class, or leave the list empty.</p>
        {bucks.fields.map((f, i) => (
          <div key={f.id} className="grid grid-cols-[1fr_auto] items-end gap-2 sm:grid-cols-[1fr_12rem_auto]">
            <TextField label={`Buck ${i + 1}`} maxLength={60} error={errors.bucks?.[i]?.label?.message} {...form.register(`bucks.${i}.label`)} />
            <SelectField label="Age class" className="col-span-1" error={errors.bucks?.[i]?.ageClass?.message} {...form.register(`bucks.${i}.ageClass`)}>
              {AGE_CLASSES.map((a) => (
                <option key={a} value={a}>
                  {AGE_CLASS_LABELS[a]}
                </option>
              ))}
            </SelectField>
            <Button type="button" variant="ghost" size="sm" onClick={() => bucks.remove(i)} aria-label={`Remove buck ${i + 1}`}>
              Remove
            </Button>
          </div>
        ))}
        {errors.bucks?.message ? <p className="text-sm text-clay">{errors.bucks.message}</p> : null}
        <Button type="button" variant="secondary" size="sm" className="self-start" onClick={() => bucks.append({ label: '', ageClass: '2.5' })}>
          Add a buck
        </Button>
      </fieldset>
      <TextAreaField label="Notes" className="sm:col-span-2" error={errors.notes?.message} {...form.register('notes')} />
      <div className="sm:col-span-2">
        <Button type="submit" busy={create.isPending}>
          Save survey
        </Button>
      </div>
    </form>
  );
}
