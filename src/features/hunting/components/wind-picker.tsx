import { useState } from 'react';
import { WIND_NAMES, windSector, type WindName } from '../../../../shared/domain/stand-winds';

/** Pick the wind now: one of 16 buttons, or degrees typed (where it blows from, as forecasts give it). */
export function WindPicker({ value, onChange }: { value: WindName | null; onChange: (w: WindName) => void }) {
  const [degrees, setDegrees] = useState('');
  const [error, setError] = useState<string | null>(null);
  return (
    <div className="flex flex-col gap-2">
      <div role="group" aria-label="Wind from" className="grid grid-cols-4 gap-1 sm:grid-cols-8">
        {WIND_NAMES.map((w) => (
          <button key={w} type="button" aria-pressed={value === w} onClick={() => onChange(w)} className={`min-h-11 rounded border px-2 text-sm font-semibold ${value === w ? 'border-moss-deep bg-moss-deep text-white' : 'border-rule bg-card text-ink'}`}>
            {w}
          </button>
        ))}
      </div>
      <form
        className="flex items-end gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          const d = Number(degrees);
          if (degrees.trim() === '' || !Number.isFinite(d) || d < 0 || d > 360) {
            setError('Type the wind direction in degrees, 0 to 360 (where it blows from).');
            return;
          }
          setError(null);
          onChange(windSector(d));
        }}
      >
        <label className="flex flex-col text-sm">
          <span>Or degrees (from)</span>
          <input inputMode="numeric" value={degrees} onChange={(e) => setDegrees(e.target.value)} className="min-h-11 w-28 rounded border border-rule px-2" aria-invalid={error ? true : undefined} />
        </label>
        <button type="submit" className="min-h-11 rounded border border-rule px-3 text-sm">Use</button>
      </form>
      {error ? <p role="alert" className="text-sm text-[#8E3F2A]">{error}</p> : null}
    </div>
  );
}
