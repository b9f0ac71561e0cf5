/** Correlary's mark: a fitted curve threading measured points inside a bracketed validity band. */
export function Logo({ size = 28, withName = true }: { size?: number; withName?: boolean }) {
  return (
    <span className="inline-flex items-center gap-2">
      <svg width={size} height={size} viewBox="0 0 32 32" role="img" aria-label="Correlary logo">
        <rect x="1" y="1" width="30" height="30" rx="7" fill="#0f5f66" />
        <path d="M7 6v20M25 6v20" stroke="#f0c978" strokeWidth="1.6" strokeLinecap="round" />
        <path d="M5 24 C 11 23, 14 18, 17 14 S 23 8, 27 7" fill="none" stroke="#ffffff" strokeWidth="2.2" strokeLinecap="round" />
        <circle cx="10" cy="22" r="1.6" fill="#f0c978" />
        <circle cx="16" cy="15.5" r="1.6" fill="#f0c978" />
        <circle cx="22" cy="9.8" r="1.6" fill="#f0c978" />
      </svg>
      {withName && <span className="text-lg font-semibold tracking-tight text-ink">Correlary</span>}
    </span>
  );
}
