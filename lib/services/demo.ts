import { readFileSync } from "node:fs";
import { join } from "node:path";
import type { Db } from "@/db/client";
import { findBasinBySlug } from "@/db/queries/basins";
import { latestNetworkId } from "@/db/queries/networks";
import { DEMO_DISCHARGER_MAPPING, DEMO_GIS_FILES, DEMO_REACH_MAPPING } from "@/db/seed/demo-gis";
import { DEMO_BASINS, DEMO_USERS } from "@/db/seed/demo-data";
import { loadActor } from "@/lib/auth/guard";
import { basinScope } from "@/lib/auth/scope";
import { findUserByEmail } from "@/db/queries/users";
import { scenarioCreateSchema } from "@/lib/validation/scenario";
import { uploadImport } from "./imports";
import { commitNetwork } from "./networks";
import { gaugeUploadSchema } from "@/lib/validation/gauges";
import { surveyUploadSchema } from "@/lib/validation/surveys";
import { uploadGaugeRecord } from "./gauges";
import { uploadSurvey } from "./surveys";
import { createScenario } from "./scenarios";

/**
 * A demo scenario where the river does not meet the criterion at today's
 * loads: East Penhallow grown to 0.6 m³/s, Dunmere's effluent at 120 mg/L
 * BOD5, a hot summer (27.5 °C) and three quarters of the design low flow. An
 * allocation run on it asks for real reductions. (Invented, for the demo only.)
 */
export const DEMO_STRESS_SCENARIO = {
  name: "Growth to 2035, hot and dry summer",
  description: "",
  inputs: {
    conditions: [{ name: "Hot, dry 7Q10", flowScale: 0.75, temperatureC: 27.5 }],
    dischargers: {
      "DP-1003": { designFlowM3s: 0.6, bod5MgL: 45 },
      "DP-1004": { designFlowM3s: 0.2, bod5MgL: 120 },
    },
  },
};

/** The demo's invented gauge record and how it is uploaded (invented, for the demo only). */
export const DEMO_GAUGE = {
  file: "examples/tamsel-quillford-gauge-daily.csv",
  fields: { name: "Tamsel River at Quillford", stationCode: "TQ-0410", reachId: "TR-04", unit: "m3/s", climaticYearStart: "04-01" },
};

/** The demo's invented synoptic survey of the main stem (examples/README.md; invented, for the demo only). */
export const DEMO_SURVEY = {
  file: "examples/tamsel-survey-2026-08.csv",
  fields: { name: "August 2026 main-stem survey" },
};

/**
 * Load the demo basin's network from the demo GIS files through the same
 * upload → validate → commit path a planner uses, with one ready scenario
 * (DEMO_STRESS_SCENARIO), the invented gauge's daily record (DEMO_GAUGE) and the invented
 * survey (DEMO_SURVEY). Skipped when the basin already has a network.
 * Returns the new version number, or null.
 */
export async function loadDemoNetwork(db: Db, root: string): Promise<number | null> {
  const basin = await findBasinBySlug(db, DEMO_BASINS[0].slug);
  if (!basin || (await latestNetworkId(db, basin.id))) return null;
  const plannerRow = await findUserByEmail(db, DEMO_USERS.find((u) => u.key === "planner")!.email);
  const planner = await loadActor(db, plannerRow?.id);
  const scope = await basinScope(db, planner, basin.id);
  const read = (p: string) => ({ name: p.split("/").at(-1)!, bytes: readFileSync(join(root, p)) });
  const reaches = await uploadImport(scope, read(DEMO_GIS_FILES.reaches), { layer: "reaches" });
  const dischargers = await uploadImport(scope, read(DEMO_GIS_FILES.dischargers), { layer: "dischargers" });
  const network = await commitNetwork(scope, {
    draft: {
      reachImportId: reaches.id,
      reachMapping: DEMO_REACH_MAPPING,
      dischargerImportId: dischargers.id,
      dischargerMapping: DEMO_DISCHARGER_MAPPING,
      options: { toleranceM: 5, maxSnapDistanceM: 500, maxReachLengthKm: 10, allowMultipleOutlets: false },
    },
    note: "Demo network loaded from the Tamsel River shapefile and discharger CSV",
    acceptReport: true,
  });
  await createScenario(scope, scenarioCreateSchema.parse(DEMO_STRESS_SCENARIO));
  // the invented gauge at Quillford (examples/, made by scripts/make-demo-gauge.ts), with its low flows
  await uploadGaugeRecord(scope, read(DEMO_GAUGE.file), gaugeUploadSchema.parse(DEMO_GAUGE.fields));
  await uploadSurvey(scope, read(DEMO_SURVEY.file), surveyUploadSchema.parse(DEMO_SURVEY.fields));
  return network.version;
}
