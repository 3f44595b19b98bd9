import type { ButtonHTMLAttributes } from 'react';

export type Variant = 'primary' | 'secondary' | 'danger' | 'danger-outline' | 'ghost';

const VARIANTS: Record<Variant, string> = {
  primary: 'bg-moss text-white hover:bg-moss-deep disabled:bg-slate/50',
  secondary: 'bg-card text-ink border border-rule hover:border-moss hover:text-moss-deep',
  danger: 'bg-clay text-white hover:brightness-95',
  'danger-outline': 'bg-card text-clay border border-clay/60 hover:border-clay hover:bg-clay/5',
  ghost: 'text-moss-deep hover:bg-moss/10',
};

export type Size = 'md' | 'sm';
const SIZES: Record<Size, string> = { md: 'px-4 py-2', sm: 'px-3 py-1' };

/** The classes of a button in one of our variants, for links that look like buttons. */
export function buttonClasses(variant: Variant = 'primary', className = '', size: Size = 'md'): string {
  return `inline-flex items-center justify-center gap-2 rounded text-sm font-semibold transition-colors disabled:cursor-not-allowed ${SIZES[size]} ${VARIANTS[variant]} ${className}`;
}

/** A button in one of our variants; `busy` disables it and says so. */
export function Button({ variant = 'primary', size = 'md', busy, className = '', children, disabled, ...rest }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant; size?: Size; busy?: boolean }) {
  return (
    <button
      className={buttonClasses(variant, className, size)}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      {...rest}
    >
      {busy ? <span className="inline-block size-3 animate-spin rounded-full border-2 border-current border-t-transparent" aria-hidden /> : null}
      {children}
    </button>
  );
}
