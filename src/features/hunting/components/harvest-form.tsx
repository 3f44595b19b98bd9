import { useState } from 'react';
import { AGE_CLASSES, AGE_CLASS_LABELS, HarvestCreateSchema, type HarvestCreateInput } from '../../../../shared/schemas/results';
import type { StandWindsRow } from '../../../../shared/schemas/hunting';
import { useSits } from '../api/sits';
import { useCreateHarvest } from '../api/harvests';
import { firmToday, formatDay } from '../../../lib/firm-clock';

/** A deer taken: the day, sex and age, the stand and sit it came from, and the state's disease-sampling number. */
export function HarvestForm({ propertyId, stands }: { propertyId: number; stands: StandWindsRow[] }) {
  const sits = useSits(propertyId);
  const create = useCreateHarvest(propertyId);
  const [v, setV] = useState({ date: firmToday(), sex: 'male', ageClass: '2.5', stand: '', sit: '', sample: '', weight: '' });
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const input = 'min-h-11 rounded border border-rule px-2';
  const standSits = (sits.data ?? []).filter((s) => !v.stand || String(s.standUnitId) === v.stand).slice(0, 20);
  return (
    <form
      aria-label="Record a harvest"
      className="flex flex-col gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        const body: HarvestCreateInput = {
          date: v.date,
          sex: v.sex as 'male' | 'female',
          ageClass: v.ageClass as (typeof AGE_CLASSES)[number],
          ...(v.weight.trim() ? { dressedWeightLb: Number(v.weight) } : {}),
          ...(v.stand ? { standUnitId: Number(v.stand) } : {}),
          ...(v.sit ? { sitId: Number(v.sit) } : {}),
          ...(v.sample.trim() ? { diseaseSampleNumber: v.sample.trim() } : {}),
        };
        const checked = HarvestCreateSchema.safeParse(body);
        if (!checked.success) return setMessage({ ok: false, text: checked.error.issues[0]?.message ?? 'Check the harvest.' });
        create.mutate(body, {
          onSuccess: () => setMessage({ ok: true, text: 'Harvest recorded.' }),
          onError: (err) => setMessage({ ok: false, text: err instanceof Error ? err.message : 'The harvest was not saved.' }),
        });
      }}
    >
      <div className="grid grid-cols-2 gap-2">
        <label className="flex flex-col gap-1 text-sm">Date taken<input type="date" className={input} value={v.date} onChange={(e) => setV({ ...v, date: e.target.value })} /></label>
        <label className="flex flex-col gap-1 text-sm">Dressed weight (lb)<input inputMode="decimal" className={input} value={v.weight} onChange={(e) => setV({ ...v, weight: e.target.value })} /></label>
        <label className="flex flex-col gap-1 text-sm">Sex<select className={input} value={v.sex} onChange={(e) => setV({ ...v, sex: e.target.value })}><option value="male">Buck</option><option value="female">Doe</option></select></label>
        <label className="flex flex-col gap-1 text-sm">Age class<select className={input} value={v.ageClass} onChange={(e) => setV({ ...v, ageClass: e.target.value })}>{AGE_CLASSES.map((a) => <option key={a} value={a}>{AGE_CLASS_LABELS[a]}</option>)}</select></label>
      </div>
      <label className="flex flex-col gap-1 text-sm">Stand<select className={input} value={v.stand} onChange={(e) => setV({ ...v, stand: e.target.value, sit: '' })}><option value="">Not from a stand</option>{stands.map((s) => <option key={s.unitId} value={s.unitId}>{s.name}</option>)}</select></label>
      <label className="flex flex-col gap-1 text-sm">Sit<select className={input} value={v.sit} onChange={(e) => setV({ ...v, sit: e.target.value })}><option value="">No logged sit</option>{standSits.map((s) => <option key={s.id} value={s.id}>{`${s.standName}, ${formatDay(new Date(s.startedAt))}`}</option>)}</select></label>
      <label className="flex flex-col gap-1 text-sm">Disease-sampling number (if the state sampled it)<input className={input} value={v.sample} onChange={(e) => setV({ ...v, sample: e.target.value })} /></label>
      <button type="submit" disabled={create.isPending} className="min-h-12 rounded bg-moss-deep px-4 font-semibold text-white">Save harvest</button>
      {message ? <p role={message.ok ? 'status' : 'alert'} className={`text-sm ${message.ok ? 'text-moss-deep' : 'text-[#8E3F2A]'}`}>{message.text}</p> : null}
    </form>
  );
}
