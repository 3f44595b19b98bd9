import type { ButtonHTMLAttributes } from 'react';

export type Variant = 'primary' | 'secondary' | 'danger' | 'ghost';

const VARIANTS: Record<Variant, string> = {
  primary: 'bg-moss text-white hover:bg-moss-deep disabled:bg-slate/50',
  secondary: 'bg-card text-ink border border-rule hover:border-moss hover:text-moss-deep',
  danger: 'bg-clay text-white hover:brightness-95',
  ghost: 'text-moss-deep hover:bg-moss/10',
};

/** The classes of a button in one of our variants, for links that look like buttons. */
export function buttonClasses(variant: Variant = 'primary', className = ''): string {
  return `inline-flex items-center justify-center gap-2 rounded px-4 py-2 text-sm font-semibold transition-colors disabled:cursor-not-allowed ${VARIANTS[variant]} ${className}`;
}

/** A button in one of our variants; `busy` disables it and says so. */
export function Button({ variant = 'primary', busy, className = '', children, disabled, ...rest }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant; busy?: boolean }) {
  return (
    <button
      className={buttonClasses(variant, className)}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      {...rest}
    >
      {busy ? <span className="inline-block size-3 animate-spin rounded-full border-2 border-current border-t-transparent" aria-hidden /> : null}
      {children}
    </button>
  );
}
