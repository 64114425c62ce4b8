import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { ScenarioEditor } from "@/components/scenarios/scenario-editor";
import { Denied } from "@/components/ui/denied";
import { basinPageAccess } from "@/lib/auth/page-access";
import { AppError } from "@/lib/errors";
import { getNetwork } from "@/lib/services/networks";
import { listGaugeRecords } from "@/lib/services/gauges";
import { listCalibrationChoices } from "@/lib/services/runs";
import { listTemperatureRecords } from "@/lib/services/temperature-records";
import { getScenario } from "@/lib/services/scenarios";

export const metadata: Metadata = { title: "Scenario" };

export default async function ScenarioPage({ params }: { params: Promise<{ basinId: string; scenarioId: string }> }) {
  const { basinId, scenarioId } = await params;
  const access = await basinPageAccess(basinId, "scenario.read");
  if (!access.ok) return <Denied message={access.message} />;
  const scenario = await getScenario(access.scope, scenarioId).catch((e) => {
    if (e instanceof AppError && e.status === 404) return null;
    throw e;
  });
  if (!scenario) notFound();
  const [network, gauges, calibrations, temperatures] = await Promise.all([
    getNetwork(access.scope, scenario.networkId),
    listGaugeRecords(access.scope),
    listCalibrationChoices(access.scope),
    listTemperatureRecords(access.scope),
  ]);
  return (
    <div>
      <h2 className="mb-4">{scenario.name}</h2>
      <ScenarioEditor
        basinId={access.basin.id}
        scenario={scenario}
        unitSystem={access.basin.unitSystem}
        basinCriterion={access.basin.doCriterionMgL}
        canEdit={access.can("scenario.edit")}
        reaches={network.reaches.map((r) => ({ id: r.id, name: r.name, downstreamId: r.downstreamId, attributes: r.attributes }))}
        outfalls={network.outfalls.map((o) => ({ permitId: o.permitId, facilityName: o.facilityName, reachId: o.reachId, attributes: o.attributes }))}
        calibrations={calibrations}
        temperatureRecords={temperatures.map((t) => ({ id: t.id, name: t.name, summerC: t.summer?.value_c ?? null }))}
        gauges={gauges.map((g) => ({ id: g.id, name: g.name, reachId: g.reachId, designFlows: g.designFlows.map((d) => ({ name: d.name, value: d.value })) }))}
      />
    </div>
  );
}
