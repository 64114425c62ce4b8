import type { Metadata } from "next";
import Link from "next/link";
import { GaugeUploadForm } from "@/components/gauges/gauge-upload-form";
import { PlanningCaution } from "@/components/results/planning-caution";
import { Denied } from "@/components/ui/denied";
import { basinPageAccess } from "@/lib/auth/page-access";
import { formatIn, unitLabel } from "@/lib/format/quantities";
import { formatDay } from "@/lib/format/zoned-time";
import { gaugeReachChoices, listGaugeRecords } from "@/lib/services/gauges";
import { listTemperatureRecords } from "@/lib/services/temperature-records";
import { TemperatureUploadForm } from "@/components/gauges/temperature-upload-form";

export const metadata: Metadata = { title: "Gauges" };

const SHOWN = ["7Q10", "1Q10", "30Q5", "7Q2"];

/** A basin's gauge records and their design low flows; planners upload new ones here. */
export default async function GaugesPage({ params }: { params: Promise<{ basinId: string }> }) {
  const { basinId } = await params;
  const access = await basinPageAccess(basinId, "scenario.read");
  if (!access.ok) return <Denied message={access.message} />;
  const canUpload = access.can("network.import");
  const [gauges, reaches, temperatures] = await Promise.all([
    listGaugeRecords(access.scope),
    canUpload ? gaugeReachChoices(access.scope) : Promise.resolve([]),
    listTemperatureRecords(access.scope),
  ]);
  const system = access.basin.unitSystem;
  const zone = access.basin.timeZone ?? "UTC";
  const flow = unitLabel("flow", system);
  const temperatureUnit = unitLabel("temperature", system);
  return (
    <div className="space-y-6">
      <section className="card space-y-3">
        <h2>Gauges and their low flows</h2>
        <p className="text-sm text-ink-soft">
          Design low flows from each gauge&apos;s daily record: the lowest n-day mean flow of every climatic year, fitted with the log-Pearson Type III
          distribution (method of moments on log flows). Years with a missing day are left out and counted.
        </p>
        {gauges.length === 0 ? (
          <p className="text-sm">No daily flow records yet.{canUpload ? " Upload one below." : ""}</p>
        ) : (
          <div className="overflow-x-auto">
            <table className="data-table" data-testid="gauge-table">
              <thead>
                <tr>
                  <th>Gauge</th>
                  <th>Reach</th>
                  <th>Record</th>
                  {SHOWN.map((s) => (
                    <th key={s} className="num">
                      {s} ({flow})
                    </th>
                  ))}
                  <th>Uploaded</th>
                </tr>
              </thead>
              <tbody>
                {gauges.map((g) => (
                  <tr key={g.id}>
                    <td>
                      <Link href={`/basins/${access.basin.id}/gauges/${g.id}`}>{g.name}</Link>
                      {g.stationCode && <span className="block font-mono text-xs text-ink-faint">{g.stationCode}</span>}
                    </td>
                    <td className="font-mono text-xs">{g.reachId ?? "—"}</td>
                    <td className="whitespace-nowrap text-sm">
                      {g.firstDay} to {g.lastDay}
                    </td>
                    {SHOWN.map((s) => (
                      <td key={s} className="num">
                        {formatIn("flow", g.designFlows.find((d) => d.name === s)?.value, system)}
                      </td>
                    ))}
                    <td className="whitespace-nowrap text-sm">
                      {formatDay(new Date(g.uploadedAt), zone)}
                      {g.uploadedBy ? `, ${g.uploadedBy}` : ""}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>
      {canUpload && <GaugeUploadForm basinId={access.basin.id} reachIds={reaches} />}
      <section className="card space-y-3">
        <h2>Water-temperature records</h2>
        <p className="text-sm text-ink-soft">
          Daily mean water temperatures. A condition&apos;s design temperature can come from one of them by a stated rule; shown here by the usual
          one, the 90th percentile of June–September daily means (common practice).
        </p>
        {temperatures.length === 0 ? (
          <p className="text-sm">No temperature records yet.{canUpload ? " Upload one below." : ""}</p>
        ) : (
          <div className="overflow-x-auto">
            <table className="data-table" data-testid="temperature-table">
              <thead>
                <tr>
                  <th>Record</th>
                  <th>Reach</th>
                  <th>Days</th>
                  <th className="num">June–September 90th percentile ({temperatureUnit})</th>
                  <th>Uploaded</th>
                </tr>
              </thead>
              <tbody>
                {temperatures.map((t) => (
                  <tr key={t.id}>
                    <td>
                      {t.name}
                      {t.stationCode && <span className="block font-mono text-xs text-ink-faint">{t.stationCode}</span>}
                      <span className="block font-mono text-xs text-ink-faint">{t.fileName}</span>
                    </td>
                    <td className="font-mono text-xs">{t.reachId ?? "—"}</td>
                    <td className="whitespace-nowrap text-sm">
                      {t.firstDay} to {t.lastDay} ({t.dayCount.toLocaleString("en")}, {t.missingDays.toLocaleString("en")} missing)
                    </td>
                    <td className="num">{formatIn("temperature", t.summer?.value_c, system)}</td>
                    <td className="whitespace-nowrap text-sm">
                      {formatDay(new Date(t.uploadedAt), zone)}
                      {t.uploadedBy ? `, ${t.uploadedBy}` : ""}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>
      {canUpload && <TemperatureUploadForm basinId={access.basin.id} reachIds={reaches} />}
      <PlanningCaution />
    </div>
  );
}
