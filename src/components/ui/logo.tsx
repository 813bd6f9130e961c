/** Meltwire's mark: a molten drop crossed by a wire. */
export function Logo({ className = 'h-7 w-7' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden>
      <rect width="32" height="32" rx="7" fill="#221c18" />
      <path d="M16 5c3.6 5 7 8.6 7 13a7 7 0 0 1-14 0c0-4.4 3.4-8 7-13z" fill="#f0642a" />
      <path d="M3 19h26" stroke="#f3ece4" strokeWidth="2.2" strokeLinecap="round" />
    </svg>
  );
}
