/** The Browseline word mark: a browse leaf and the name in Merriweather. */
export function Brand({ size = 'md' }: { size?: 'md' | 'lg' }) {
  const px = size === 'lg' ? 36 : 24;
  return (
    <span className="inline-flex items-center gap-2">
      <svg width={px} height={px} viewBox="0 0 32 32" aria-hidden>
        <rect width="32" height="32" rx="6" fill="#3F6B3A" />
        <path d="M8 23c3-9 9-14 16-15-2 6-6 12-16 15z" fill="#F6F3EA" />
        <path d="M8 23l9-9" stroke="#3F6B3A" strokeWidth="1.6" />
      </svg>
      <span className={`font-serif font-bold text-moss-deep ${size === 'lg' ? 'text-3xl' : 'text-lg'}`}>Browseline</span>
    </span>
  );
}
