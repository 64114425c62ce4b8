import type { Metadata } from "next";
import Link from "next/link";
import { SurveyUploadForm } from "@/components/surveys/survey-upload-form";
import { PlanningCaution } from "@/components/results/planning-caution";
import { Denied } from "@/components/ui/denied";
import { basinPageAccess } from "@/lib/auth/page-access";
import { formatDay } from "@/lib/format/zoned-time";
import { surveyPeriod } from "@/lib/format/survey";
import { listSurveys } from "@/lib/services/surveys";

export const metadata: Metadata = { title: "Surveys" };

/** A basin's synoptic surveys (field measurements along the rivers); planners upload new ones here. */
export default async function SurveysPage({ params }: { params: Promise<{ basinId: string }> }) {
  const { basinId } = await params;
  const access = await basinPageAccess(basinId, "scenario.read");
  if (!access.ok) return <Denied message={access.message} />;
  const canUpload = access.can("network.import");
  const surveys = await listSurveys(access.scope);
  const zone = access.basin.timeZone ?? "UTC";
  return (
    <div className="space-y-6">
      <section className="card space-y-3">
        <h2>Synoptic surveys</h2>
        <p className="text-sm text-ink-soft">
          Measurements taken along the rivers on one occasion — DO, water temperature, BOD, ammonia, flow — each placed on a reach and km of the
          network. They are the evidence a model is calibrated against and checked with.
        </p>
        {surveys.length === 0 ? (
          <p className="text-sm">No surveys yet.{canUpload ? " Upload one below." : ""}</p>
        ) : (
          <div className="overflow-x-auto">
            <table className="data-table" data-testid="survey-table">
              <thead>
                <tr>
                  <th>Survey</th>
                  <th>Taken</th>
                  <th className="num">Stations</th>
                  <th className="num">Samples</th>
                  <th>Placed on</th>
                  <th>Uploaded</th>
                </tr>
              </thead>
              <tbody>
                {surveys.map((s) => (
                  <tr key={s.id}>
                    <td>
                      <Link href={`/basins/${access.basin.id}/surveys/${s.id}`}>{s.name}</Link>
                      <span className="block font-mono text-xs text-ink-faint">{s.fileName}</span>
                    </td>
                    <td className="whitespace-nowrap text-sm">{surveyPeriod(s.firstTime, s.lastTime)}</td>
                    <td className="num">{s.stationCount}</td>
                    <td className="num">{s.sampleCount}</td>
                    <td className="whitespace-nowrap text-sm">network version {s.networkVersion}</td>
                    <td className="whitespace-nowrap text-sm">
                      {formatDay(new Date(s.uploadedAt), zone)}
                      {s.uploadedBy ? `, ${s.uploadedBy}` : ""}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>
      {canUpload && <SurveyUploadForm basinId={access.basin.id} />}
      <PlanningCaution />
    </div>
  );
}
