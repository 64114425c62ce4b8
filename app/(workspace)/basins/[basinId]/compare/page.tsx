import type { Metadata } from "next";
import Link from "next/link";
import { ComparisonTable } from "@/components/results/comparison-table";
import { PlanningCaution } from "@/components/results/planning-caution";
import { ProfileOverlayChart } from "@/components/results/profile-overlay-chart";
import { Denied } from "@/components/ui/denied";
import { Notice } from "@/components/ui/notice";
import { getDb } from "@/db/client";
import { basinPageAccess } from "@/lib/auth/page-access";
import { formatTime } from "@/lib/format/zoned-time";
import { inputDifferences } from "@/lib/results/input-diff";
import { runConditions } from "@/lib/results/run-conditions";
import { listFacilities } from "@/lib/services/facilities";
import { getRun, runScenarioRecord } from "@/lib/services/runs";

export const metadata: Metadata = { title: "Compare runs" };

export default async function ComparePage({
  params,
  searchParams,
}: {
  params: Promise<{ basinId: string }>;
  searchParams: Promise<{ runs?: string }>;
}) {
  const { basinId } = await params;
  const { runs = "" } = await searchParams;
  const access = await basinPageAccess(basinId, "scenario.read");
  if (!access.ok) return <Denied message={access.message} />;
  const db = getDb();
  const ids = [...new Set(runs.split(",").filter(Boolean))].slice(0, 8);
  const loaded = await Promise.all(ids.map((id) => getRun(access.scope, id).catch(() => null)));
  const done = loaded.filter((r) => r?.status === "done" && r.result?.conditions.length).map((r) => r!);
  const records = await Promise.all(done.map((r) => runScenarioRecord(db, access.basin.id, r)));
  // names beside permit ids; a reader without the facility list still gets the ids
  const names = Object.fromEntries((await listFacilities(access.scope).catch(() => [])).map((f) => [f.permitId, f.name]));
  const label = (r: (typeof done)[number]) =>
    `${r.scenarioName} · ${r.kind} · version ${r.scenarioVersion}, ${formatTime(new Date(r.createdAt), access.basin.timeZone ?? "UTC")}`;
  const compared = done.map((r) => ({ run: r, read: runConditions(r.result!) }));
  return (
    <div className="space-y-4">
      <h2>Compare runs</h2>
      <PlanningCaution />
      {done.length < 2 ? (
        <Notice tone="warning">Pick two or more finished runs on the scenarios page to compare them.</Notice>
      ) : (
        <>
          <section className="card overflow-x-auto">
            <ComparisonTable
              unitSystem={access.basin.unitSystem}
              names={names}
              differences={inputDifferences(
                done.map((r, i) => ({ kind: r.kind, inputs: records[i]?.inputs ?? null, networkId: records[i]?.networkId ?? null, files: r.modelFiles })),
                access.basin.unitSystem,
              )}
              runs={compared.map(({ run, read }) => ({ label: label(run), conditions: read.conditions, allocation: read.allocation }))}
            />
          </section>
          <ProfileOverlayChart
            unitSystem={access.basin.unitSystem}
            runs={compared.map(({ run, read }) => ({
              label: label(run),
              conditions: read.conditions,
              models: run.modelFiles.map((f) => f.file),
              allocation: read.allocation ? { binding: read.allocation.binding } : null,
            }))}
          />
        </>
      )}
      <Link href={`/basins/${access.basin.id}/scenarios`}>Back to scenarios and runs</Link>
    </div>
  );
}
