import { useState } from 'react';
import type { BuckDto } from '../../../../shared/schemas/cameras';
import { AGE_CLASS_LABELS } from '../../../../shared/schemas/results';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { useToast } from '../../../components/ui/toast';
import { useCreateBuck } from '../api/cameras';
import { BuckEditor } from './buck-editor';

/** The property's bucks across seasons: photos, age class per season and notes; the number is its key in the review grid. */
export function BuckRoster({ propertyId, bucks }: { propertyId: number; bucks: BuckDto[] }) {
  const create = useCreateBuck(propertyId);
  const toast = useToast();
  const [name, setName] = useState('');
  const [editing, setEditing] = useState<number | null>(null);
  return (
    <div className="flex flex-col gap-3">
      {bucks.length === 0 ? <p className="text-sm text-slate">No bucks on the roster yet: add the ones you can tell apart by their antlers.</p> : null}
      <ol className="flex flex-col gap-2">
        {bucks.map((b, i) => (
          <li key={b.id} className="flex flex-col gap-2 rounded border border-rule p-2">
            <div className="flex items-center gap-3">
              <span className="w-6 text-center font-semibold text-slate" title="Key in the review grid">{i < 9 ? i + 1 : ''}</span>
              {b.photos[0] ? <img src={b.photos[0].thumbnailUrl ?? b.photos[0].url} alt="" className="h-12 w-16 rounded object-cover" /> : null}
              <div className="flex flex-col text-sm">
                <span className="font-semibold">{b.name}</span>
                <span className="text-slate">
                  {b.photoCount} photo{b.photoCount === 1 ? '' : 's'}
                  {b.ageEstimates.length ? ` · ${b.ageEstimates.map((a) => `${a.season}: ${AGE_CLASS_LABELS[a.ageClass]}`).join(', ')}` : ''}
                  {b.notes ? ` · ${b.notes}` : ''}
                </span>
              </div>
              {editing !== b.id ? (
                <Button type="button" size="sm" variant="ghost" className="ml-auto" aria-label={`Age and notes of ${b.name}`} onClick={() => setEditing(b.id)}>
                  Age and notes
                </Button>
              ) : null}
            </div>
            {editing === b.id ? <BuckEditor propertyId={propertyId} buck={b} onDone={() => setEditing(null)} /> : null}
          </li>
        ))}
      </ol>
      <form
        className="flex items-end gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          create.mutate({ name }, { onSuccess: () => setName(''), onError: (err) => toast('error', err.message) });
        }}
      >
        <TextField label="New buck" value={name} onChange={(e) => setName(e.target.value)} placeholder="e.g. Split G2" />
        <Button type="submit" variant="secondary" disabled={!name.trim()} busy={create.isPending}>
          Add to the roster
        </Button>
      </form>
    </div>
  );
}
