import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { RunResults } from "@/components/scenarios/run-results";
import { Denied } from "@/components/ui/denied";
import { getDb } from "@/db/client";
import { basinPageAccess } from "@/lib/auth/page-access";
import { AppError } from "@/lib/errors";
import { getNetwork } from "@/lib/services/networks";
import { getRun, runScenarioRecord } from "@/lib/services/runs";
import { getScenario } from "@/lib/services/scenarios";

export const metadata: Metadata = { title: "Run results" };

export default async function RunPage({ params }: { params: Promise<{ basinId: string; runId: string }> }) {
  const { basinId, runId } = await params;
  const access = await basinPageAccess(basinId, "scenario.read");
  if (!access.ok) return <Denied message={access.message} />;
  const db = getDb();
  const run = await getRun(access.scope, runId).catch((e) => {
    if (e instanceof AppError && e.status === 404) return null;
    throw e;
  });
  if (!run) notFound();
  // The map shows the network this run used (the scenario may since have moved to another version).
  const used = await runScenarioRecord(db, access.basin.id, run);
  const networkId = used?.networkId ?? (await getScenario(access.scope, run.scenarioId)).networkId;
  const network = await getNetwork(access.scope, networkId);
  return (
    <div>
      <h2 className="mb-4">
        {used?.name ?? run.scenarioName} — {run.kind === "allocation" ? "allocation run" : run.kind === "calibration" ? "calibration to a survey" : "model run"}
      </h2>
      <RunResults
        basinId={access.basin.id}
        basinName={access.basin.name}
        initial={run}
        network={network.geojson}
        unitSystem={access.basin.unitSystem}
        canPropose={access.can("plan.propose")}
        runNetwork={{ id: network.id, version: network.version }}
        // surveys need scenario.read, as this page does; passed on so the comparison never asks for them without it
        canReadSurveys={access.can("scenario.read")}
      />
    </div>
  );
}
