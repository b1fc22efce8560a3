/** Quiltline's mark: a roll of straw-coloured quilt laid between two timber joists, and the word. */
export function Logo({ compact = false }: { compact?: boolean }) {
  return (
    <span className="inline-flex items-center gap-2">
      <svg viewBox="0 0 32 32" width="28" height="28" aria-hidden className="shrink-0">
        <rect x="1.5" y="1.5" width="29" height="29" rx="5" fill="#faf7f0" stroke="#33363b" strokeWidth="2" />
        <rect x="6" y="7" width="20" height="18" rx="2" fill="#e2b94b" />
        <path d="M6 12.5h20M6 18.5h20" stroke="#a57e16" strokeWidth="1.4" strokeDasharray="2.4 1.8" />
        <path d="M5 4v24M27 4v24" stroke="#8a5a2b" strokeWidth="2.6" strokeLinecap="round" />
      </svg>
      {!compact && <span className="text-lg font-semibold tracking-tight text-graphite">Quiltline</span>}
    </span>
  );
}
