import { SelectField } from './select-field';

/** A list's "Status" filter: every state by its label, and "All states" (the empty value) for none. */
export function StatusFilter<S extends string>({ value, states, labels, onChange }: { value: S | null | undefined; states: readonly S[]; labels: Record<S, string>; onChange: (value: string) => void }) {
  return (
    <SelectField label="Status" value={value ?? ''} onChange={(e) => onChange(e.target.value)} className="w-44">
      <option value="">All states</option>
      {states.map((s) => (
        <option key={s} value={s}>
          {labels[s]}
        </option>
      ))}
    </SelectField>
  );
}
