import type { ObservationKind } from '../../../../shared/domain/observations';
import { KIND_SYMBOLS } from '../lib/kind-symbols';

/** A kind of sign's symbol, drawn in the current text colour. */
export function KindSymbol({ kind, className = 'h-6 w-6' }: { kind: ObservationKind; className?: string }) {
  return (
    <svg
      viewBox="0 0 24 24"
      className={className}
      fill="none"
      stroke="currentColor"
      strokeWidth={2}
      strokeLinecap="round"
      strokeLinejoin="round"
      aria-hidden="true"
      dangerouslySetInnerHTML={{ __html: KIND_SYMBOLS[kind] }}
    />
  );
}
