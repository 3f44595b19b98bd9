import { forwardRef, useId, type InputHTMLAttributes } from 'react';

interface Props extends InputHTMLAttributes<HTMLInputElement> {
  label: string;
  error?: string;
  hint?: string;
}

/** A labelled input with its error under it, wired for screen readers. */
export const TextField = forwardRef<HTMLInputElement, Props>(function TextField({ label, error, hint, id, className = '', ...rest }, ref) {
  const autoId = useId();
  const inputId = id ?? autoId;
  const describedBy = error ? `${inputId}-error` : hint ? `${inputId}-hint` : undefined;
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={inputId} className="text-sm font-semibold text-ink">
        {label}
      </label>
      <input
        ref={ref}
        id={inputId}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`rounded border bg-white px-3 py-2 text-ink placeholder:text-slate/70 focus:border-moss focus:outline-none focus:ring-2 focus:ring-moss/30 ${error ? 'border-clay' : 'border-rule'}`}
        {...rest}
      />
      {error ? (
        <p id={`${inputId}-error`} className="text-sm text-clay">
          {error}
        </p>
      ) : hint ? (
        <p id={`${inputId}-hint`} className="text-sm text-slate">
          {hint}
        </p>
      ) : null}
    </div>
  );
});
