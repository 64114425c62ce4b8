import type { RunKind, UnitSystem } from "@/lib/domain";
import { conditionFlowText } from "./condition-flow";
import { nameOf, OBJECTIVE_NAMES, REAERATION_NAMES } from "@/lib/format/labels";
import { formatIn, formatPercent, unitLabel } from "@/lib/format/quantities";
import type { ModelFile } from "@/lib/model/types";
import { DEFAULT_HEADWATER_DO_TEXT } from "@/lib/scenarios/design-defaults";
import type { ScenarioInputs } from "@/lib/validation/scenario";

/** What a compared run was computed from: the scenario as run (when known) and its model files. */
export interface RunInputsForDiff {
  kind: RunKind;
  /** The scenario inputs the run used; null for a run stored before runs kept them. */
  inputs: ScenarioInputs | null;
  networkId?: string | null;
  files: { name: string; file: ModelFile }[];
}

/** One input that differs between the runs: its plain label and its value in each run ("—" where a run has no such input). */
export interface InputDifference {
  key: string;
  label: string;
  values: string[];
}

type Facts = Map<string, { label: string; value: string }>;

const REACH_FIELDS: Record<string, string> = {
  kd20PerDay: "k_d at 20 °C (1/d)",
  kaMethod: "reaeration method",
  ka20PerDay: "k_a at 20 °C (1/d)",
  ks20PerDay: "k_s at 20 °C (1/d)",
  sod20GPerM2Day: "SOD at 20 °C (g/m²/d)",
  kn20PerDay: "k_n at 20 °C (1/d)",
};
const WATER_FIELDS: Record<string, string> = { cbodUMgL: "CBODu (mg/L)", nbodUMgL: "NBODu (mg/L)", doMgL: "DO (mg/L)" };

function facts(run: RunInputsForDiff, system: UnitSystem): Facts {
  const out: Facts = new Map();
  const put = (key: string, label: string, value: string) => out.set(key, { label, value });
  const n = (x: number | null | undefined, digits = 3) => (x === null || x === undefined ? "—" : String(Number(x.toFixed(digits))));
  const temp = (c: number | null | undefined, none: string) => (c === null || c === undefined ? none : `${formatIn("temperature", c, system)} ${unitLabel("temperature", system)}`);
  const flow = (q: number | null | undefined) => (q === null || q === undefined ? "network's value" : `${formatIn("flow", q, system)} ${unitLabel("flow", system)}`);
  const own = (x: number | string | null | undefined, show: (v: number | string) => string) => (x === null || x === undefined ? "network's value" : show(x));
  const main = run.files[0]?.file;
  if (main) {
    put("criterion", "DO criterion", `${n(main.criterion_do_mg_l, 2)} mg/L`);
    put("step", "Profile spacing", `${formatIn("length", main.step_km ?? 0.5, system)} ${unitLabel("length", system)}`);
  }
  if (run.networkId) put("network", "Network version", run.networkId.slice(0, 8));
  const i = run.inputs;
  if (!i) {
    // without the scenario record, what the model file itself says
    if (main) {
      put("conditions", "Design conditions", [run.files[0].name, ...(main.allocation?.conditions ?? []).map((c) => c.name)].join(", "));
      for (const d of main.dischargers) {
        put(`d:${d.id}:flow`, `Discharger ${d.id}: design flow`, flow(d.flow_m3_s));
        put(`d:${d.id}:effluent`, `Discharger ${d.id}: effluent`, d.cbodu_mg_l !== undefined ? `CBODu ${n(d.cbodu_mg_l, 2)} mg/L` : `BOD5 ${n(d.bod5_mg_l, 2)} mg/L`);
      }
      const a = main.allocation;
      if (a && run.kind === "allocation") {
        put("a:objective", "Objective", nameOf(OBJECTIVE_NAMES, a.objective));
        put("a:floor", "Technology floor", a.floor_bod5_mg_l === undefined ? "none" : `effluent BOD5 ${n(a.floor_bod5_mg_l, 1)} mg/L`);
        put("a:mosDo", "Margin of safety (DO)", `${n(a.mos_do_mg_l ?? 0, 2)} mg/L`);
        put("a:mosFraction", "Margin of safety (share of load)", `${formatPercent(100 * (a.mos_fraction ?? 0))} %`);
        put("a:reserve", "Reserve capacity", `${formatPercent(100 * (a.reserve_fraction ?? 0))} %`);
      }
    }
    return out;
  }
  put("conditions", "Design conditions", i.conditions.map((c) => c.name).join(", "));
  for (const c of i.conditions) {
    put(`c:${c.name}:scale`, `“${c.name}”: flow scale`, c.gaugeFlow || c.outletFlowM3s != null ? conditionFlowText(c, system) : `× ${n(c.flowScale)}`);
    put(`c:${c.name}:temp`, `“${c.name}”: temperature`, temp(c.temperatureC, "each reach's own"));
    for (const [reach, q] of Object.entries(c.reachFlowsM3s ?? {})) put(`c:${c.name}:q:${reach}`, `“${c.name}”: design flow of ${reach}`, flow(q));
  }
  const k = i.kinetics;
  put("k:kd", "k_d at 20 °C (1/d)", n(k.kd20PerDay));
  put("k:ka", "Reaeration method", `${nameOf(REAERATION_NAMES, k.kaMethod)}${k.kaFloor ? ", with a minimum rate" : ""}`);
  put("k:ks", "k_s at 20 °C (1/d)", n(k.ks20PerDay));
  put("k:sod", "SOD at 20 °C (g/m²/d)", n(k.sod20GPerM2Day));
  put("k:kn", "k_n at 20 °C (1/d)", n(k.kn20PerDay));
  put("k:theta", "Temperature correction", k.thetaRule === "piecewise" ? "piecewise θ" : "constant θ");
  for (const [reach, o] of Object.entries(i.reachOverrides ?? {})) {
    for (const [f, v] of Object.entries(o)) {
      put(`r:${reach}:${f}`, `Reach ${reach}: ${REACH_FIELDS[f] ?? f}`, own(v, (x) => (f === "kaMethod" ? nameOf(REAERATION_NAMES, x) : n(Number(x)))));
    }
  }
  const h = i.headwater;
  for (const [f, label] of Object.entries(WATER_FIELDS)) {
    const v = h[f as keyof typeof h] as number | null | undefined;
    // a headwater DO left blank is a share of saturation (lib/scenarios/design-defaults)
    put(`h:${f}`, `Headwater ${label}`, f === "doMgL" && v === null ? DEFAULT_HEADWATER_DO_TEXT : n(v, 2));
  }
  put("h:temp", "Headwater temperature", temp(h.temperatureC, "—"));
  for (const [reach, o] of Object.entries(i.inflowOverrides ?? {})) {
    for (const [f, v] of Object.entries(o)) put(`i:${reach}:${f}`, `Inflow at ${reach}: ${WATER_FIELDS[f] ?? f}`, v === null || v === undefined ? "scenario default" : n(v, 2));
  }
  const DISCHARGER_FIELDS: Record<string, [string, (v: number) => string]> = {
    designFlowM3s: ["design flow", (v) => flow(v)],
    bod5MgL: ["effluent BOD5 (mg/L)", (v) => n(v, 2)],
    cbodUMgL: ["effluent CBODu (mg/L)", (v) => n(v, 2)],
    bottleKPerDay: ["bottle rate k1 (1/d)", (v) => n(v, 3)],
    doMgL: ["effluent DO (mg/L)", (v) => n(v, 2)],
    temperatureC: ["effluent temperature", (v) => temp(v, "—")],
  };
  for (const [permit, o] of Object.entries(i.dischargers ?? {})) {
    for (const [f, v] of Object.entries(o)) {
      const [label, show] = DISCHARGER_FIELDS[f] ?? [f, (x: number) => n(x)];
      put(`d:${permit}:${f}`, `Discharger ${permit}: ${label}`, v === null || v === undefined ? "network's value" : show(v));
    }
  }
  if (run.kind === "allocation") {
    const a = i.allocation;
    put("a:objective", "Objective", nameOf(OBJECTIVE_NAMES, a.objective));
    put("a:floor", "Technology floor", a.floorBod5MgL === null ? "none" : `effluent BOD5 ${n(a.floorBod5MgL, 1)} mg/L`);
    put("a:mosDo", "Margin of safety (DO)", `${n(a.mosDoMgL, 2)} mg/L`);
    put("a:mosFraction", "Margin of safety (share of load)", `${formatPercent(100 * a.mosFraction)} %`);
    put("a:reserve", "Reserve capacity", `${formatPercent(100 * a.reserveFraction)} %`);
  }
  return out;
}

/**
 * The inputs that differ between compared runs, in a plain label each: criterion, network
 * version, conditions (flow scale, temperature, per-reach flows), kinetics, headwater and
 * inflow water, per-reach and per-discharger values, and — for allocation runs — objective,
 * floor, MOS and reserve. A row is listed when the runs that have the input do not all
 * agree; a run without it (a model run has no objective) reads "—". Values are shown in
 * the basin's units. Rows keep a stable order: first-seen over the runs.
 */
export function inputDifferences(runs: RunInputsForDiff[], system: UnitSystem = "SI"): InputDifference[] {
  const all = runs.map((r) => facts(r, system));
  const keys: string[] = [];
  for (const f of all) for (const k of f.keys()) if (!keys.includes(k)) keys.push(k);
  const out: InputDifference[] = [];
  for (const key of keys) {
    const present = all.map((f) => f.get(key));
    const values = new Set(present.filter((p) => p !== undefined).map((p) => p!.value));
    const gap = absent(key);
    // an override set in one run and not in another is a difference too
    const missing = gap !== null && present.some((p) => p === undefined);
    if (values.size > 1 || missing) {
      const label = present.find((p) => p !== undefined)!.label;
      out.push({ key, label, values: present.map((p) => p?.value ?? gap ?? "—") });
    }
  }
  return out;
}

/** What a run without this input has instead: overrides fall back to the network or the scenario default; null when unknown (not a difference). */
function absent(key: string): string | null {
  if (key.startsWith("r:") || key.startsWith("d:") || /^c:.*:q:/.test(key)) return "network's value";
  if (key.startsWith("i:")) return "scenario default";
  if (key.startsWith("c:")) return "— (no such condition)";
  return null;
}
