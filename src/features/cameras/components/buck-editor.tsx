/** The consultant's edit of one roster buck: its age class per season and notes (PATCH …/bucks/:buckId). */
import { useState } from 'react';
import type { BuckDto } from '../../../../shared/schemas/cameras';
import { BuckUpdateSchema } from '../../../../shared/schemas/cameras';
import { AGE_CLASSES, type AgeClass } from '../../../../shared/domain/survey-estimates';
import { AGE_CLASS_LABELS } from '../../../../shared/schemas/results';
import { Button } from '../../../components/ui/button';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { firmToday } from '../../../lib/firm-clock';
import { useUpdateBuck } from '../api/cameras';

type Estimate = BuckDto['ageEstimates'][number];

/** Age class per season and notes of one buck; saves the whole list at once, or says what to change. */
export function BuckEditor({ propertyId, buck, onDone }: { propertyId: number; buck: BuckDto; onDone: () => void }) {
  const update = useUpdateBuck(propertyId);
  const thisSeason = Number(firmToday().slice(0, 4));
  const [estimates, setEstimates] = useState<Estimate[]>(() => [...buck.ageEstimates].sort((a, b) => b.season - a.season));
  const [notes, setNotes] = useState(buck.notes ?? '');
  const [error, setError] = useState<string | null>(null);
  const input = 'rounded border border-rule bg-card px-2 py-1 text-sm';
  const setAt = (i: number, next: Estimate) => setEstimates(estimates.map((e, j) => (j === i ? next : e)));
  // The next season to add: this season first, then the one before the earliest listed.
  const nextSeason = estimates.some((a) => a.season === thisSeason) ? Math.min(...estimates.map((a) => a.season)) - 1 : thisSeason;
  return (
    <form
      aria-label={`Edit ${buck.name}`}
      className="flex flex-col gap-3 rounded border border-moss/40 bg-paper p-3"
      onSubmit={(e) => {
        e.preventDefault();
        const body = { notes: notes.trim() || null, ageEstimates: estimates };
        const checked = BuckUpdateSchema.safeParse(body);
        const seasons = body.ageEstimates.map((a) => a.season);
        if (!checked.success) return setError(checked.error.issues[0]?.message ?? 'Check the age classes.');
        if (new Set(seasons).size !== seasons.length) return setError('Give one age class per season.');
        setError(null);
        update.mutate({ buckId: buck.id, input: body }, { onSuccess: onDone, onError: (err) => setError(err.message) });
      }}
    >
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-sm font-semibold">Age class by season</legend>
        {estimates.length === 0 ? <p className="text-sm text-slate">No age class yet: add this season’s estimate.</p> : null}
        {estimates.map((a, i) => (
          <div key={i} className="flex flex-wrap items-end gap-2">
            <label className="flex flex-col gap-1 text-xs text-slate">
              Season
              <input type="number" className={`${input} w-24`} min={1990} max={2100} value={a.season} onChange={(e) => setAt(i, { ...a, season: Number(e.target.value) })} />
            </label>
            <label className="flex flex-col gap-1 text-xs text-slate">
              Age class
              <select className={input} value={a.ageClass} onChange={(e) => setAt(i, { ...a, ageClass: e.target.value as AgeClass })}>
                {AGE_CLASSES.map((c) => (
                  <option key={c} value={c}>{AGE_CLASS_LABELS[c]}</option>
                ))}
              </select>
            </label>
            <Button type="button" size="sm" variant="ghost" onClick={() => setEstimates(estimates.filter((_, j) => j !== i))}>
              Remove
            </Button>
          </div>
        ))}
        <div>
          <Button type="button" size="sm" variant="secondary" onClick={() => setEstimates([...estimates, { season: nextSeason, ageClass: '2.5' }])}>
            Add season {nextSeason}
          </Button>
        </div>
      </fieldset>
      <TextAreaField label="Notes" rows={2} maxLength={2000} value={notes} onChange={(e) => setNotes(e.target.value)} placeholder="e.g. split brow tine on the left; beds on the south point" />
      {error ? <p role="alert" className="text-sm text-clay">{error}</p> : null}
      <div className="flex gap-2">
        <Button type="submit" busy={update.isPending}>Save buck</Button>
        <Button type="button" variant="ghost" onClick={onDone}>Cancel</Button>
      </div>
    </form>
  );
}
