import { AREA_UNITS, DEPTH_UNITS, DISTANCE_UNITS, FLOW_UNITS, TEMPERATURE_UNITS, VELOCITY_UNITS } from "./units";
import type { FieldInfo } from "./types";
import type { DischargerMapping, ReachMapping } from "./field-mapping";

/** How a model field is bound: a source field, plus a unit (or BOD kind) where it has one. */
export interface Binding {
  source: string;
  unit?: string;
  kind?: "BOD5" | "CBODu";
}
export type Bindings = Record<string, Binding | undefined>;

export interface ModelField {
  key: string;
  label: string;
  required?: boolean;
  /** Stored as a plain string in the mapping (ids, names, e-mail) rather than { source }. */
  plain?: boolean;
  units?: readonly string[];
  kinds?: readonly ("BOD5" | "CBODu")[];
  /** Source-name pattern used to suggest a field. */
  guess: RegExp;
}

const UNIT_LABELS: Record<string, string> = {
  "m3/s": "m³/s",
  cfs: "cfs",
  MGD: "MGD",
  m: "m",
  ft: "ft",
  km: "km",
  mi: "mi",
  "m/s": "m/s",
  "ft/s": "ft/s",
  degC: "°C",
  degF: "°F",
  km2: "km²",
  mi2: "mi²",
  ha: "ha",
};
export const unitText = (u: string) => UNIT_LABELS[u] ?? u;

export const REACH_FIELDS: ModelField[] = [
  { key: "reachId", label: "Reach id", required: true, plain: true, guess: /^(reach_?id|id|reach|seg(ment)?_?id)$/i },
  { key: "name", label: "Name", plain: true, guess: /^(name|gnis_?name|river_?name)$/i },
  { key: "downstreamId", label: "Downstream reach id", plain: true, guess: /^(down(stream)?_?id|to_?reach|next_?id)$/i },
  { key: "length", label: "Length override", units: DISTANCE_UNITS, guess: /^(length|len)(_|$)/i },
  { key: "velocity", label: "Velocity at design flow", units: VELOCITY_UNITS, guess: /^vel/i },
  { key: "depth", label: "Depth at design flow", units: DEPTH_UNITS, guess: /^depth/i },
  { key: "slope", label: "Slope (m/m)", guess: /^slope/i },
  { key: "manningN", label: "Manning's roughness n", guess: /^(manning|mannings?_?n|n_?mann)/i },
  { key: "bottomWidth", label: "Bottom width", units: DEPTH_UNITS, guess: /^(bottom_?width|bot_?w|b_?width)/i },
  { key: "sideSlope", label: "Bank side slope (horizontal per vertical)", guess: /^side_?slope/i },
  { key: "hgVelocityCoef", label: "Hydraulic geometry: velocity coefficient a (U = a·Q^b, SI)", guess: /^(hg_?a|vel_?coef|u_?coef)$/i },
  { key: "hgVelocityExp", label: "Hydraulic geometry: velocity exponent b", guess: /^(hg_?b|vel_?exp|u_?exp)$/i },
  { key: "hgDepthCoef", label: "Hydraulic geometry: depth coefficient c (H = c·Q^f, SI)", guess: /^(hg_?c|depth_?coef|h_?coef)$/i },
  { key: "hgDepthExp", label: "Hydraulic geometry: depth exponent f", guess: /^(hg_?f|depth_?exp|h_?exp)$/i },
  { key: "designFlow", label: "Design flow", units: FLOW_UNITS, guess: /(design_?)?flow|7q10|^q_/i },
  { key: "drainageArea", label: "Drainage area", units: AREA_UNITS, guess: /^(drain(age)?_?area|da_|catch(ment)?_?area|basin_?area)/i },
  { key: "temperature", label: "Temperature", units: TEMPERATURE_UNITS, guess: /^temp/i },
  { key: "elevation", label: "Elevation", units: DEPTH_UNITS, guess: /^elev/i },
  { key: "deoxygenationRate", label: "Deoxygenation rate k_d at 20 °C (1/d)", guess: /^(kd|k_d|deox)/i },
  { key: "reaerationRate", label: "Reaeration rate k_a at 20 °C (1/d)", guess: /^(ka|k_a|reaer)/i },
  { key: "settlingRate", label: "Settling rate k_s (1/d)", guess: /^(ks|k_s|settl)/i },
  { key: "sod", label: "Sediment oxygen demand (g O₂/m²/d)", guess: /^sod/i },
];

export const DISCHARGER_FIELDS: ModelField[] = [
  { key: "name", label: "Facility name", required: true, plain: true, guess: /^(facility|name|plant|facility_?name)$/i },
  { key: "permitId", label: "Permit id", required: true, plain: true, guess: /^(permit|permit_?id|npdes|permit_?no)$/i },
  { key: "designFlow", label: "Design flow", units: FLOW_UNITS, guess: /(design_?)?flow/i },
  { key: "effluentBod", label: "Effluent BOD", kinds: ["BOD5", "CBODu"], guess: /bod|cbod/i },
  { key: "bottleRate", label: "Bottle rate k1 (1/d)", guess: /bottle|^k1/i },
  { key: "dissolvedOxygen", label: "Effluent DO (mg/L)", guess: /^do(_|$)|oxygen/i },
  { key: "temperature", label: "Effluent temperature", units: TEMPERATURE_UNITS, guess: /^temp/i },
  { key: "contactEmail", label: "Contact e-mail", plain: true, guess: /mail/i },
];

/** Unit suggested by a source field's name (e.g. FLOW_CFS → cfs, TEMP_F → °F). */
function guessUnit(name: string, units: readonly string[]): string {
  const n = name.toLowerCase();
  const hints: [RegExp, string][] = [
    [/cfs/, "cfs"],
    [/mgd/, "MGD"],
    [/m3s|m3_s|cms/, "m3/s"],
    [/fps|ft_?s/, "ft/s"],
    [/m_?s$|mps/, "m/s"],
    [/_ft$|feet|_ft_/, "ft"],
    [/_mi$|miles/, "mi"],
    [/_km$/, "km"],
    [/_m$/, "m"],
    [/_f$|degf|fahr/, "degF"],
    [/_c$|degc|cels/, "degC"],
  ];
  for (const [re, unit] of hints) if (re.test(n) && units.includes(unit)) return unit;
  return units[0];
}

/** Suggest bindings from source field names; the planner reviews every suggestion. */
export function guessBindings(fields: readonly ModelField[], source: readonly FieldInfo[]): Bindings {
  const out: Bindings = {};
  const used = new Set<string>();
  for (const f of fields) {
    const match = source.find((s) => !used.has(s.name) && f.guess.test(s.name));
    if (!match) continue;
    used.add(match.name);
    out[f.key] = {
      source: match.name,
      unit: f.units ? guessUnit(match.name, f.units) : undefined,
      kind: f.kinds ? (/cbod|ult/i.test(match.name) ? "CBODu" : "BOD5") : undefined,
    };
  }
  return out;
}

/** Bindings → the mapping object the API validates (geo's reach/discharger mapping schemas). */
export function toMapping(fields: readonly ModelField[], b: Bindings): Record<string, unknown> {
  const m: Record<string, unknown> = {};
  for (const f of fields) {
    const x = b[f.key];
    if (!x?.source) continue;
    if (f.plain) m[f.key] = x.source;
    else if (f.units) m[f.key] = { source: x.source, unit: x.unit ?? f.units[0] };
    else if (f.kinds) m[f.key] = { source: x.source, kind: x.kind ?? f.kinds[0] };
    else m[f.key] = { source: x.source };
  }
  return m;
}

/** A saved mapping → bindings for the editor. */
export function fromMapping(fields: readonly ModelField[], mapping: Record<string, unknown>): Bindings {
  const out: Bindings = {};
  for (const f of fields) {
    const v = mapping[f.key];
    if (typeof v === "string") out[f.key] = { source: v };
    else if (v && typeof v === "object" && "source" in v) out[f.key] = v as Binding;
  }
  return out;
}

export type { DischargerMapping, ReachMapping };
