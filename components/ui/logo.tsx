/** Our mark: a horizon line broken by a rising flare. */
export function Logo({ className }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" aria-hidden="true" className={className}>
      <circle cx="16" cy="16" r="15" fill="#0e1730" />
      <path d="M3 20h10l3-9 3 9h10" fill="none" stroke="#e8650c" strokeWidth="2.2" strokeLinejoin="round" />
      <circle cx="16" cy="8" r="1.6" fill="#fde9d8" />
    </svg>
  );
}
