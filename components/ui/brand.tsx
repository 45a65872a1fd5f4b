/** Vicinal's mark: a query point ringed by its nearest neighbours. */
export function BrandMark({ size = 28 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true">
      <circle cx="16" cy="16" r="14" fill="none" stroke="#d9a441" strokeWidth="2" strokeDasharray="3 3" />
      <circle cx="16" cy="16" r="4" fill="#1f5f5b" />
      <circle cx="7.5" cy="11" r="2.6" fill="#2b7a73" />
      <circle cx="24" cy="9.5" r="2.6" fill="#2b7a73" />
      <circle cx="22.5" cy="23.5" r="2.6" fill="#b4533c" />
    </svg>
  );
}

export function Wordmark({ inverted = false }: { inverted?: boolean }) {
  return (
    <span className="inline-flex items-center gap-2">
      <BrandMark />
      <span className={`text-lg font-extrabold tracking-tight ${inverted ? "text-white" : "text-ink"}`}>Vicinal</span>
    </span>
  );
}
