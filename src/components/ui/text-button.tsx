import type { ButtonHTMLAttributes } from 'react';

const TONES = {
  moss: 'text-moss-deep hover:bg-moss/10',
  clay: 'text-[#A04A25] hover:bg-clay/10',
} as const;

/** A compact text-only button for row and card actions; clay for destructive ones (archive, delete). */
export function TextButton({ tone = 'moss', className = '', type = 'button', ...rest }: ButtonHTMLAttributes<HTMLButtonElement> & { tone?: keyof typeof TONES }) {
  return <button type={type} className={`inline-flex items-center rounded px-2 py-1 text-sm font-semibold transition-colors disabled:cursor-not-allowed disabled:opacity-50 ${TONES[tone]} ${className}`} {...rest} />;
}
