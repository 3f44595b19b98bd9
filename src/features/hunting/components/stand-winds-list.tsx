import type { StandWindsAnswer } from '../../../../shared/schemas/hunting';
import { percent, reasonText } from '../lib/wind-view';

/** Each stand's 16 winds: suitable ones in moss, unsuitable ones in clay with their named reasons. */
export function StandWindsList({ answer, onEdit }: { answer: StandWindsAnswer; onEdit?: (unitId: number) => void }) {
  return (
    <ul className="flex flex-col gap-3">
      {answer.data.map((s) => {
        const bad = s.winds.filter((w) => !w.suitable);
        return (
          <li key={s.unitId} className="rounded border border-rule p-3" data-testid={`stand-${s.unitId}`}>
            <div className="flex flex-wrap items-baseline justify-between gap-2">
              <h3 className="font-bold">{s.name}</h3>
              <span className="text-sm text-slate">
                {s.standType ? `${s.standType}${s.heightFt ? `, ${s.heightFt} ft` : ''} · ` : ''}huntable hours {percent(s.huntableShare)}
              </span>
            </div>
            <div className="mt-2 flex flex-wrap gap-1" aria-label={`Winds for ${s.name}`}>
              {s.winds.map((w) => (
                <span key={w.from} title={w.suitable ? `Wind from ${w.from}: suits` : `Wind from ${w.from}: ${w.reasons.map(reasonText).join('; ')}`} className={`rounded px-1.5 py-0.5 text-xs font-semibold ${w.suitable ? 'bg-moss/15 text-moss-deep' : 'bg-clay/15 text-[#8E3F2A] line-through'}`}>
                  {w.from}
                </span>
              ))}
            </div>
            {bad.length ? (
              <details className="mt-2 text-sm">
                <summary>Unsuitable winds ({bad.length}) and why</summary>
                <ul className="mt-1 list-disc pl-5">
                  {bad.map((w) => (
                    <li key={w.from}>
                      <strong>{w.from}</strong>: {w.reasons.map(reasonText).join('; ')}
                    </li>
                  ))}
                </ul>
              </details>
            ) : (
              <p className="mt-2 text-sm text-slate">Every wind suits this stand as mapped.</p>
            )}
            {onEdit ? (
              <button type="button" className="mt-2 text-sm underline" onClick={() => onEdit(s.unitId)}>
                Edit what it watches
              </button>
            ) : null}
          </li>
        );
      })}
    </ul>
  );
}
