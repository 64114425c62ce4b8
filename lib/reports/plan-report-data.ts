import type { FeatureCollection } from "geojson";
import { HYDRAULICS_RULE_NAMES, type HydraulicsRule, type UnitSystem } from "@/lib/domain";
import { formatIn, formatNumber, formatPercent, unitLabel } from "@/lib/format/quantities";
import type { AllocationResult } from "@/lib/model/allocation/types";
import type { RunResult } from "@/lib/model/network/run";
import type { ModelFile } from "@/lib/model/types";
import { PLANNING_CAUTION } from "@/lib/results/caution";
import { fittedKineticsText } from "@/lib/results/fitted-kinetics";
import { conditionFlowText } from "@/lib/results/condition-flow";
import { formatDo } from "@/lib/results/do-scale";
import { conditionRows, quoted, runConditions } from "@/lib/results/run-conditions";
import { headwaterReaches, pathToOutlet } from "@/lib/results/path";
import { DEFAULT_HEADWATER_DO_TEXT } from "@/lib/scenarios/design-defaults";
import { profileSeries } from "@/lib/results/profile-series";
import { resultsGeoJson } from "@/lib/results/results-geojson";
import { acknowledgementNote, acknowledgementSummary, type PublicationAcknowledgementLike, type ThreadForSummary } from "@/lib/results/responsiveness";
import { formatDay, formatTime } from "@/lib/format/zoned-time";
import type { ScenarioInputs } from "@/lib/validation/scenario";
import { mapFigure, profileFigure, type MapFigure, type ProfileFigure } from "./figures";
import { nameOf, OBJECTIVE_NAMES, PLAN_STATUS_NAMES, REAERATION_NAMES, THETA_RULE_NAMES } from "@/lib/format/labels";

/** What a plan's snapshot holds (lib/services/plans.ts proposePlan): the run as proposed and the scenario inputs. */
export interface PlanSnapshot {
  run: {
    id: string;
    modelVersion: string;
    inputsHash: string;
    methods: Record<string, unknown>;
    finishedAt: string | null;
    result: { warnings: string[]; conditions: { name: string; run: RunResult }[]; allocation?: AllocationResult };
    modelFiles: { name: string; file: ModelFile }[];
  };
  scenario: { id: string; name: string; version: number; networkId?: string; inputs: ScenarioInputs };
}

/** The plan as the plans service returns it (only what a report reads). */
export interface ReportPlanInput {
  title: string;
  version: number;
  status: string;
  createdAt: string;
  createdBy: string | null;
  publishedAt: string | null;
  snapshot: Record<string, unknown>;
  allocations: Array<{
    facilityName: string;
    permitId: string;
    cboduKgDay: number;
    bod5KgDay: number;
    bod5MgL: number;
    todayCboduKgDay: number;
    reductionPct: number | null;
  }>;
  review: { startsAt: string; endsAt: string; timeZone: string; closedAt: string | null } | null;
  threads: Array<ThreadForSummary & { respondedAt: string | null }>;
  /** Threads the lead published without a response, and the statement (null when none was). */
  publicationAcknowledgement?: PublicationAcknowledgementLike | null;
}

export interface ReportBasinInput {
  name: string;
  unitSystem: UnitSystem;
  /** The zone the report's dates and times are given in (else the review's, else UTC). */
  timeZone?: string | null;
}

export interface ReportTable {
  columns: string[];
  /** Which columns hold numbers (right-aligned). */
  numeric: boolean[];
  rows: string[][];
}

export interface ReportThread {
  topic: string;
  status: string;
  comments: Array<{ author: string; role: string; at: string; body: string }>;
  response: string | null;
  responder: string | null;
  respondedAt: string | null;
  /** The lead's acknowledgement when the thread went out without a (later) response. */
  acknowledged: string | null;
}

/** Everything the PDF prints, already formatted in the basin's units. */
export interface PlanReport {
  title: string;
  basinName: string;
  version: number;
  published: boolean;
  /** "Published 2026-12-02" or "DRAFT — not published (status: review)". */
  statusLine: string;
  generatedAt: string;
  caution: readonly string[];
  summary: Array<{ label: string; value: string }>;
  /** A row per design condition: lowest DO with the allocated loads, where, and whether the criterion is met; the governing one marked. */
  conditions: ReportTable;
  allocations: ReportTable;
  tmdl: ReportTable | null;
  tmdlNote: string | null;
  methods: Array<{ heading: string; items: Array<{ label: string; value: string }> }>;
  warnings: string[];
  responsiveness: ReportThread[];
  /** How many threads were published unanswered, and the lead's statement (null when none). */
  acknowledgement: string | null;
  reviewLine: string | null;
  profile: (ProfileFigure & { caption: string }) | null;
  map: (MapFigure & { caption: string }) | null;
}

/** "2 Dec 2026, 08:05 CST" in the report's zone. */
const minuteIn = (zone: string) => (iso: string) => formatTime(new Date(iso), zone);
const pct = (fraction: number) => `${formatPercent(fraction * 100)} %`;
const num = (x: number | null | undefined, digits: number) => (x === null || x === undefined || !Number.isFinite(x) ? "—" : x.toFixed(digits));

/**
 * The headwater whose water travels farthest to the outlet (the "most upstream" one);
 * ties go to the first in file order. Null when the model has no reaches.
 */
export function farthestHeadwater(model: ModelFile): string | null {
  const lengths = new Map(model.reaches.map((r) => [r.id, r.length_km]));
  let best: { id: string; km: number } | null = null;
  for (const id of headwaterReaches(model)) {
    const km = pathToOutlet(model, id).reduce((s, r) => s + (lengths.get(r) ?? 0), 0);
    if (!best || km > best.km + 1e-9) best = { id, km };
  }
  return best?.id ?? null;
}

/** Parse the plan's snapshot into the typed shape; throws when it lacks the run or its allocation. */
export function readSnapshot(snapshot: Record<string, unknown>): PlanSnapshot & { allocation: AllocationResult; run: PlanSnapshot["run"] } {
  const s = snapshot as unknown as PlanSnapshot;
  const allocation = s?.run?.result?.allocation;
  if (!allocation || !s.run.modelFiles?.length || !s.run.result.conditions?.length) {
    throw new Error("The plan's snapshot has no allocation run result");
  }
  return { ...s, allocation };
}

function allocationTable(plan: ReportPlanInput, model: ModelFile, system: UnitSystem): ReportTable {
  const u = unitLabel("load", system);
  const flows = new Map(model.dischargers.map((d) => [d.id, d.flow_m3_s]));
  const rows = [...plan.allocations]
    .sort((a, b) => a.facilityName.localeCompare(b.facilityName))
    .map((a) => [
      a.facilityName,
      a.permitId,
      formatIn("flow", flows.get(a.permitId), system),
      formatIn("load", a.cboduKgDay, system),
      formatIn("load", a.bod5KgDay, system),
      num(a.bod5MgL, 1),
      formatIn("load", a.todayCboduKgDay, system),
      formatPercent(a.reductionPct),
    ]);
  return {
    columns: ["Facility", "Permit", `Design flow (${unitLabel("flow", system)})`, `Allocated CBODu (${u})`, `Allocated BOD5 (${u})`, "Effluent BOD5 (mg/L)", `Today's CBODu (${u})`, "Reduction (%)"],
    numeric: [false, false, true, true, true, true, true, true],
    rows,
  };
}

function conditionsTable(rows: ReturnType<typeof conditionRows>, system: UnitSystem): ReportTable {
  return {
    columns: ["Condition", "Lowest DO (mg/L)", "Where", "Criterion (mg/L)", "Criterion met"],
    numeric: [false, true, false, true, false],
    rows: rows.map((r) => [
      `${r.name}${r.governing && rows.length > 1 ? " (governing)" : ""}`,
      formatDo(r.minimum.do_mg_l),
      `${r.minimum.reach}, ${formatIn("length", r.minimum.km, system)} ${unitLabel("length", system)} from its head`,
      r.criterion_do_mg_l.toFixed(1),
      r.meets ? "yes" : "no",
    ]),
  };
}

function tmdlTable(allocation: AllocationResult, system: UnitSystem): ReportTable | null {
  const t = allocation.tmdl;
  if (!t) return null;
  const l = (kg: number) => formatIn("load", kg, system);
  return {
    columns: ["Part", "What it covers", `CBODu (${unitLabel("load", system)})`],
    numeric: [false, false, true],
    rows: [
      ["ΣWLA", "point sources (waste-load allocations)", l(t.wla_kg_day)],
      ["ΣLA", "headwaters, tributaries and other nonpoint or background loads", l(t.la_kg_day)],
      ["MOS", "margin of safety held as load", l(t.mos_kg_day)],
      ["Reserve", "capacity kept for growth", l(t.rc_kg_day)],
      ["TMDL", "loading capacity at the design condition", l(t.tmdl_kg_day)],
    ],
  };
}

/** "Manning's equation at normal depth (3 reaches); velocity and depth as given (5 reaches)": how each reach's U and H were found. */
function hydraulicsText(run: RunResult): string {
  const count = new Map<HydraulicsRule, number>();
  for (const r of run.reaches) for (const h of new Set(r.segments.map((g) => g.hydraulics ?? "given"))) count.set(h, (count.get(h) ?? 0) + 1);
  return [...count.entries()].map(([h, n]) => `${HYDRAULICS_RULE_NAMES[h]} (${n} reach${n === 1 ? "" : "es"})`).join("; ") || "—";
}

function methods(s: PlanSnapshot, run: RunResult, allocation: AllocationResult, system: UnitSystem, governing: string, zone: string): PlanReport["methods"] {
  const utcMinute = minuteIn(zone);
  const i = s.scenario.inputs;
  const k = i.kinetics;
  const t = (c: number | null | undefined) => (c === null || c === undefined ? "each reach's own" : `${formatIn("temperature", c, system)} ${unitLabel("temperature", system)}`);
  const used = new Map<string, number>();
  for (const list of Object.values((s.run.methods.reaeration ?? {}) as Record<string, string[]>)) for (const m of list) used.set(m, (used.get(m) ?? 0) + 1);
  const usedText = [...used.entries()]
    .sort((a, b) => b[1] - a[1])
    .map(([m, n]) => `${nameOf(REAERATION_NAMES, m)} (${n} reach${n === 1 ? "" : "es"})`)
    .join("; ");
  return [
    {
      heading: "Model and scenario",
      items: [
        { label: "Model version", value: s.run.modelVersion },
        { label: "Scenario", value: `${s.scenario.name}, version ${s.scenario.version}` },
        { label: "Run", value: `${s.run.id}${s.run.finishedAt ? `, finished ${utcMinute(s.run.finishedAt)}` : ""}` },
        { label: "Inputs hash (SHA-256)", value: s.run.inputsHash.replace(/(.{16})(?=.)/g, "$1 ") },
        { label: "DO criterion", value: `${run.criterion_do_mg_l.toFixed(2)} mg/L` },
        { label: "Profile spacing", value: `${formatIn("length", i.stepKm, system)} ${unitLabel("length", system)}` },
        { label: "DO saturation", value: String(s.run.methods.saturation ?? "—") },
      ],
    },
    {
      heading: "Critical conditions",
      items: i.conditions.map((c) => ({
        label: c.name,
        value: `${conditionFlowText(c, system)}${Object.keys(c.reachFlowsM3s ?? {}).length ? `, ${Object.keys(c.reachFlowsM3s).length} reach flow(s) set by hand` : ""}; temperature ${t(c.temperatureC)}${
          c.temperatureFrom?.source ? ` (${c.temperatureFrom.source.rule}, record ${c.temperatureFrom.source.recordName}, SHA-256 ${c.temperatureFrom.source.sha256.slice(0, 16)}…)` : ""
        }`,
      })),
    },
    {
      heading: "Kinetics (rates at 20 °C)",
      items: [
        { label: "Deoxygenation k_d", value: `${formatNumber("rate", k.kd20PerDay)} 1/d` },
        { label: "Reaeration method", value: `${nameOf(REAERATION_NAMES, k.kaMethod)}${k.kaFloor ? ", with a minimum rate" : ""}` },
        { label: "Reaeration formulas used", value: usedText || "—" },
        { label: "Velocity and depth", value: hydraulicsText(run) },
        { label: "Settling k_s", value: `${formatNumber("rate", k.ks20PerDay)} 1/d` },
        { label: "Sediment oxygen demand", value: `${num(k.sod20GPerM2Day, 2)} g/m²/d` },
        { label: "Nitrogenous k_n", value: `${formatNumber("rate", k.kn20PerDay)} 1/d` },
        { label: "Temperature correction", value: nameOf(THETA_RULE_NAMES, k.thetaRule) },
        { label: "Reaches with their own kinetics", value: String(Object.keys(i.reachOverrides ?? {}).length) },
        {
          label: "Fitted to a survey",
          value: i.fittedKinetics?.source ? fittedKineticsText(i.fittedKinetics.source) : "No: the coefficients are as entered, not calibrated in Sagline",
        },
      ],
    },
    {
      heading: "Headwater and tributary water",
      items: [
        { label: "CBODu / NBODu", value: `${num(i.headwater.cbodUMgL, 2)} / ${num(i.headwater.nbodUMgL, 2)} mg/L` },
        { label: "DO", value: i.headwater.doMgL === null || i.headwater.doMgL === undefined ? DEFAULT_HEADWATER_DO_TEXT : `${num(i.headwater.doMgL, 2)} mg/L` },
        { label: "Temperature", value: t(i.headwater.temperatureC) },
        { label: "Inflows with their own quality", value: String(Object.keys(i.inflowOverrides ?? {}).length) },
      ],
    },
    {
      heading: "Allocation",
      items: [
        { label: "Objective", value: nameOf(OBJECTIVE_NAMES, allocation.objective) },
        { label: "Technology floor", value: i.allocation.floorBod5MgL === null ? "none" : `effluent BOD5 ${num(i.allocation.floorBod5MgL, 1)} mg/L at design flow` },
        { label: "Margin of safety", value: `${num(i.allocation.mosDoMgL, 2)} mg/L DO and ${pct(i.allocation.mosFraction)} of the loading capacity` },
        { label: "Reserve capacity", value: pct(i.allocation.reserveFraction) },
        { label: "Conditions checked", value: `${i.conditions.map((c) => c.name).join(", ")}${i.conditions.length > 1 ? `; the governing one is ${quoted(governing)}` : ""}` },
        { label: "Checkpoints", value: `${allocation.checkpoints} (${allocation.iterations} round${allocation.iterations === 1 ? "" : "s"})` },
      ],
    },
  ];
}

/**
 * Everything the plan report prints, from the plan (as the plans service returns it),
 * its basin, and the network's reach lines (map features with properties.kind "reach";
 * null leaves the map out). Pure: the same input gives the same report, except
 * `generatedAt`, which is `now`.
 */
export function planReport(plan: ReportPlanInput, basin: ReportBasinInput, network: FeatureCollection | null, now = new Date()): PlanReport {
  const s = readSnapshot(plan.snapshot);
  const system = basin.unitSystem;
  const zone = basin.timeZone ?? plan.review?.timeZone ?? "UTC";
  const utcMinute = minuteIn(zone);
  const ack = plan.publicationAcknowledgement ?? null;
  const acknowledged = new Set(ack?.threads.map((t) => t.id) ?? []);
  // the governing condition stands for the plan; every condition has its row in `conditions`
  const read = runConditions({ conditions: s.run.result.conditions, allocation: s.allocation });
  const governing = s.run.result.conditions[read.governing];
  const model = s.run.modelFiles[Math.min(read.governing, s.run.modelFiles.length - 1)].file;
  const run = governing.run;
  const allocation = read.allocation ?? s.allocation;
  const several = s.run.result.conditions.length > 1;
  const published = plan.status === "published";
  const head = farthestHeadwater(model);
  const series = head ? profileSeries(run, model, head, system) : null;
  const results = network ? resultsGeoJson({ run, model, network }) : null;
  const map = results ? mapFigure(results, run.criterion_do_mg_l, { width: 250, height: 200 }) : null;
  const totalWla = plan.allocations.reduce((sum, a) => sum + a.cboduKgDay, 0);
  return {
    title: plan.title,
    basinName: basin.name,
    version: plan.version,
    published,
    statusLine: published && plan.publishedAt ? `Published ${formatDay(new Date(plan.publishedAt), zone)}` : `DRAFT — not published (${nameOf(PLAN_STATUS_NAMES, plan.status).toLowerCase()})`,
    generatedAt: utcMinute(now.toISOString()),
    caution: PLANNING_CAUTION,
    summary: [
      { label: "DO criterion", value: `${run.criterion_do_mg_l.toFixed(1)} mg/L` },
      {
        label: several ? "Lowest DO (governing condition)" : "Lowest DO",
        value: `${run.minimum.do_mg_l < 0 ? "anoxic" : `${formatDo(run.minimum.do_mg_l)} mg/L`} in ${run.minimum.reach} under ${quoted(governing.name)}`,
      },
      { label: "Facilities", value: String(plan.allocations.length) },
      { label: `Total allocated CBODu`, value: `${formatIn("load", totalWla, system)} ${unitLabel("load", system)}` },
    ],
    conditions: conditionsTable(conditionRows({ conditions: s.run.result.conditions, allocation }), system),
    allocations: allocationTable(plan, model, system),
    tmdl: tmdlTable(allocation, system),
    tmdlNote:
      allocation.tmdl && allocation.tmdl.mos_do_mg_l > 0
        ? `A further margin of safety of ${allocation.tmdl.mos_do_mg_l.toFixed(2)} mg/L DO was added to the criterion; it is implicit in the loads above.`
        : null,
    methods: methods(s, run, allocation, system, governing.name, zone),
    warnings: s.run.result.warnings ?? [],
    responsiveness: [...plan.threads]
      .sort((a, b) => (a.facilityName === null ? -1 : b.facilityName === null ? 1 : a.facilityName.localeCompare(b.facilityName)))
      .filter((t) => t.comments.length > 0 || t.response)
      .map((t) => ({
        topic: t.facilityName ? `${t.facilityName}${t.permitId ? ` (${t.permitId})` : ""}` : "The plan as a whole",
        status: t.status,
        comments: [...t.comments].sort((a, b) => a.at.localeCompare(b.at)).map((c) => ({ author: c.author, role: c.role, at: utcMinute(c.at), body: c.body })),
        response: t.response,
        responder: t.responder,
        respondedAt: t.respondedAt ? utcMinute(t.respondedAt) : null,
        acknowledged: ack && t.id && acknowledged.has(t.id) ? acknowledgementNote(ack, zone) : null,
      })),
    acknowledgement: ack ? acknowledgementSummary(ack, zone) : null,
    reviewLine: plan.review
      ? `Review period ${utcMinute(plan.review.startsAt)} to ${utcMinute(plan.review.closedAt ?? plan.review.endsAt)}. Dates and times in this report are in ${zone}.`
      : `Dates and times in this report are in ${zone}.`,
    profile: series
      ? {
          ...profileFigure(series, { width: 515, height: 210 }),
          caption: `Dissolved oxygen with the allocated loads under ${quoted(governing.name)}${several ? " (the governing condition)" : ""} from the head of ${head} to the outlet: ${series.path.join(" › ")}. Dashed: the ${run.criterion_do_mg_l.toFixed(1)} mg/L criterion; dotted: saturation.`,
        }
      : null,
    map: map ? { ...map, caption: `Reaches coloured by their dissolved oxygen with the allocated loads under ${quoted(governing.name)}.` } : null,
  };
}
