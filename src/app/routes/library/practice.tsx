import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { TextButton } from '../../../components/ui/text-button';
import { Button } from '../../../components/ui/button';
import { Card, CautionBox, ErrorPanel, Loading } from '../../../components/ui/card';
import { TextField } from '../../../components/ui/text-field';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { useToast } from '../../../components/ui/toast';
import { paths } from '../../../config/paths';
import { parseId } from '../../../lib/route-params';
import { usePractice } from '../../../features/library/api/get-practice';
import { useMaterials } from '../../../features/library/api/get-materials';
import { useRates } from '../../../features/library/api/get-rates';
import { useUpdatePractice } from '../../../features/library/api/update-practice';
import { useDuplicatePractice } from '../../../features/library/api/duplicate-practice';
import { useArchivePractice } from '../../../features/library/api/archive-practice';
import { PracticeSteps } from '../../../features/library/components/practice-steps';
import { applyEdits, editableNumbers } from '../../../features/library/lib/practice-edits';
import { PLANTING_WINDOWS, REGION_LABELS, REGIONS } from '../../../../shared/domain/planting-windows';
import { KIND_STYLES } from '../../../../shared/domain/unit-kinds';
import { validatePracticeDefinition } from '../../../../shared/domain/practice';
import { DomainValidationError } from '../../../../shared/domain/errors';
import { LIMITS } from '../../../../shared/limits';
import type { PracticeDto } from '../../../../shared/schemas/library';

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
const monthDay = (m: { month: number; day: number }) => `${MONTHS[m.month - 1]} ${m.day}`;

function SeasonWindows({ practice }: { practice: PracticeDto }) {
  const window = PLANTING_WINDOWS[practice.windowKey];
  return (
    <div className="text-sm">
      <p className="font-semibold">{window.label}</p>
      <table className="mt-1 w-full text-xs">
        <tbody>
          {REGIONS.map((r) => (
            <tr key={r} className="border-b border-rule/60 last:border-0">
              <th scope="row" className="py-1 pr-2 text-left font-normal text-slate">
                {REGION_LABELS[r]}
              </th>
              <td className="py-1 text-right tabular-nums">
                {monthDay(window.regions[r].start)} – {monthDay(window.regions[r].end)}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-1 text-xs text-slate">Sources: {[...new Set(REGIONS.map((r) => window.regions[r].source))].join('; ')}.</p>
    </div>
  );
}

/** One practice: its description, steps in order, cautions; duplicate, archive, and change its name, description and step numbers. */
export function PracticePage() {
  const id = parseId(useParams().id);
  const practice = usePractice(id ?? 0);
  const materials = useMaterials({ includeArchived: true });
  const rates = useRates();
  const update = useUpdatePractice(id ?? 0);
  const duplicate = useDuplicatePractice();
  const archive = useArchivePractice();
  const toast = useToast();
  const navigate = useNavigate();
  const [editing, setEditing] = useState(false);
  const [name, setName] = useState('');
  const [description, setDescription] = useState('');
  const [texts, setTexts] = useState<Record<string, string>>({});
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [confirmArchive, setConfirmArchive] = useState(false);

  if (id === null) return <ErrorPanel error={new Error('This address names no practice. Go back to the practices list.')} />;
  if (practice.isPending || materials.isPending || rates.isPending) return <Loading />;
  if (practice.isError) return <ErrorPanel error={practice.error} />;
  if (materials.isError) return <ErrorPanel error={materials.error} />;
  if (rates.isError) return <ErrorPanel error={rates.error} />;
  const p = practice.data;

  const startEdit = () => {
    setName(p.name);
    setDescription(p.description);
    setTexts({});
    setErrors({});
    setFormError(null);
    setEditing(true);
  };

  const save = () => {
    const fields = p.steps.flatMap((step, i) => editableNumbers(step, i, materials.data));
    const applied = applyEdits(p.steps, fields, texts);
    const nameError = name.trim() ? (name.trim().length > LIMITS.nameMax ? `Keep the name under ${LIMITS.nameMax} characters.` : null) : 'Enter a name.';
    setErrors(applied.ok ? {} : applied.errors);
    if (nameError) setErrors((e) => ({ ...e, name: nameError }));
    if (!applied.ok || nameError) {
      setFormError('Correct the values marked below.');
      return;
    }
    try {
      validatePracticeDefinition({ ...p, name: name.trim(), steps: applied.steps }, materials.data, rates.data);
    } catch (error) {
      if (error instanceof DomainValidationError) {
        setFormError(error.message);
        return;
      }
      throw error;
    }
    update.mutate(
      { name: name.trim(), description: description.trim(), steps: applied.steps },
      {
        onSuccess: (saved) => {
          toast('success', `${saved.name} saved.`);
          setEditing(false);
        },
        onError: (e) => {
          setFormError(e.message);
          toast('error', e.message);
        },
      },
    );
  };

  const copy = () =>
    duplicate.mutate(p.id, {
      onSuccess: (created) => {
        toast('success', `${created.name} added; change it as you need.`);
        navigate(paths.practice(created.id));
      },
      onError: (e) => toast('error', e.message),
    });

  const doArchive = () =>
    archive.mutate(p.id, {
      onSuccess: (result) => {
        toast('success', `${p.name} archived.${result.prescriptionsKept ? ` ${result.prescriptionsKept} prescription${result.prescriptionsKept === 1 ? '' : 's'} written from it stay as they are.` : ''}`);
        navigate(paths.libraryPractices);
      },
      onError: (e) => toast('error', e.message),
    });

  return (
    <div className="flex flex-col gap-4">
      <nav aria-label="Breadcrumb" className="text-sm text-slate">
        <Link to={paths.libraryPractices} className="text-moss-deep underline">
          Practices
        </Link>{' '}
        › <span>{p.name}</span>
      </nav>
      <div className="flex flex-wrap items-start justify-between gap-3">
        {editing ? (
          <div className="flex min-w-0 flex-1 flex-col gap-3">
            <TextField label="Name" value={name} error={errors.name} onChange={(e) => setName(e.target.value)} maxLength={LIMITS.nameMax} />
            <TextAreaField label="Description" value={description} onChange={(e) => setDescription(e.target.value)} maxLength={LIMITS.textMax} />
          </div>
        ) : (
          <div className="min-w-0">
            <h2 className="text-xl font-bold">{p.name}</h2>
            <p className="mt-1 max-w-3xl text-ink">{p.description || <span className="text-slate">No description yet.</span>}</p>
          </div>
        )}
        <div className="flex flex-wrap gap-2">
          {editing ? (
            <>
              <Button type="button" onClick={save} busy={update.isPending}>
                Save practice
              </Button>
              <Button type="button" variant="secondary" onClick={() => setEditing(false)}>
                Cancel
              </Button>
            </>
          ) : confirmArchive ? (
            <div role="group" aria-label="Confirm archive" className="flex flex-wrap items-center gap-2 rounded border border-clay/40 bg-clay/5 px-3 py-2 text-sm">
              <span>Archive “{p.name}”? Prescriptions already written keep it.</span>
              <Button type="button" variant="danger" onClick={doArchive} busy={archive.isPending}>
                Yes, archive
              </Button>
              <Button type="button" variant="secondary" onClick={() => setConfirmArchive(false)}>
                Keep it
              </Button>
            </div>
          ) : (
            <>
              <Button type="button" onClick={startEdit}>
                Edit
              </Button>
              <Button type="button" variant="secondary" onClick={copy} busy={duplicate.isPending}>
                Duplicate
              </Button>
              <TextButton tone="clay" onClick={() => setConfirmArchive(true)}>
                Archive
              </TextButton>
            </>
          )}
        </div>
      </div>
      {formError ? (
        <p role="alert" className="rounded border-l-4 border-clay bg-clay/10 px-3 py-2 text-sm">
          {formError}
        </p>
      ) : null}

      <div className="grid gap-4 lg:grid-cols-[minmax(0,1fr)_20rem]">
        <div className="flex flex-col gap-2">
          <h3 className="text-base font-bold">Steps, in order</h3>
          <PracticeSteps
            practice={p}
            materials={materials.data}
            rates={rates.data}
            editing={editing}
            texts={texts}
            errors={errors}
            onText={(fieldId, text) => setTexts((t) => ({ ...t, [fieldId]: text }))}
          />
        </div>
        <div className="flex flex-col gap-4">
          <Card title="Fits">
            <ul className="flex flex-wrap gap-1">
              {p.unitKinds.map((k) => (
                <li key={k} className="inline-flex items-center gap-1 rounded border border-rule bg-paper px-1.5 py-0.5 text-xs">
                  <span aria-hidden className="inline-block size-2.5 rounded-sm" style={{ backgroundColor: KIND_STYLES[k].fill }} />
                  {KIND_STYLES[k].label}
                </li>
              ))}
            </ul>
            <p className="mt-2 text-sm text-slate">Priced by {p.measure === 'acres' ? 'the acre' : p.measure === 'feet' ? 'the foot' : 'the item'}.</p>
          </Card>
          <Card title="Season window">
            <SeasonWindows practice={p} />
          </Card>
          {p.cautions.length > 0 ? (
            <div className="flex flex-col gap-2">
              {p.cautions.map((c) => (
                <CautionBox key={c.id} title={c.title}>
                  <p>{c.text}</p>
                </CautionBox>
              ))}
            </div>
          ) : null}
        </div>
      </div>
    </div>
  );
}
