/** Ampwright's mark: a copper bolt through a cable lug. */
export function Logo({ className }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true">
      <rect x="1" y="1" width="30" height="30" rx="7" fill="#c26f33" />
      <circle cx="16" cy="16" r="9" fill="none" stroke="#1d2125" strokeWidth="3" />
      <path d="M17.5 7.5 11.5 17h4l-1.5 7.5 6.5-10h-4z" fill="#fffdf9" stroke="#1d2125" strokeWidth="1.2" strokeLinejoin="round" />
    </svg>
  );
}
