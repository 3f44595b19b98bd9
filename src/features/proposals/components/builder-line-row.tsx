/** One line of the proposal builder: its inputs (labelled for screen readers, problems under them), the column heads and a notice. */
import { useId, type ReactNode } from 'react';
import { formatCents } from '../../../../shared/domain/money';
import type { LineCategory } from '../../../../shared/schemas/proposal-dto';
import { CATEGORY_LABELS, LINE_CATEGORIES, lineField, type DraftLine } from '../utils/draft-form';

const cellInput = (invalid: boolean, extra = '') =>
  `w-full rounded border bg-white px-2 py-1.5 text-sm text-ink focus:border-moss focus:outline-none focus:ring-2 focus:ring-moss/30 ${invalid ? 'border-clay' : 'border-rule'} ${extra}`;

/** One input of a line, labelled for screen readers, its problem under it. */
function LineInput({ label, value, error, onChange, onBlur, className = '', inputClassName = '', autoFocus, inputMode, prefix, title }: {
  label: string;
  title?: string;
  value: string;
  error?: string;
  onChange: (v: string) => void;
  onBlur: () => void;
  className?: string;
  inputClassName?: string;
  autoFocus?: boolean;
  inputMode?: 'decimal' | 'text';
  prefix?: string;
}) {
  const id = useId();
  return (
    <div className={`flex min-w-0 flex-col gap-0.5 ${className}`}>
      <label htmlFor={id} className="text-xs font-semibold text-slate lg:sr-only">
        {label}
      </label>
      <div className="relative">
        {prefix ? <span aria-hidden className="pointer-events-none absolute left-2 top-1/2 -translate-y-1/2 text-sm text-slate">{prefix}</span> : null}
        <input
          id={id}
          value={value}
          autoFocus={autoFocus}
          inputMode={inputMode}
          title={title}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-error` : undefined}
          onChange={(e) => onChange(e.target.value)}
          onBlur={onBlur}
          className={cellInput(!!error, `${prefix ? 'pl-5' : ''} ${inputClassName}`)}
        />
      </div>
      {error ? (
        <p id={`${id}-error`} className="text-xs text-clay">
          {error}
        </p>
      ) : null}
    </div>
  );
}

function LineCheckbox({ label, checked, onChange }: { label: string; checked: boolean; onChange: (v: boolean) => void }) {
  return (
    <label className="flex items-center gap-1.5 py-1.5 text-sm text-ink lg:justify-center">
      <input type="checkbox" checked={checked} onChange={(e) => onChange(e.target.checked)} className="size-4 accent-moss" />
      <span className="lg:sr-only">{label}</span>
    </label>
  );
}

const ROW_GRID = 'grid grid-cols-2 gap-2 sm:grid-cols-4 lg:grid-cols-[minmax(0,1fr)_7rem_5rem_6rem_6.5rem_3rem_3.5rem_6.5rem_2rem] lg:items-start';

interface LineRowProps {
  line: DraftLine;
  number: number;
  /** The line's amount in cents, when its quantity and price parse. */
  amountCents: number | undefined;
  errorOf: (key: string) => string | undefined;
  onChange: (patch: Partial<DraftLine>) => void;
  onTouch: (key: string) => void;
  onRemove: () => void;
  autoFocus: boolean;
  currency: string;
}

/** One editable line: description, category, quantity, unit, unit price, taxable, optional, amount. */
export function LineRow({ line, number, amountCents, errorOf, onChange, onTouch, onRemove, autoFocus, currency }: LineRowProps) {
  const categoryId = useId();
  const f = (field: keyof DraftLine) => lineField(line.key, field);
  const lineError = errorOf(lineField(line.key, 'line'));
  return (
    <div role="group" aria-label={`Line ${number}: ${line.description.trim() || 'new line'}`} className={`${ROW_GRID} border-b border-rule/70 py-2 last:border-0`}>
      <LineInput
        label="Description"
        value={line.description}
        error={errorOf(f('description'))}
        onChange={(description) => onChange({ description })}
        onBlur={() => onTouch(f('description'))}
        autoFocus={autoFocus}
        title={line.description}
        className="col-span-2 sm:col-span-4 lg:col-span-1"
      />
      <div className="flex min-w-0 flex-col gap-0.5">
        <label htmlFor={categoryId} className="text-xs font-semibold text-slate lg:sr-only">
          Category
        </label>
        <select id={categoryId} value={line.category} onChange={(e) => onChange({ category: e.target.value as LineCategory })} className={cellInput(false, 'pr-1')}>
          {LINE_CATEGORIES.map((c) => (
            <option key={c} value={c}>
              {CATEGORY_LABELS[c]}
            </option>
          ))}
        </select>
      </div>
      <LineInput label="Quantity" value={line.quantity} inputMode="decimal" inputClassName="text-right tabular-nums" error={errorOf(f('quantity'))} onChange={(quantity) => onChange({ quantity })} onBlur={() => onTouch(f('quantity'))} />
      <LineInput label="Unit" value={line.unit} error={errorOf(f('unit'))} onChange={(unit) => onChange({ unit })} onBlur={() => onTouch(f('unit'))} />
      <LineInput label="Unit price" prefix="$" value={line.unitPrice} inputMode="decimal" inputClassName="text-right tabular-nums" error={errorOf(f('unitPrice'))} onChange={(unitPrice) => onChange({ unitPrice })} onBlur={() => onTouch(f('unitPrice'))} />
      <LineCheckbox label="Taxable" checked={line.taxable} onChange={(taxable) => onChange({ taxable })} />
      <LineCheckbox label="Optional" checked={line.optional} onChange={(optional) => onChange({ optional })} />
      <p className="figure self-center py-1.5 text-right text-sm tabular-nums" aria-label="Amount">
        {amountCents !== undefined ? (
          line.optional ? (
            <span className="text-slate" title="An option: counts once the client chooses it">
              ({formatCents(amountCents, currency)})
            </span>
          ) : (
            formatCents(amountCents, currency)
          )
        ) : (
          <span className="text-slate">—</span>
        )}
      </p>
      <button type="button" onClick={onRemove} aria-label={`Delete line ${number}`} title="Delete this line" className="self-center justify-self-end rounded px-2 py-1 text-lg leading-none text-slate hover:bg-clay/10 hover:text-clay">
        ×
      </button>
      {lineError ? <p className="col-span-full text-xs text-clay">{lineError}</p> : null}
    </div>
  );
}

/** The column heads of the lines table (wide screens only). */
export function ColumnHeads() {
  return (
    <div aria-hidden className={`${ROW_GRID} hidden border-b border-rule pb-1 text-xs uppercase tracking-wide text-slate lg:grid`}>
      <span>Description</span>
      <span>Category</span>
      <span className="text-right">Qty</span>
      <span>Unit</span>
      <span className="text-right">Unit price</span>
      <span className="text-center">Tax</span>
      <span className="text-center">Option</span>
      <span className="text-right">Amount</span>
      <span />
    </div>
  );
}

/** A notice above the form: a problem (clay, an alert) or a note (sky, a status). */
export function Notice({ children, tone = 'clay' }: { children: ReactNode; tone?: 'clay' | 'sky' }) {
  return (
    <div role={tone === 'clay' ? 'alert' : 'status'} className={`rounded-md border-l-4 px-4 py-3 text-sm ${tone === 'clay' ? 'border-clay bg-clay/5' : 'border-sky bg-sky/5'}`}>
      {children}
    </div>
  );
}
