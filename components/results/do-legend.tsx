import { doLegend, type DoScaleOptions } from "@/lib/results/do-scale";

/** Key to the DO map: the bands relative to the criterion, then the point markers. */
export function DoLegend({ criterionMgL, scale }: { criterionMgL: number; scale?: DoScaleOptions }) {
  return (
    <figure className="text-sm" data-testid="do-legend">
      <figcaption className="mb-1 font-semibold text-ink-soft">Dissolved oxygen</figcaption>
      <ul className="space-y-1">
        {doLegend(criterionMgL, scale).map((s) => (
          <li key={s.band} className="flex items-center gap-2">
            <span
              aria-hidden
              className="inline-block h-2 w-8 rounded-full"
              style={
                s.band === "anoxic"
                  ? { background: `repeating-linear-gradient(90deg, ${s.colour} 0 6px, #f7f6f1 6px 8px)`, outline: `2px solid ${s.colour}` }
                  : { background: s.colour }
              }
            />
            <span>{s.label}</span>
          </li>
        ))}
        <li className="flex items-center gap-2">
          <span aria-hidden className="inline-block h-3.5 w-3.5 rounded-full border-[3px] border-ink-soft" />
          <span>critical point of a reach (larger when below the criterion)</span>
        </li>
        <li className="flex items-center gap-2">
          <span aria-hidden className="inline-block h-2.5 w-2.5 rounded-full border border-ink bg-white" />
          <span>discharger outfall</span>
        </li>
      </ul>
    </figure>
  );
}
