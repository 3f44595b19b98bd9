import type { ReactNode } from 'react';

/** A panel on the paper background. */
export function Card({ title, action, children, className = '' }: { title?: ReactNode; action?: ReactNode; children: ReactNode; className?: string }) {
  return (
    <section className={`rounded-md border border-rule bg-card p-4 shadow-[0_1px_0_rgba(31,42,36,0.04)] ${className}`}>
      {title || action ? (
        <header className="mb-3 flex items-baseline justify-between gap-3">
          {title ? <h2 className="text-base font-bold text-ink">{title}</h2> : <span />}
          {action}
        </header>
      ) : null}
      {children}
    </section>
  );
}

/** What to do when a list is empty. */
export function EmptyState({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="rounded border border-dashed border-rule px-4 py-6 text-center">
      <p className="font-serif text-sm text-ink">{title}</p>
      {children ? <div className="mt-1 text-sm text-slate">{children}</div> : null}
    </div>
  );
}

/** A caution, boxed in clay, that defers to local codes and licensed practice. */
export function CautionBox({ title, children }: { title: string; children: ReactNode }) {
  return (
    <aside role="note" aria-label={title} className="rounded-md border-l-4 border-clay bg-clay/5 px-4 py-3 text-sm text-ink">
      <p className="mb-1 font-semibold text-[#8E3F2A]">{title}</p>
      {children}
    </aside>
  );
}

/** A loading line for lists and pages. */
export function Loading({ label = 'Loading…' }: { label?: string }) {
  return (
    <p role="status" className="py-6 text-center text-sm text-slate">
      {label}
    </p>
  );
}

/** An error message with what to do next; `onRetry` adds a "Try again" button. */
export function ErrorPanel({ error, onRetry }: { error: unknown; onRetry?: () => void }) {
  const message = error instanceof Error ? error.message : 'Something went wrong.';
  return (
    <div role="alert" className="rounded-md border border-clay/40 bg-clay/5 px-4 py-3 text-sm text-ink">
      <p className="font-semibold text-clay">This could not be loaded.</p>
      <p>{message}</p>
      {onRetry ? (
        <button type="button" onClick={onRetry} className="mt-2 rounded border border-clay/60 bg-card px-3 py-1 font-semibold text-ink hover:border-clay">
          Try again
        </button>
      ) : null}
    </div>
  );
}
