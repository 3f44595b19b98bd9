import { useState } from 'react';
import { useUploadWindRecord, useWindRecord } from '../api/wind-record';
import { ApiError } from '../../../lib/api-client';
import { percent } from '../lib/wind-view';

/** The property's wind rose, and (staff) the upload of an hourly wind file. */
export function WindRecordCard({ propertyId, canEdit }: { propertyId: number; canEdit: boolean }) {
  const record = useWindRecord(propertyId);
  const upload = useUploadWindRecord(propertyId);
  const [file, setFile] = useState<File | null>(null);
  const [months, setMonths] = useState('9,10,11,12,1');
  const [hours, setHours] = useState<'hunting' | 'all'>('hunting');
  const r = record.data;
  return (
    <div className="flex flex-col gap-3">
      {r ? (
        <div>
          <p className="text-sm text-slate">
            {r.source === 'sectors' ? 'Typed wind frequencies.' : `${r.hours} hours from ${r.fileName ?? 'a wind file'} (${r.hoursFilter === 'hunting' ? '30 min before sunrise to 30 min after sunset' : 'all hours'}; months ${r.months.join(', ')}; ${r.calmHours} calm).`}
          </p>
          <ul className="mt-2 grid grid-cols-4 gap-1 text-xs sm:grid-cols-8" aria-label="Wind rose">
            {r.rose.map((x) => (
              <li key={x.from} className="rounded border border-rule px-1 py-0.5">
                <span className="font-semibold">{x.from}</span> {percent(x.share)}
              </li>
            ))}
          </ul>
        </div>
      ) : (
        <p className="text-sm text-slate">No wind record yet{canEdit ? ': upload hourly observations (CSV time,direction,speed or ISD-Lite) to see each stand’s share of huntable hours.' : '.'}</p>
      )}
      {canEdit ? (
        <form
          className="flex flex-wrap items-end gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            if (file) upload.mutate({ file, months, hours });
          }}
        >
          <label className="flex flex-col text-sm">Wind file<input type="file" accept=".csv,.txt" onChange={(e) => setFile(e.target.files?.[0] ?? null)} /></label>
          <label className="flex flex-col text-sm">Months<input className="min-h-10 w-36 rounded border border-rule px-2" value={months} onChange={(e) => setMonths(e.target.value)} /></label>
          <label className="flex flex-col text-sm">
            Hours
            <select className="min-h-10 rounded border border-rule px-2" value={hours} onChange={(e) => setHours(e.target.value as 'hunting' | 'all')}>
              <option value="hunting">Hunting light</option>
              <option value="all">All</option>
            </select>
          </label>
          <button type="submit" disabled={!file || upload.isPending} className="min-h-10 rounded bg-moss-deep px-3 text-sm font-semibold text-white disabled:opacity-50">{upload.isPending ? 'Reading…' : 'Upload'}</button>
          {upload.error ? <p role="alert" className="w-full text-sm text-[#8E3F2A]">{upload.error instanceof ApiError ? upload.error.message : 'Not saved.'}</p> : null}
        </form>
      ) : null}
    </div>
  );
}
