import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { PlanningCaution } from "@/components/results/planning-caution";
import { Denied } from "@/components/ui/denied";
import { basinPageAccess } from "@/lib/auth/page-access";
import { AppError } from "@/lib/errors";
import { formatIn, unitLabel } from "@/lib/format/quantities";
import { surveyPeriod } from "@/lib/format/survey";
import { formatWhen } from "@/lib/format/zoned-time";
import { listScenarios } from "@/lib/services/scenarios";
import { getSurvey, listSurveys } from "@/lib/services/surveys";
import { CalibrationForm } from "@/components/surveys/calibration-form";
import { HydraulicFit } from "@/components/surveys/hydraulic-fit";
import { listNetworks } from "@/lib/services/networks";

export const metadata: Metadata = { title: "Survey" };

const mgl = (v: number | null) => (v === null ? "—" : v.toFixed(2));

/** One synoptic survey: where it came from, how each sample was placed on the network, and its values. */
export default async function SurveyPage({ params }: { params: Promise<{ basinId: string; surveyId: string }> }) {
  const { basinId, surveyId } = await params;
  const access = await basinPageAccess(basinId, "scenario.read");
  if (!access.ok) return <Denied message={access.message} />;
  const survey = await getSurvey(access.scope, surveyId).catch((e) => {
    if (e instanceof AppError && e.status === 404) return null;
    throw e;
  });
  if (!survey) notFound();
  const canCalibrate = access.can("scenario.run");
  const scenarios = canCalibrate
    ? (await listScenarios(access.scope)).map((s) => ({ id: s.id, name: s.name, networkVersion: s.networkVersion, conditions: s.inputs.conditions.map((c) => c.name) }))
    : [];
  const canFit = access.can("network.import");
  const measuredReaches = [
    ...survey.samples
      .filter((x) => x.flow_m3s !== null && (x.velocity_m_s ?? null) !== null && (x.depth_m ?? null) !== null)
      .reduce((m, x) => m.set(x.reach, (m.get(x.reach) ?? 0) + 1), new Map<string, number>()),
  ]
    .filter(([, n]) => n >= 2)
    .map(([id, count]) => ({ id, count }));
  const newest = canFit && measuredReaches.length ? (await listNetworks(access.scope)).reduce<{ id: string; version: number } | null>((a, n) => (!a || n.version > a.version ? { id: n.id, version: n.version } : a), null) : null;
  const otherSurveys = canCalibrate ? (await listSurveys(access.scope)).filter((s) => s.id !== survey.id).map((s) => ({ id: s.id, name: s.name })) : [];
  const system = access.basin.unitSystem;
  const zone = access.basin.timeZone ?? "UTC";
  const snapped = survey.samples.filter((s) => s.placement === "snapped");
  const farthest = snapped.reduce((m, s) => Math.max(m, s.distance_m ?? 0), 0);
  const has = (k: "temperature_c" | "bod5_mg_l" | "cbodu_mg_l" | "nh3n_mg_l" | "flow_m3s" | "do_mg_l" | "velocity_m_s" | "depth_m") => survey.samples.some((s) => (s[k] ?? null) !== null);
  const u = survey.units;
  return (
    <div className="space-y-6">
      <p className="text-sm">
        <Link href={`/basins/${access.basin.id}/surveys`}>All surveys</Link>
      </p>
      <section className="card space-y-2">
        <h2>{survey.name}</h2>
        <p className="text-sm text-ink-soft" data-testid="survey-provenance">
          {survey.sampleCount} samples at {survey.stationCount} stations · taken {surveyPeriod(survey.firstTime, survey.lastTime)} · read from{" "}
          {survey.fileName} (SHA-256 <span className="font-mono text-xs">{survey.sha256.slice(0, 16)}…</span>) with temperature in °{u.temperatureUnit}, flow in{" "}
          {u.flowUnit === "cfs" ? "cfs" : "m³/s"}, a plain &ldquo;bod&rdquo; column as {u.bodKind === "bod5" ? "BOD5" : "CBODu"} · uploaded{" "}
          {formatWhen(new Date(survey.uploadedAt), zone)}
          {survey.uploadedBy ? ` by ${survey.uploadedBy}` : ""}
        </p>
        <p className="text-sm text-ink-soft" data-testid="survey-placement">
          Placed on network version {survey.networkVersion}: {snapped.length} by their coordinates
          {snapped.length > 0 ? ` (nearest reach, within ${u.maxSnapDistanceM} m; the farthest ${formatIn("distance", farthest, system)} ${unitLabel("distance", system)} off its reach)` : ""},{" "}
          {survey.samples.length - snapped.length} at the reach and km the file gives.
        </p>
      </section>
      <section className="card space-y-3">
        <h2>Samples</h2>
        <div className="overflow-x-auto">
          <table className="data-table" data-testid="survey-samples">
            <thead>
              <tr>
                <th>Station</th>
                <th>Taken</th>
                <th>Reach</th>
                <th className="num">At ({unitLabel("length", system)} from the head)</th>
                <th className="num">Off the reach ({unitLabel("distance", system)})</th>
                {has("do_mg_l") && <th className="num">DO (mg/L)</th>}
                {has("temperature_c") && <th className="num">Temperature ({unitLabel("temperature", system)})</th>}
                {has("bod5_mg_l") && <th className="num">BOD5 (mg/L)</th>}
                {has("cbodu_mg_l") && <th className="num">CBODu (mg/L)</th>}
                {has("nh3n_mg_l") && <th className="num">NH3-N (mg/L)</th>}
                {has("flow_m3s") && <th className="num">Flow ({unitLabel("flow", system)})</th>}
                {has("velocity_m_s") && <th className="num">Velocity ({unitLabel("velocity", system)})</th>}
                {has("depth_m") && <th className="num">Depth ({unitLabel("depth", system)})</th>}
              </tr>
            </thead>
            <tbody>
              {survey.samples.map((s) => (
                <tr key={s.row}>
                  <td>{s.station}</td>
                  <td className="whitespace-nowrap text-sm">{s.time ? s.time.replace("T", " ") : "—"}</td>
                  <td className="font-mono text-xs">{s.reach}</td>
                  <td className="num">{formatIn("length", s.km, system)}</td>
                  <td className="num">{s.distance_m === null ? "given" : formatIn("distance", s.distance_m, system)}</td>
                  {has("do_mg_l") && <td className="num">{mgl(s.do_mg_l)}</td>}
                  {has("temperature_c") && <td className="num">{formatIn("temperature", s.temperature_c, system)}</td>}
                  {has("bod5_mg_l") && <td className="num">{mgl(s.bod5_mg_l)}</td>}
                  {has("cbodu_mg_l") && <td className="num">{mgl(s.cbodu_mg_l)}</td>}
                  {has("nh3n_mg_l") && <td className="num">{mgl(s.nh3n_mg_l)}</td>}
                  {has("flow_m3s") && <td className="num">{formatIn("flow", s.flow_m3s, system)}</td>}
                  {has("velocity_m_s") && <td className="num">{formatIn("velocity", s.velocity_m_s, system)}</td>}
                  {has("depth_m") && <td className="num">{formatIn("depth", s.depth_m, system)}</td>}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </section>
      {newest && <HydraulicFit basinId={access.basin.id} surveyId={survey.id} network={newest} reaches={measuredReaches} />}
      {canCalibrate && (
        <CalibrationForm
          basinId={access.basin.id}
          surveyId={survey.id}
          surveyNetworkVersion={survey.networkVersion} scenarios={scenarios}
          otherSurveys={otherSurveys}
          stations={[...new Map(survey.samples.filter((x) => x.do_mg_l !== null).map((x) => [x.station, { station: x.station, weight: x.weight ?? 1 }])).values()]}
        />
      )}
      <PlanningCaution />
    </div>
  );
}
