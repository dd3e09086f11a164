/** Threadline's mark: a bore line threaded beneath two existing lines. */
export function Logo({ className }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" aria-hidden className={className}>
      <rect width="32" height="32" rx="7" fill="currentColor" opacity="0.14" />
      <path d="M9 6v9M23 6v9" stroke="currentColor" strokeWidth="3" strokeLinecap="round" opacity="0.7" />
      <path d="M4 22c5-4 9-4 12 0s7 4 12 0" fill="none" stroke="currentColor" strokeWidth="3" strokeLinecap="round" />
    </svg>
  );
}
