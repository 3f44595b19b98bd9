import { forwardRef, useId, type TextareaHTMLAttributes } from 'react';

interface Props extends TextareaHTMLAttributes<HTMLTextAreaElement> {
  label: string;
  error?: string;
  hint?: string;
}

/** A labelled multi-line text box with its error or hint under it. */
export const TextAreaField = forwardRef<HTMLTextAreaElement, Props>(function TextAreaField({ label, error, hint, id, className = '', rows = 3, ...rest }, ref) {
  const autoId = useId();
  const areaId = id ?? autoId;
  const describedBy = error ? `${areaId}-error` : hint ? `${areaId}-hint` : undefined;
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={areaId} className="text-sm font-semibold text-ink">
        {label}
      </label>
      <textarea
        ref={ref}
        id={areaId}
        rows={rows}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`rounded border bg-white px-3 py-2 text-ink placeholder:text-slate/70 focus:border-moss focus:outline-none focus:ring-2 focus:ring-moss/30 ${error ? 'border-clay' : 'border-rule'}`}
        {...rest}
      />
      {error ? (
        <p id={`${areaId}-error`} className="text-sm text-clay">
          {error}
        </p>
      ) : hint ? (
        <p id={`${areaId}-hint`} className="text-sm text-slate">
          {hint}
        </p>
      ) : null}
    </div>
  );
});
