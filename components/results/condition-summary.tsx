import type { UnitSystem } from "@/lib/domain";
import { formatIn, formatNumber, unitLabel } from "@/lib/format/quantities";
import { formatDo } from "@/lib/results/do-scale";
import type { ConditionRow } from "@/lib/results/run-conditions";

/** "meets" in reed, "fails" in clay: whether a condition's lowest DO meets the criterion. */
export function MeetsBadge({ meets }: { meets: boolean }) {
  return meets ? (
    <span className="rounded bg-reed-100 px-1.5 py-0.5 text-xs font-semibold text-reed-700">meets</span>
  ) : (
    <span className="rounded bg-clay-100 px-1.5 py-0.5 text-xs font-semibold text-clay-700">fails</span>
  );
}

export function GoverningBadge() {
  return <span className="ml-2 rounded bg-tarn-100 px-1.5 py-0.5 text-xs font-semibold text-tarn-900">governing</span>;
}

/**
 * A row per design condition of a run: its lowest DO, where, and whether the criterion is
 * met, the governing one marked. With `onSelect`, each row offers to show its condition on
 * the map and profile.
 */
export function ConditionSummary({
  rows,
  unitSystem,
  selected,
  onSelect,
}: {
  rows: ConditionRow[];
  unitSystem: UnitSystem;
  selected?: number;
  onSelect?: (index: number) => void;
}) {
  const len = unitLabel("length", unitSystem);
  return (
    <div className="overflow-x-auto">
      <table className="data-table" data-testid="condition-summary">
        <thead>
          <tr>
            <th>Condition</th>
            <th className="num">Lowest DO (mg/L)</th>
            <th>Where</th>
            <th className="num hidden sm:table-cell">Criterion (mg/L)</th>
            <th>Criterion</th>
            {onSelect && <th />}
          </tr>
        </thead>
        <tbody>
          {rows.map((r, i) => (
            <tr key={r.name} data-governing={r.governing ? "true" : undefined} className={i === selected ? "font-semibold" : undefined}>
              <td>
                {r.name}
                {r.governing && rows.length > 1 && <GoverningBadge />}
              </td>
              <td className="num">{formatDo(r.minimum.do_mg_l)}</td>
              <td className="whitespace-nowrap">
                {r.minimum.reach}, {formatIn("length", r.minimum.km, unitSystem)} {len}
              </td>
              <td className="num hidden sm:table-cell">{formatNumber("do", r.criterion_do_mg_l)}</td>
              <td>
                <MeetsBadge meets={r.meets} />
                {r.points_below > 0 && <span className="ml-2 hidden text-xs text-ink-soft sm:inline">{r.points_below} point(s) below</span>}
              </td>
              {onSelect && (
                <td>
                  {i === selected ? (
                    <span className="text-xs text-ink-soft">shown below</span>
                  ) : (
                    <button type="button" className="text-sm underline" onClick={() => onSelect(i)} aria-label={`Show “${r.name}” on the map and profile`}>
                      Show
                    </button>
                  )}
                </td>
              )}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
