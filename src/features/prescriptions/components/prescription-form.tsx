import { useId, useMemo, useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/card';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { useToast } from '../../../components/ui/toast';
import { paths } from '../../../config/paths';
import { fieldProblems, sentence } from '../../../lib/api-errors';
import { parseNumberInput } from '../../../lib/quantity-format';
import { formatDollars } from '../../../../shared/domain/prescription-summary';
import { KIND_STYLES, kindFamily } from '../../../../shared/domain/unit-kinds';
import type { Region } from '../../../../shared/domain/planting-windows';
import type { MaterialDto, PracticeDto, PrescriptionCreateInput } from '../../../../shared/schemas/library';
import { PrescriptionCreateSchema, PrescriptionUpdateSchema } from '../../../../shared/schemas/library';
import type { ServiceRate } from '../../../../shared/domain/service-rates';
import { useCreatePrescription } from '../api/create-prescription';
import { useUpdatePrescription } from '../api/update-prescription';
import { buildParameters, fieldForPath, initialParameterTexts, parameterSteps } from '../lib/parameter-fields';
import { defaultYear, previewPrescription, todayIso } from '../lib/preview';
import type { PanelUnit, PrescriptionDto } from '../lib/types';
import { PrescriptionDetails } from './prescription-details';

export interface PrescriptionLibrary {
  practices: PracticeDto[];
  materials: MaterialDto[];
  rates: ServiceRate[];
}

interface FormState {
  practiceId: string;
  year: string;
  targetDate: string;
  count: string;
  notes: string;
  texts: Record<string, string>;
  skipped: string[];
}

function startState(practice: PracticeDto | undefined, library: PrescriptionLibrary, region: Region, existing?: PrescriptionDto): FormState {
  if (!practice) return { practiceId: '', year: '', targetDate: '', count: '', notes: '', texts: {}, skipped: [] };
  const { texts, skipped } = initialParameterTexts(parameterSteps(practice, library.materials), existing?.parameters);
  return {
    practiceId: String(practice.id),
    year: String(existing?.year ?? defaultYear(practice, region, todayIso())),
    targetDate: existing?.targetDate ?? '',
    count: existing?.count ? String(existing.count) : '',
    notes: existing?.notes ?? '',
    texts,
    skipped,
  };
}

/**
 * Writes or changes a unit's prescription: the practice (only those fitting the unit's kind), the
 * season year and target date, a count for point units, and the per-step values that matter, with a
 * live preview computed in the browser by the same shared code the server runs.
 */
export function PrescriptionForm({
  unit,
  region,
  library,
  existing,
  onDone,
}: {
  unit: PanelUnit;
  region: Region;
  library: PrescriptionLibrary;
  existing?: PrescriptionDto;
  onDone: (saved?: PrescriptionDto) => void;
}) {
  const toast = useToast();
  const formId = useId();
  const create = useCreatePrescription(unit.id);
  const update = useUpdatePrescription();
  const fitting = useMemo(() => library.practices.filter((p) => p.unitKinds.includes(unit.kind)), [library.practices, unit.kind]);
  const existingPractice = existing ? library.practices.find((p) => p.id === existing.practiceId) : undefined;
  const [state, setState] = useState<FormState>(() => startState(existingPractice, library, region, existing));
  const [serverErrors, setServerErrors] = useState<{ fields: Record<string, string>; message: string | null }>({ fields: {}, message: null });

  const practice = existing ? existingPractice : fitting.find((p) => String(p.id) === state.practiceId);
  const steps = useMemo(() => (practice ? parameterSteps(practice, library.materials) : []), [practice, library.materials]);
  const showCount = kindFamily(unit.kind) === 'point' || practice?.measure === 'each';
  const built = useMemo(() => buildParameters(steps, state.texts, state.skipped), [steps, state.texts, state.skipped]);

  const year = parseNumberInput(state.year);
  const count = parseNumberInput(state.count);
  const fieldErrors: Record<string, string> = { ...serverErrors.fields };
  if (!built.ok) Object.assign(fieldErrors, built.errors);
  if (year === undefined || Number.isNaN(year) || !Number.isInteger(year) || year < 2000 || year > 2100) fieldErrors.year ??= 'Enter a season year such as 2027.';
  if (state.targetDate && !/^\d{4}-\d{2}-\d{2}$/.test(state.targetDate)) fieldErrors.targetDate ??= 'Pick a date.';
  if (showCount && count !== undefined && (Number.isNaN(count) || !Number.isInteger(count) || count < 1 || count > 1000)) fieldErrors.count ??= 'Enter a whole number from 1 to 1,000.';

  const preview = useMemo(() => {
    if (!practice || !built.ok || fieldErrors.year || fieldErrors.targetDate || fieldErrors.count) return null;
    return previewPrescription({
      unit,
      practice,
      materials: library.materials,
      rates: library.rates,
      parameters: built.parameters,
      region,
      year: year as number,
      targetDate: state.targetDate || undefined,
      count: showCount ? count : undefined,
      today: todayIso(),
    });
    // fieldErrors is derived from the values listed here.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [practice, built, library.materials, library.rates, region, year, state.targetDate, count, showCount, unit]);
  const previewField = preview && !preview.ok ? fieldForPath(preview.field, steps) : null;
  if (previewField) fieldErrors[previewField] ??= preview && !preview.ok ? preview.message : '';

  const change = (patch: Partial<FormState>) => {
    setState((s) => ({ ...s, ...patch }));
    setServerErrors({ fields: {}, message: null });
  };
  const choosePractice = (id: string) => {
    const next = fitting.find((p) => String(p.id) === id);
    setState(next ? startState(next, library, region) : { ...startState(undefined, library, region) });
    setServerErrors({ fields: {}, message: null });
  };

  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (!practice || !built.ok || Object.keys(fieldErrors).some((k) => k !== previewField && fieldErrors[k])) return;
    const body: Omit<PrescriptionCreateInput, 'practiceId'> = {
      year: year as number,
      ...(state.targetDate ? { targetDate: state.targetDate } : {}),
      ...(showCount && count !== undefined ? { count } : {}),
      notes: state.notes.trim() || null,
      // The form writes only numbers, skips and seed rates, which the schema's shape takes as they are.
      parameters: built.parameters as PrescriptionCreateInput['parameters'],
    };
    const parsed = existing ? PrescriptionUpdateSchema.safeParse(body) : PrescriptionCreateSchema.safeParse({ practiceId: practice.id, ...body });
    if (!parsed.success) {
      const fields: Record<string, string> = {};
      for (const issue of parsed.error.issues) {
        const path = issue.path.join('.');
        const id = fieldForPath(path, steps) ?? (['year', 'targetDate', 'count', 'notes'].includes(path) ? path : null);
        if (id) fields[id] ??= sentence(issue.message);
      }
      setServerErrors({ fields, message: Object.keys(fields).length ? null : parsed.error.issues[0]?.message ?? 'Check the values.' });
      return;
    }
    const onError = (error: Error) => {
      const fields: Record<string, string> = {};
      for (const problem of fieldProblems(error)) {
        const id = fieldForPath(problem.path, steps) ?? (['year', 'targetDate', 'count', 'notes'].includes(problem.path) ? problem.path : null);
        if (id) fields[id] ??= sentence(problem.message);
      }
      const placed = Object.keys(fields).length > 0;
      setServerErrors({ fields, message: placed ? null : error.message });
      toast('error', placed ? 'Not saved: correct the marked fields.' : error.message);
    };
    if (existing) {
      update.mutate(
        { id: existing.id, input: body },
        {
          onSuccess: (saved) => {
            toast('success', `${saved.practiceName} on ${unit.name} updated.`);
            onDone(saved);
          },
          onError,
        },
      );
    } else {
      create.mutate(
        { practiceId: practice.id, ...body },
        {
          onSuccess: (saved) => {
            toast('success', `${saved.practiceName} written for ${unit.name}.`);
            onDone(saved);
          },
          onError,
        },
      );
    }
  };

  if (!existing && fitting.length === 0) {
    return (
      <EmptyState title={`No practice in your library fits a ${KIND_STYLES[unit.kind].label.toLowerCase()}.`}>
        Add or change one in the <Link to={paths.libraryPractices} className="text-moss-deep underline">Library</Link>, then write the prescription here.
        <div className="mt-3">
          <Button type="button" variant="secondary" onClick={() => onDone()}>
            Close
          </Button>
        </div>
      </EmptyState>
    );
  }
  if (existing && !existingPractice) {
    return (
      <EmptyState title={`“${existing.practiceName}” has been archived.`}>
        Its prescriptions are kept as written but can no longer be changed. Delete this one and write a new one from a current practice.
        <div className="mt-3">
          <Button type="button" variant="secondary" onClick={() => onDone()}>
            Close
          </Button>
        </div>
      </EmptyState>
    );
  }

  const busy = create.isPending || update.isPending;
  return (
    <form onSubmit={submit} noValidate aria-label={existing ? `Change ${existing.practiceName}` : 'Write prescription'} className="flex flex-col gap-4">
      {existing ? (
        <p className="text-sm">
          Practice: <span className="font-semibold">{existing.practiceName}</span>
        </p>
      ) : (
        <SelectField label="Practice" value={state.practiceId} onChange={(e) => choosePractice(e.target.value)} hint={`Practices written for a ${KIND_STYLES[unit.kind].label.toLowerCase()}.`}>
          <option value="">Choose a practice…</option>
          {fitting.map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
            </option>
          ))}
        </SelectField>
      )}

      {practice ? (
        <>
          <div className="grid grid-cols-2 gap-3">
            <TextField label="Season year" inputMode="numeric" value={state.year} error={fieldErrors.year} onChange={(e) => change({ year: e.target.value })} />
            <TextField
              label="Target date"
              type="date"
              value={state.targetDate}
              error={fieldErrors.targetDate}
              hint={existing?.targetDate ? 'A saved target date can be moved, not removed.' : 'Optional; by default today while the window is open, else its first day.'}
              onChange={(e) => change({ targetDate: e.target.value })}
            />
            {showCount ? <TextField label="How many" inputMode="numeric" value={state.count} placeholder="1" error={fieldErrors.count} onChange={(e) => change({ count: e.target.value })} /> : null}
          </div>

          {steps.map((step) => {
            const skipped = state.skipped.includes(step.stepKey);
            return (
              <fieldset key={step.stepKey} className="rounded border border-rule px-3 pb-3 pt-1">
                <legend className="px-1 text-sm font-semibold text-ink">{step.name}</legend>
                <label className="mb-2 flex items-center gap-2 text-sm text-slate">
                  <input
                    type="checkbox"
                    checked={skipped}
                    onChange={(e) => change({ skipped: e.target.checked ? [...state.skipped, step.stepKey] : state.skipped.filter((k) => k !== step.stepKey) })}
                    className="size-4 accent-moss"
                  />
                  Skip this step
                </label>
                {!skipped && step.fields.length > 0 ? (
                  <div className="grid grid-cols-2 gap-3">
                    {step.fields.map((f) => (
                      <TextField
                        key={f.id}
                        id={`${formId}-${f.id}`}
                        label={f.label}
                        inputMode="decimal"
                        value={state.texts[f.id] ?? ''}
                        error={fieldErrors[f.id]}
                        placeholder={f.practiceValue === undefined ? 'from the soil test' : undefined}
                        onChange={(e) => change({ texts: { ...state.texts, [f.id]: e.target.value } })}
                      />
                    ))}
                  </div>
                ) : null}
              </fieldset>
            );
          })}

          <section aria-label="Preview" className="rounded-md border border-moss/30 bg-paper/70 p-3">
            <div className="mb-2 flex items-baseline justify-between gap-2">
              <h3 className="text-base font-bold">Preview</h3>
              {preview?.ok ? <span className="figure text-lg font-bold">{formatDollars(preview.view.totalCents)}</span> : null}
            </div>
            {preview === null ? (
              <p className="text-sm text-slate">Correct the values marked above to see the quantities and cost.</p>
            ) : preview.ok ? (
              <PrescriptionDetails view={preview.view} />
            ) : (
              <p role="alert" className="rounded border-l-4 border-clay bg-clay/10 px-3 py-2 text-sm">
                {preview.message}
              </p>
            )}
          </section>

          <TextAreaField label="Notes" rows={2} value={state.notes} onChange={(e) => change({ notes: e.target.value })} />
        </>
      ) : null}

      {serverErrors.message ? (
        <p role="alert" className="rounded border-l-4 border-clay bg-clay/10 px-3 py-2 text-sm">
          {serverErrors.message}
        </p>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" busy={busy} disabled={!practice}>
          {existing ? 'Update prescription' : 'Save prescription'}
        </Button>
        <Button type="button" variant="secondary" onClick={() => onDone()}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
