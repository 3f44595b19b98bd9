import { useState } from 'react';
import type { WindName } from '../../../../shared/domain/stand-winds';
import { SitCreateSchema, type StandWindsRow } from '../../../../shared/schemas/hunting';
import { newSitKey } from '../lib/sit-queue';
import type { SitSaveOutcome } from '../hooks/use-sit-queue';

const localInput = (d: Date) => new Date(d.getTime() - d.getTimezoneOffset() * 60000).toISOString().slice(0, 16);

/** A roster buck as the sit form's picker shows it. */
export interface RosterBuck {
  id: number;
  name: string;
}

/** Log a sit from a phone: stand, start and end, wind, deer seen (with the roster's bucks told apart), notes. Saved on the phone first, then sent. */
export function SitForm({ propertyId, stands, standId, wind, bucks = [], save }: { propertyId: number; stands: StandWindsRow[]; standId: number | null; wind: WindName | null; bucks?: RosterBuck[]; save: (input: { key: string; propertyId: number; standName: string; body: import('../../../../shared/schemas/hunting').SitCreateInput }) => Promise<SitSaveOutcome> }) {
  const now = new Date();
  const [stand, setStand] = useState(String(standId ?? stands[0]?.unitId ?? ''));
  const [start, setStart] = useState(localInput(new Date(now.getTime() - 3 * 3600_000)));
  const [end, setEnd] = useState(localInput(now));
  const [seen, setSeen] = useState({ bucks: '0', does: '0', fawns: '0' });
  const [mph, setMph] = useState('');
  const [notes, setNotes] = useState('');
  const [buckIds, setBuckIds] = useState<number[]>([]);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const input = 'min-h-11 rounded border border-rule px-2';
  return (
    <form
      className="flex flex-col gap-3"
      aria-label="Log a sit"
      onSubmit={async (e) => {
        e.preventDefault();
        const body = {
          standUnitId: Number(stand),
          startedAt: new Date(start).toISOString(),
          endedAt: new Date(end).toISOString(),
          ...(wind ? { windFrom: wind } : {}),
          ...(mph.trim() ? { windMph: Number(mph) } : {}),
          seen: { bucks: Number(seen.bucks), does: Number(seen.does), fawns: Number(seen.fawns) },
          ...(notes.trim() ? { notes: notes.trim() } : {}),
          ...(buckIds.length ? { buckIds } : {}),
        };
        const checked = SitCreateSchema.safeParse(body);
        if (!checked.success) {
          setMessage({ ok: false, text: checked.error.issues[0]?.message ?? 'Check the sit.' });
          return;
        }
        const outcome = await save({ key: newSitKey(), propertyId, standName: stands.find((s) => String(s.unitId) === stand)?.name ?? 'Stand', body });
        setMessage(outcome.kind === 'sent' ? { ok: true, text: 'Sit logged.' } : outcome.kind === 'queued' ? { ok: true, text: 'Saved on this phone — will send when you’re back online.' } : { ok: false, text: outcome.message });
      }}
    >
      <label className="flex flex-col gap-1 text-sm">
        Stand
        <select className={input} value={stand} onChange={(e) => setStand(e.target.value)}>
          {stands.map((s) => (
            <option key={s.unitId} value={s.unitId}>{s.name}</option>
          ))}
        </select>
      </label>
      <div className="grid grid-cols-2 gap-2">
        <label className="flex flex-col gap-1 text-sm">Started<input type="datetime-local" className={input} value={start} onChange={(e) => setStart(e.target.value)} /></label>
        <label className="flex flex-col gap-1 text-sm">Ended<input type="datetime-local" className={input} value={end} onChange={(e) => setEnd(e.target.value)} /></label>
      </div>
      <p className="text-sm">Wind: {wind ? `from ${wind}` : 'not picked (pick it above)'}</p>
      <div className="grid grid-cols-4 gap-2">
        {(['bucks', 'does', 'fawns'] as const).map((k) => (
          <label key={k} className="flex flex-col gap-1 text-sm capitalize">
            {k}
            <input inputMode="numeric" className={input} value={seen[k]} onChange={(e) => setSeen({ ...seen, [k]: e.target.value })} />
          </label>
        ))}
        <label className="flex flex-col gap-1 text-sm">mph<input inputMode="decimal" className={input} value={mph} onChange={(e) => setMph(e.target.value)} /></label>
      </div>
      {bucks.length ? (
        <fieldset className="flex flex-col gap-1 text-sm">
          <legend className="mb-1">Bucks you could tell apart (camera roster)</legend>
          <div className="flex flex-wrap gap-2">
            {bucks.map((b) => {
              const on = buckIds.includes(b.id);
              return (
                <label key={b.id} className={`flex min-h-11 cursor-pointer items-center gap-2 rounded border px-3 ${on ? 'border-moss bg-moss/10 font-semibold' : 'border-rule'}`}>
                  <input
                    type="checkbox"
                    className="h-4 w-4 accent-moss"
                    checked={on}
                    onChange={() => {
                      const next = on ? buckIds.filter((id) => id !== b.id) : [...buckIds, b.id];
                      setBuckIds(next);
                      // A buck told apart is a buck seen: the count is never below the bucks named.
                      if (Number(seen.bucks) < next.length || !/^\d+$/.test(seen.bucks)) setSeen({ ...seen, bucks: String(Math.max(next.length, Number(seen.bucks) || 0)) });
                    }}
                  />
                  {b.name}
                </label>
              );
            })}
          </div>
        </fieldset>
      ) : null}
      <label className="flex flex-col gap-1 text-sm">Notes<textarea className="rounded border border-rule p-2" rows={2} value={notes} onChange={(e) => setNotes(e.target.value)} /></label>
      <button type="submit" className="min-h-12 rounded bg-moss-deep px-4 font-semibold text-white">Save sit</button>
      {message ? <p role={message.ok ? 'status' : 'alert'} className={`text-sm ${message.ok ? 'text-moss-deep' : 'text-[#8E3F2A]'}`}>{message.text}</p> : null}
    </form>
  );
}
