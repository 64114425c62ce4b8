import { formatDo } from "@/lib/results/do-scale";
import { outcomeVerdict, type RunOutcome } from "@/lib/results/run-outcome";

/**
 * A finished run's outcome in a table cell: its lowest DO under the governing condition
 * (named when the run had several) and whether it works (feasible, or meets the criterion).
 */
export function RunOutcomeCell({ outcome }: { outcome: RunOutcome | null | undefined }) {
  if (!outcome) return <span className="text-ink-faint">—</span>;
  const ok = outcome.feasible ?? outcome.meetsCriterion;
  return (
    <span data-testid="run-outcome">
      <span className="whitespace-nowrap">
        Lowest DO {outcome.lowestDoMgL < 0 ? "anoxic" : `${formatDo(outcome.lowestDoMgL)} mg/L`}
      </span>
      {outcome.conditionCount > 1 && <span className="block text-xs text-ink-faint">under “{outcome.condition}” (governing)</span>}
      <span className={`block text-xs font-medium ${ok ? "text-reed-700" : "text-clay-700"}`}>{outcomeVerdict(outcome)}</span>
    </span>
  );
}
