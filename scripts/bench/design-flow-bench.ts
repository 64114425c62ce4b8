/**
 * Design flows from a 50-year daily record (issue 15: 7Q10 from a 50-year record ≤ 200 ms):
 * reading the CSV text and computing 1Q10, 7Q10, 30Q5 and 7Q2 (n-day minima by climatic
 * year, log-Pearson III fits). The record is made here from a fixed formula (a seasonal
 * cycle with year-to-year and day-to-day variation), so every run reads the same data.
 */
import { lowFlowStatistics } from "../../lib/hydrology/low-flow";
import { readDailyRecord } from "../../lib/hydrology/read-record";
import { ms, time } from "./measure";

export function designFlowBench(years = 50): void {
  const rows = ["date,flow"];
  for (let t = Date.UTC(1970, 3, 1), i = 0; t < Date.UTC(1970 + years, 3, 1); t += 86_400_000, i++) {
    const flow = 7 + 4.5 * Math.cos((2 * Math.PI * i) / 365.25) + 1.2 * Math.sin(i / 411) + 0.2 * Math.sin(i * 1.7);
    rows.push(`${new Date(t).toISOString().slice(0, 10)},${flow.toFixed(3)}`);
  }
  const text = rows.join("\n");
  const read = time(() => readDailyRecord(text, "m3/s"), 5);
  const stats = time(() => lowFlowStatistics(read.last), 5);
  const total = read.median + stats.median;
  const q = stats.last.statistics.find((s) => s.name === "7Q10")!;
  console.log(
    `design flows, ${years}-year daily record (${rows.length - 1} days): read ${ms(read.median)}, n-day minima + LP3 ${ms(stats.median)}, ` +
      `total ${ms(total)} against the 200 ms target (${(total / 200).toFixed(2)}×); 7Q10 ${q.value?.toFixed(3)} m3/s over ${stats.last.years_used} years`,
  );
}

if (process.argv[1]?.endsWith("design-flow-bench.ts")) designFlowBench(Number(process.argv[2] ?? 50));
