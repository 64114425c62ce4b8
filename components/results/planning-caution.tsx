import { PLANNING_CAUTION } from "@/lib/results/caution";

/** The planning caution shown on every results view (PRODUCT.md, Cautions). */
export function PlanningCaution({ className = "" }: { className?: string }) {
  return (
    <aside role="note" aria-label="Planning caution" data-testid="planning-caution" className={`rounded-md border-l-4 border-ochre-500 bg-ochre-100 px-4 py-3 text-sm text-ochre-700 ${className}`}>
      {PLANNING_CAUTION.map((line) => (
        <p key={line}>{line}</p>
      ))}
    </aside>
  );
}
