/**
 * The Spoolbook mark: a notebook page's ring binding wound into a spool. Decorative; the word
 * beside it carries the name.
 */
export function BrandMark({ className = 'size-7' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true" focusable="false">
      <rect x="2" y="2" width="28" height="28" rx="6" fill="#0f766e" />
      <circle cx="16" cy="16" r="9" fill="none" stroke="#f7f3ea" strokeWidth="2" />
      <path d="M16 7a9 9 0 0 1 9 9M16 11.5a4.5 4.5 0 0 1 4.5 4.5" fill="none" stroke="#f3dfcf" strokeWidth="2" strokeLinecap="round" />
      <circle cx="16" cy="16" r="1.8" fill="#f7f3ea" />
    </svg>
  );
}

export function BrandWord({ className = '' }: { className?: string }) {
  return <span className={`text-xl font-semibold tracking-tight text-ink ${className}`}>Spoolbook</span>;
}
