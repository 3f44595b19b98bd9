/**
 * The field sheet's establishment and browse checks on a seeded unit. Loaded lazily (the field
 * sheet's first load has a budget); saved to the phone first and sent through the offline queue
 * with an Idempotency-Key, so a check made without signal goes when the phone is back online.
 */
import { useRef, useState, type FormEvent } from 'react';
import { UnitCheckCreateSchema, type UnitCheckCreateInput } from '../../../../shared/schemas/checks';
import { WEED_PRESSURES } from '../../../../shared/domain/plot-checks';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { SelectField } from '../../../components/ui/select-field';
import { useToast } from '../../../components/ui/toast';
import { sentence } from '../../../lib/api-errors';
import { firmToday } from '../../../lib/firm-clock';
import { useCheckQueue } from '../lib/use-check-queue';
import { newCheckKey, type FieldCheckKind } from '../lib/check-queue';
import type { FieldTask } from '../api/get-my-tasks';

interface Row {
  species: string;
  a: string;
  b: string;
}

const num = (s: string): number => (s.trim() === '' ? Number.NaN : Number(s));

/** The check body from the form's text, before the shared schema checks it. */
export function checkBody(kind: FieldCheckKind, checkedOn: string, rows: readonly Row[], frameSqFt: string, groundCoverPct: string, weedPressure: string): UnitCheckCreateInput {
  const used = rows.filter((r) => r.species.trim() !== '' || r.a.trim() !== '');
  if (kind === 'establishment') {
    return { kind, checkedOn, frameSqFt: num(frameSqFt), samples: used.map((r) => ({ species: r.species.trim(), plants: num(r.a) })), groundCoverPct: num(groundCoverPct), weedPressure: weedPressure as (typeof WEED_PRESSURES)[number] };
  }
  return { kind, checkedOn, measure: 'height-in', pairs: used.map((r) => ({ species: r.species.trim(), caged: num(r.a), open: num(r.b) })) };
}

/** Establishment or browse check of the task's unit, saved on the phone and sent when there is signal. */
export function CheckForm({ task, userId, onDone }: { task: FieldTask; userId: number; onDone: () => void }) {
  const queue = useCheckQueue(userId);
  const toast = useToast();
  const today = useRef(firmToday()).current;
  const [kind, setKind] = useState<FieldCheckKind>('establishment');
  const [checkedOn, setCheckedOn] = useState(today);
  const [frameSqFt, setFrame] = useState('1');
  const [groundCoverPct, setCover] = useState('');
  const [weedPressure, setWeeds] = useState('low');
  const [rows, setRows] = useState<Row[]>([{ species: '', a: '', b: '' }]);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const setRow = (i: number, patch: Partial<Row>) => setRows((all) => all.map((r, j) => (j === i ? { ...r, ...patch } : r)));

  const submit = async (e: FormEvent) => {
    e.preventDefault();
    const parsed = UnitCheckCreateSchema.safeParse(checkBody(kind, checkedOn, rows, frameSqFt, groundCoverPct, weedPressure));
    if (!parsed.success) {
      setError(sentence(parsed.error.issues[0]?.message ?? 'Check the figures.'));
      return;
    }
    setError(null);
    setBusy(true);
    try {
      const outcome = await queue.save({ key: newCheckKey(), unitId: task.unitId!, unitName: task.unitName, body: parsed.data as UnitCheckCreateInput });
      if (outcome.kind === 'rejected') {
        setError(sentence(outcome.message));
        return;
      }
      toast('success', outcome.kind === 'sent' ? 'Check sent.' : 'Check saved on this phone; it will be sent when you have signal.');
      onDone();
    } finally {
      setBusy(false);
    }
  };

  const [aLabel, bLabel] = kind === 'establishment' ? ['Plants in the frame', null] : ['Caged height, in', 'Open height, in'];
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3" aria-label="Record a check">
      <SelectField label="Kind of check" value={kind} onChange={(e) => setKind(e.target.value as FieldCheckKind)}>
        <option value="establishment">Establishment: plants per frame</option>
        <option value="browse">Browse: caged and open pairs</option>
      </SelectField>
      <TextField label="Checked on" type="date" max={today} value={checkedOn} onChange={(e) => setCheckedOn(e.target.value)} />
      {kind === 'establishment' ? <TextField label="Frame area, ft²" inputMode="decimal" value={frameSqFt} onChange={(e) => setFrame(e.target.value)} /> : null}
      <fieldset className="flex flex-col gap-2">
        <legend className="text-sm font-semibold">{kind === 'establishment' ? 'One line per frame tossed' : 'One line per cage and its open pair'}</legend>
        {rows.map((r, i) => (
          <div key={i} className="grid grid-cols-2 gap-2">
            <TextField label={`Species ${i + 1}`} value={r.species} onChange={(e) => setRow(i, { species: e.target.value })} className="col-span-2" />
            <TextField label={aLabel} inputMode="decimal" value={r.a} onChange={(e) => setRow(i, { a: e.target.value })} />
            {bLabel ? <TextField label={bLabel} inputMode="decimal" value={r.b} onChange={(e) => setRow(i, { b: e.target.value })} /> : null}
          </div>
        ))}
        <Button type="button" variant="secondary" onClick={() => setRows((all) => [...all, { species: all[all.length - 1]?.species ?? '', a: '', b: '' }])}>
          Add a line
        </Button>
      </fieldset>
      {kind === 'establishment' ? (
        <>
          <TextField label="Ground cover, %" inputMode="decimal" value={groundCoverPct} onChange={(e) => setCover(e.target.value)} />
          <SelectField label="Weed pressure" value={weedPressure} onChange={(e) => setWeeds(e.target.value)}>
            {WEED_PRESSURES.map((w) => (
              <option key={w} value={w}>
                {w}
              </option>
            ))}
          </SelectField>
        </>
      ) : null}
      {error ? (
        <p role="alert" className="text-sm font-semibold text-[#A04A25]">
          {error}
        </p>
      ) : null}
      {queue.waiting.length > 0 ? <p className="text-sm text-slate">{queue.waiting.length} check(s) waiting to send from this phone.</p> : null}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" busy={busy} className="min-h-12">
          Save check
        </Button>
        <Button type="button" variant="secondary" onClick={onDone} className="min-h-12">
          Cancel
        </Button>
      </div>
    </form>
  );
}
