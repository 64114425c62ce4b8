import type { UnitSystem } from "@/lib/domain";
import { formatIn, formatNumber, unitLabel } from "@/lib/format/quantities";
import type { TmdlTable } from "@/lib/model/allocation/types";

/** TMDL = ΣWLA + ΣLA + MOS + reserve, in the basin's load unit (CBODu). */
export function TmdlSummary({ tmdl, unitSystem }: { tmdl: TmdlTable; unitSystem: UnitSystem }) {
  const u = unitLabel("load", unitSystem);
  const rows: Array<[string, string, number]> = [
    ["ΣWLA", "point sources (waste-load allocations)", tmdl.wla_kg_day],
    ["ΣLA", "headwaters, tributaries and other nonpoint or background loads", tmdl.la_kg_day],
    ["MOS", "margin of safety held as load", tmdl.mos_kg_day],
    ["Reserve", "capacity kept for growth", tmdl.rc_kg_day],
  ];
  return (
    <div className="overflow-x-auto">
    <table className="data-table" data-testid="tmdl-table">
      <thead>
        <tr>
          <th>Part</th>
          <th>What it covers</th>
          <th className="num">CBODu ({u})</th>
        </tr>
      </thead>
      <tbody>
        {rows.map(([part, what, kg]) => (
          <tr key={part}>
            <td className="font-semibold">{part}</td>
            <td>{what}</td>
            <td className="num">{formatIn("load", kg, unitSystem)}</td>
          </tr>
        ))}
        <tr className="border-t-2 border-rule-strong">
          <td className="font-semibold">TMDL</td>
          <td>loading capacity at the design condition</td>
          <td className="num font-semibold">{formatIn("load", tmdl.tmdl_kg_day, unitSystem)}</td>
        </tr>
      </tbody>
      {tmdl.mos_do_mg_l > 0 && (
        <caption className="caption-bottom pt-2 text-left text-xs text-ink-faint">
          A further margin of safety of {formatNumber("do", tmdl.mos_do_mg_l)} mg/L DO was added to the criterion; it is implicit in the loads above.
        </caption>
      )}
    </table>
    </div>
  );
}
