import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { FrequencyChart } from "@/components/gauges/frequency-chart";
import { PlanningCaution } from "@/components/results/planning-caution";
import { Denied } from "@/components/ui/denied";
import { Notice } from "@/components/ui/notice";
import { basinPageAccess } from "@/lib/auth/page-access";
import { AppError } from "@/lib/errors";
import { formatIn, unitLabel } from "@/lib/format/quantities";
import { formatWhen } from "@/lib/format/zoned-time";
import { frequencyPlot } from "@/lib/results/frequency-plot";
import { getGaugeRecord } from "@/lib/services/gauges";

export const metadata: Metadata = { title: "Gauge record" };

/** One gauge record: its design low flows, the fits behind them, the frequency plot and the annual minima. */
export default async function GaugePage({ params }: { params: Promise<{ basinId: string; gaugeId: string }> }) {
  const { basinId, gaugeId } = await params;
  const access = await basinPageAccess(basinId, "scenario.read");
  if (!access.ok) return <Denied message={access.message} />;
  const gauge = await getGaugeRecord(access.scope, gaugeId).catch((e) => {
    if (e instanceof AppError && e.status === 404) return null;
    throw e;
  });
  if (!gauge) notFound();
  const system = access.basin.unitSystem;
  const flow = unitLabel("flow", system);
  const stats = gauge.statistics;
  const sevenDay = stats.annual_minima["7"] ?? [];
  const plot = frequencyPlot(sevenDay, stats.lp3["7"]);
  return (
    <div className="space-y-6">
      <p className="text-sm">
        <Link href={`/basins/${access.basin.id}/gauges`}>All gauges</Link>
      </p>
      <section className="card space-y-2">
        <h2>{gauge.name}</h2>
        <p className="text-sm text-ink-soft" data-testid="gauge-provenance">
          {gauge.stationCode ? `Station ${gauge.stationCode} · ` : ""}
          {gauge.reachId ? `on reach ${gauge.reachId} · ` : ""}
          daily record {gauge.firstDay} to {gauge.lastDay} ({gauge.dayCount.toLocaleString("en")} days, {gauge.missingDays.toLocaleString("en")} missing) ·
          read in {gauge.unit === "cfs" ? "cfs" : "m³/s"} from {gauge.fileName} (SHA-256 <span className="font-mono text-xs">{gauge.sha256.slice(0, 16)}…</span>) ·
          uploaded {formatWhen(new Date(gauge.uploadedAt), access.basin.timeZone ?? "UTC")}
          {gauge.uploadedBy ? ` by ${gauge.uploadedBy}` : ""}
        </p>
        <p className="text-sm text-ink-soft">
          Climatic years start on {gauge.climaticYearStart} · {stats.years_used} complete years used, {stats.years_excluded} left out
        </p>
      </section>
      {stats.warnings.length > 0 && (
        <Notice tone="warning" title="About this record">
          <ul className="list-disc pl-5">
            {stats.warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </Notice>
      )}
      <section className="card space-y-3">
        <h2>Design low flows</h2>
        <div className="overflow-x-auto">
          <table className="data-table" data-testid="design-flow-table">
            <thead>
              <tr>
                <th>Statistic</th>
                <th className="num">log-Pearson III ({flow})</th>
                <th className="num">From the ranked years ({flow})</th>
                <th className="num">Days</th>
                <th className="num">Return period (years)</th>
              </tr>
            </thead>
            <tbody>
              {gauge.designFlows.map((d) => (
                <tr key={d.name}>
                  <td>{d.name}</td>
                  <td className="num">{formatIn("flow", d.value, system)}</td>
                  <td className="num">{formatIn("flow", d.empirical, system)}</td>
                  <td className="num">{d.days}</td>
                  <td className="num">{d.return_period_years}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <p className="text-xs text-ink-faint">
          &quot;From the ranked years&quot; reads the same return period off the sorted annual minima (plotting position m/(n + 1)), where the record is long
          enough; a dash means it is not.
        </p>
      </section>
      <section className="card space-y-3">
        <h2>7-day low flows: frequency plot</h2>
        {plot.points.length > 0 ? <FrequencyChart plot={plot} days={7} unitSystem={system} /> : <p className="text-sm">No complete year to plot.</p>}
      </section>
      <section className="card space-y-3">
        <h2>The fits</h2>
        <div className="overflow-x-auto">
          <table className="data-table" data-testid="lp3-table">
            <thead>
              <tr>
                <th className="num">Days</th>
                <th className="num">Mean of log₁₀ Q</th>
                <th className="num">Standard deviation</th>
                <th className="num">Skew</th>
                <th className="num">Years fitted</th>
                <th className="num">Zero years</th>
              </tr>
            </thead>
            <tbody>
              {Object.entries(stats.lp3).map(([days, f]) => (
                <tr key={days}>
                  <td className="num">{days}</td>
                  <td className="num">{f.mean_log10.toFixed(4)}</td>
                  <td className="num">{f.sd_log10.toFixed(4)}</td>
                  <td className="num">{f.skew.toFixed(3)}</td>
                  <td className="num">{f.years}</td>
                  <td className="num">{f.zero_years}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <p className="text-xs text-ink-faint">Moments of the base-10 logarithms of the non-zero annual minima (flows in m³/s); the skew is bias-corrected.</p>
        <details>
          <summary className="cursor-pointer text-sm">Annual 7-day minima, by climatic year</summary>
          <div className="mt-2 overflow-x-auto">
            <table className="data-table" data-testid="annual-minima-table">
              <thead>
                <tr>
                  <th>Climatic year from</th>
                  <th className="num">7-day minimum ({flow})</th>
                </tr>
              </thead>
              <tbody>
                {sevenDay.map((m) => (
                  <tr key={m.year}>
                    <td>
                      {m.year}-{gauge.climaticYearStart}
                    </td>
                    <td className="num">{formatIn("flow", m.flow, system)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </details>
      </section>
      <PlanningCaution />
    </div>
  );
}
