/** Our mark: a loop seen edge-on, its two nulls in amber, the source as a dot. */
export function QuietfixMark({ className = 'h-8 w-8' }: { className?: string }) {
  return (
    <svg viewBox="0 0 64 64" className={className} aria-hidden="true">
      <rect width="64" height="64" rx="14" fill="#0b5e55" />
      <circle cx="32" cy="32" r="17" fill="none" stroke="#fbfaf6" strokeWidth="5" />
      <path d="M32 6v16M32 42v16" stroke="#c8780a" strokeWidth="5" strokeLinecap="round" />
      <circle cx="32" cy="32" r="4" fill="#fbfaf6" />
    </svg>
  );
}

export function Wordmark() {
  return (
    <span className="flex items-center gap-2 text-xl font-extrabold tracking-tight text-ink">
      <QuietfixMark />
      <span>
        Quiet<span className="text-hush-700">fix</span>
      </span>
    </span>
  );
}
