/**
 * Sagline's name mark: a river line that dips and recovers — the oxygen sag —
 * with a dashed level for the criterion it must stay above.
 */
export function NameMark({ className = "", compact = false }: { className?: string; compact?: boolean }) {
  return (
    <span className={`inline-flex items-center gap-2 ${className}`}>
      <svg viewBox="0 0 40 24" width="40" height="24" aria-hidden="true" className="shrink-0">
        <line x1="2" y1="15" x2="38" y2="15" stroke="#c08a2e" strokeWidth="1.4" strokeDasharray="2.5 2.5" />
        <path
          d="M2 6 C 9 6, 11 19, 17 19 S 28 7, 38 6"
          fill="none"
          stroke="#2f6f73"
          strokeWidth="3"
          strokeLinecap="round"
        />
      </svg>
      {!compact && <span className="text-lg font-semibold tracking-tight text-ink">Sagline</span>}
    </span>
  );
}
