import { forwardRef, useId, type ReactNode, type SelectHTMLAttributes } from 'react';

interface Props extends SelectHTMLAttributes<HTMLSelectElement> {
  label: string;
  error?: string;
  hint?: string;
  children: ReactNode;
}

/** A labelled select with its error or hint under it, wired for screen readers. */
export const SelectField = forwardRef<HTMLSelectElement, Props>(function SelectField({ label, error, hint, id, className = '', children, ...rest }, ref) {
  const autoId = useId();
  const selectId = id ?? autoId;
  const describedBy = error ? `${selectId}-error` : hint ? `${selectId}-hint` : undefined;
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={selectId} className="text-sm font-semibold text-ink">
        {label}
      </label>
      <select
        ref={ref}
        id={selectId}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`rounded border bg-white px-3 py-2 text-ink focus:border-moss focus:outline-none focus:ring-2 focus:ring-moss/30 ${error ? 'border-clay' : 'border-rule'}`}
        {...rest}
      >
        {children}
      </select>
      {error ? (
        <p id={`${selectId}-error`} className="text-sm text-clay">
          {error}
        </p>
      ) : hint ? (
        <p id={`${selectId}-hint`} className="text-sm text-slate">
          {hint}
        </p>
      ) : null}
    </div>
  );
});
