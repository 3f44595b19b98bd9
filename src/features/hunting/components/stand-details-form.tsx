import { useState } from 'react';
import { STAND_TYPES } from '../../../../shared/domain/unit-kinds';
import { WIND_NAMES } from '../../../../shared/domain/stand-winds';
import type { StandWindsAnswer, StandWindsRow } from '../../../../shared/schemas/hunting';
import { useUpdateStandSite } from '../api/stand-winds';
import { ApiError } from '../../../lib/api-client';

/** What a stand watches, its type, height and the side deer approach from (staff). */
export function StandDetailsForm({ propertyId, stand, answer, onDone }: { propertyId: number; stand: StandWindsRow; answer: StandWindsAnswer; onDone: () => void }) {
  const save = useUpdateStandSite(propertyId);
  const [watched, setWatched] = useState(stand.watchedUnitId ? String(stand.watchedUnitId) : '');
  const [type, setType] = useState(stand.standType ?? '');
  const [height, setHeight] = useState(stand.heightFt === null ? '' : String(stand.heightFt));
  const [approach, setApproach] = useState(stand.approachFrom ?? '');
  const watchable = answer.meta.layout.filter((u) => u.kind !== 'stand-site' && u.kind !== 'access-route');
  const field = 'flex flex-col text-sm gap-1';
  const input = 'min-h-10 rounded border border-rule px-2';
  return (
    <form
      className="grid gap-3 sm:grid-cols-2"
      onSubmit={(e) => {
        e.preventDefault();
        save.mutate(
          { unitId: stand.unitId, input: { watchedUnitId: watched ? Number(watched) : null, standType: (type || null) as never, heightFt: height === '' ? null : Number(height), approachFrom: (approach || null) as never } },
          { onSuccess: onDone },
        );
      }}
    >
      <label className={field}>
        Watches
        <select className={input} value={watched} onChange={(e) => setWatched(e.target.value)}>
          <option value="">Nothing chosen</option>
          {watchable.map((u) => (
            <option key={u.id} value={u.id}>{u.name}</option>
          ))}
        </select>
      </label>
      <label className={field}>
        Deer approach it from
        <select className={input} value={approach} onChange={(e) => setApproach(e.target.value)}>
          <option value="">The nearest bedding area’s side</option>
          {WIND_NAMES.map((w) => (
            <option key={w} value={w}>{w}</option>
          ))}
        </select>
      </label>
      <label className={field}>
        Stand type
        <select className={input} value={type} onChange={(e) => setType(e.target.value)}>
          <option value="">Not said</option>
          {STAND_TYPES.map((t) => (
            <option key={t} value={t}>{t}</option>
          ))}
        </select>
      </label>
      <label className={field}>
        Height, ft
        <input className={input} inputMode="decimal" value={height} onChange={(e) => setHeight(e.target.value)} />
      </label>
      {save.error ? <p role="alert" className="text-sm text-[#8E3F2A] sm:col-span-2">{save.error instanceof ApiError ? save.error.message : 'Not saved.'}</p> : null}
      <div className="flex gap-2 sm:col-span-2">
        <button type="submit" className="min-h-10 rounded bg-moss-deep px-3 text-sm font-semibold text-white">{save.isPending ? 'Saving…' : 'Save stand'}</button>
        <button type="button" className="min-h-10 rounded border border-rule px-3 text-sm" onClick={onDone}>Cancel</button>
      </div>
    </form>
  );
}
