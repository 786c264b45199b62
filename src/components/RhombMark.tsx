/** The Rhomb logo: nested rhombi, drawn inline so it needs no request. */
export function RhombMark({ className = "h-7 w-7" }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true">
      <path d="M16 2 30 16 16 30 2 16Z" fill="currentColor" />
      <path d="M16 8 24 16 16 24 8 16Z" fill="#f7f5ef" />
      <path d="M16 12 20 16 16 20 12 16Z" fill="#d9822b" />
    </svg>
  );
}
