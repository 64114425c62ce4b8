import type { FeatureCollection } from "geojson";
import { nameOf, PLAN_STATUS_NAMES, titleWithBasin } from "@/lib/format/labels";
import { exportValue } from "@/lib/format/quantities";
import { formatWhen } from "@/lib/format/zoned-time";
import type { Db } from "@/db/client";
import { insertAuditEvent } from "@/db/queries/audit";
import { findPlanReportFile, planReachLines, storePlanReportFile } from "@/db/queries/plan-reports";
import type { Actor } from "@/lib/auth/guard";
import { csvText } from "@/lib/reports/csv-text";
import type { PlanDownload } from "@/lib/reports/download";
import { renderPlanPdf } from "@/lib/reports/plan-pdf";
import { planReport, readSnapshot } from "@/lib/reports/plan-report-data";
import { PLANNING_CAUTION } from "@/lib/results/caution";
import { allocationCsv } from "@/lib/results/csv-rows";
import { exportLayer, type ExportLayer } from "@/lib/results/results-geojson";
import { conditionRows, conditionsLine, runConditions } from "@/lib/results/run-conditions";
import { kineticsLine } from "@/lib/results/fitted-kinetics";
import { AppError } from "@/lib/errors";
import { reachFeature } from "./networks";
import { getPlan, getPlanForReader, getPublishedPlan } from "./plans";
import { cachedPublishedFile, cachedPublishedPage, publicationKey, publicationTag, publishedStamp } from "./published-cache";

export type PlanExportFormat = "pdf" | "csv" | "geojson";

type PlanDto = Awaited<ReturnType<typeof getPlan>>;

/**
 * The plan (through getPlan, which decides who may read it: published plans anyone,
 * plans in or after review anyone signed in, drafts planners and leads) and its basin.
 */
async function readPlan(db: Db, actor: Actor | null, basinId: string, planId: string) {
  const { plan, basin } = await getPlanForReader(db, actor, basinId, planId);
  const stem = `${basin.slug}-plan-v${plan.version}${plan.status === "published" ? "" : "-draft"}`;
  return { plan, basin, stem };
}

/** A published plan is public; any other export is recorded (who took which copy of an unpublished plan). */
async function recordExport(db: Db, actor: Actor | null, basinId: string, plan: PlanDto, format: PlanExportFormat) {
  if (plan.status === "published") return;
  await insertAuditEvent(db, {
    basinId,
    actorId: actor?.id ?? null,
    action: "plan.exported",
    targetType: "plan",
    targetId: plan.id,
    details: { format, version: plan.version, status: plan.status },
  });
}

/** The reach lines of the network version the plan was computed on, as map features. */
async function planNetwork(db: Db, planId: string): Promise<FeatureCollection> {
  return { type: "FeatureCollection", features: (await planReachLines(db, planId)).map(reachFeature) };
}

const about = (basin: { name: string; timeZone: string | null }, plan: PlanDto) => [
  `${titleWithBasin(basin.name, plan.title)}, version ${plan.version}`,
  plan.status === "published" && plan.publishedAt
    ? `Published ${formatWhen(new Date(plan.publishedAt), basin.timeZone ?? plan.review?.timeZone ?? "UTC")}`
    : `DRAFT — not published (${nameOf(PLAN_STATUS_NAMES, plan.status).toLowerCase()})`,
];

type Made = { download: PlanDownload; published: boolean };

/**
 * A download: a published plan's from this process's cache (lib/services/published-cache.ts),
 * checked first by one read of the plan's state and basin so that a change made in any
 * process is seen at once, with an ETag; any other plan's through `make` as before
 * (its own read rules, audited, private).
 */
async function download(db: Db, basinId: string, planId: string, what: string, make: () => Promise<Made>): Promise<PlanDownload> {
  const stamp = await publishedStamp(db, basinId, planId);
  if (stamp) return cachedPublishedFile(publicationKey(stamp, what), make);
  return (await make()).download;
}

/** The plan report as PDF (see lib/reports/plan-pdf.tsx). */
export async function planReportPdf(db: Db, actor: Actor | null, basinId: string, planId: string, now = new Date()): Promise<PlanDownload> {
  return download(db, basinId, planId, "pdf", () => makePdf(db, actor, basinId, planId, now));
}

async function makePdf(db: Db, actor: Actor | null, basinId: string, planId: string, now: Date): Promise<Made> {
  const { plan, basin, stem } = await readPlan(db, actor, basinId, planId);
  const render = async () => {
    const network = await planNetwork(db, plan.id);
    const report = planReport(plan, { name: basin.name, unitSystem: basin.unitSystem, timeZone: basin.timeZone }, network.features.length ? network : null, now);
    return new Uint8Array(await renderPlanPdf(report));
  };
  if (plan.status !== "published") {
    const bytes = await render();
    await recordExport(db, actor, basin.id, plan, "pdf");
    return { download: { body: bytes, contentType: "application/pdf", fileName: `${stem}.pdf` }, published: false };
  }
  return { download: { body: await publishedPdf(db, plan.id, render), contentType: "application/pdf", fileName: `${stem}.pdf` }, published: true };
}

/** Renders in flight in this process, so requests arriving together for a new published plan render it once. */
const rendering = new Map<string, Promise<Uint8Array>>();

/** A published plan's PDF: stored after its first rendering and served from the database from then on. */
async function publishedPdf(db: Db, planId: string, render: () => Promise<Uint8Array>): Promise<Uint8Array> {
  const stored = await findPlanReportFile(db, planId);
  if (stored) return new Uint8Array(stored);
  let pending = rendering.get(planId);
  if (!pending) {
    pending = render()
      // the stored file, which is this rendering unless another request stored one first
      .then(async (bytes) => new Uint8Array(await storePlanReportFile(db, planId, bytes)))
      .finally(() => rendering.delete(planId));
    rendering.set(planId, pending);
  }
  return pending;
}

/** The allocation table as CSV, loads in the basin's unit, the caution and what the file is in its Notes column (docs/exports.md). */
export async function planAllocationsCsv(db: Db, actor: Actor | null, basinId: string, planId: string): Promise<PlanDownload> {
  return download(db, basinId, planId, "csv", () => makeCsv(db, actor, basinId, planId));
}

async function makeCsv(db: Db, actor: Actor | null, basinId: string, planId: string): Promise<Made> {
  const { plan, basin, stem } = await readPlan(db, actor, basinId, planId);
  const s = readSnapshot(plan.snapshot);
  const names = Object.fromEntries(plan.allocations.map((a) => [a.permitId, a.facilityName]));
  const text = csvText(
    allocationCsv(s.allocation, s.run.modelFiles[0].file, basin.unitSystem, [...about(basin, plan), conditionsLine({ conditions: s.run.result.conditions, allocation: s.allocation }), kineticsLine(s.scenario.inputs.fittedKinetics?.source)], names),
  );
  await recordExport(db, actor, basin.id, plan, "csv");
  return { download: { body: text, contentType: "text/csv; charset=utf-8", fileName: `${stem}-allocations.csv` }, published: plan.status === "published" };
}

/**
 * One layer of the plan's results as GeoJSON (docs/exports.md): `reaches` (default) — one
 * line per reach with its lowest DO and where; `pieces` — the reach lines cut at the
 * profile points with DO at each end; `dischargers` — one point per outfall with facility
 * name, permit id and allocation. Each file holds one kind of feature, the caution, the
 * layer's name and units as foreign members, and a `plan` member (title, version, state,
 * the condition shown and every condition's lowest DO). The DO is the governing
 * condition's unless `conditionName` names another (a 422 naming `condition` when it names none).
 */
export async function planReachesGeoJson(
  db: Db,
  actor: Actor | null,
  basinId: string,
  planId: string,
  conditionName?: string,
  layer: ExportLayer = "reaches",
): Promise<PlanDownload> {
  return download(db, basinId, planId, JSON.stringify(["geojson", layer, conditionName ?? null]), () => makeGeoJson(db, actor, basinId, planId, conditionName, layer));
}

async function makeGeoJson(db: Db, actor: Actor | null, basinId: string, planId: string, conditionName: string | undefined, layer: ExportLayer): Promise<Made> {
  const { plan, basin, stem } = await readPlan(db, actor, basinId, planId);
  const s = readSnapshot(plan.snapshot);
  const network = await planNetwork(db, plan.id);
  const read = runConditions({ conditions: s.run.result.conditions, allocation: s.allocation });
  const index = conditionName === undefined ? read.governing : s.run.result.conditions.findIndex((c) => c.name === conditionName);
  if (index < 0) {
    const message = `The plan has no condition "${conditionName}"; it has ${s.run.result.conditions.map((c) => `"${c.name}"`).join(", ")}`;
    throw new AppError("invalid", message, [{ path: "condition", message }]);
  }
  const shown = s.run.result.conditions[index];
  const model = s.run.modelFiles[Math.min(index, s.run.modelFiles.length - 1)].file;
  const reachNames = Object.fromEntries(network.features.map((f) => [String(f.properties?.id), (f.properties?.name as string | null) ?? null]));
  const collection = exportLayer(
    layer,
    { run: shown.run, model, network, condition: shown.name, system: basin.unitSystem, reachNames, caution: [...PLANNING_CAUTION, ...about(basin, plan)] },
    plan.allocations,
  );
  const json = {
    type: collection.type,
    layer: collection.layer,
    caution: collection.caution,
    units: collection.units,
    plan: {
      title: plan.title,
      basin: basin.name,
      version: plan.version,
      status: plan.status,
      publishedAt: plan.publishedAt,
      condition: shown.name,
      governing: index === read.governing,
      kinetics: kineticsLine(s.scenario.inputs.fittedKinetics?.source),
      conditions: conditionRows({ conditions: s.run.result.conditions, allocation: read.allocation }).map((r) => ({
        name: r.name,
        governing: r.governing,
        min_do_mg_l: exportValue("do", r.minimum.do_mg_l),
        min_do_reach: r.minimum.reach,
        min_do_km: exportValue("length", r.minimum.km),
        meets_criterion: r.meets,
      })),
    },
    features: collection.features,
  };
  await recordExport(db, actor, basin.id, plan, "geojson");
  const conditionPart = index === read.governing ? "" : `-${shown.name.replace(/[^\w-]+/g, "-").toLowerCase()}`;
  return {
    download: { body: JSON.stringify(json), contentType: "application/geo+json", fileName: `${stem}-${layer}${conditionPart}.geojson` },
    published: plan.status === "published",
  };
}

/**
 * The public page's plan (null unless published) with the reach lines its DO map is drawn
 * on. The same for every reader, so kept in this process's cache under the plan's stamp
 * (its state, its basin's name, units and zone, and any later published version), which is
 * read on every request: a change made in any process is seen at once. The value is
 * shared between requests; callers must not change it. `publication` is the stamp's tag
 * (publicationTag), which the page writes into its HTML.
 */
export async function getPublishedPlanWithMap(db: Db, basinId: string, planId: string) {
  const stamp = await publishedStamp(db, basinId, planId);
  if (!stamp) return null;
  return cachedPublishedPage(publicationKey(stamp, "page"), async () => {
    // a published plan reads the same to everyone: no caller is needed (nor kept with the value)
    const found = await getPublishedPlan(db, null, basinId, planId);
    if (!found) return null;
    // the page carries the stamp it was drawn from (the key's), for the page cache's check
    return { ...found, network: await planNetwork(db, found.plan.id), publication: publicationTag(stamp) };
  });
}
