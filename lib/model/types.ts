/**
 * The model file as the computation core sees it (MODEL.md §8). Field names are a contract
 * shared with the CLI, the API and the zod schema in lib/validation/model-file.ts.
 */
import type { AllocationObjective, DeoxygenationThetaRule, KaMethod } from "@/lib/domain";

/** U = a·Q^b (m/s), H = c·Q^f (m), Q in m³/s (Leopold & Maddock 1953). */
export interface HydraulicGeometry {
  a: number;
  b: number;
  c: number;
  f: number;
}

/** A prismatic channel for Manning's equation; the bed slope is the reach's `slope_m_m`. */
export interface ManningInput {
  /** Manning's roughness n, s/m^(1/3). */
  n: number;
  bottom_width_m: number;
  /** Horizontal run per unit rise of each bank; default 0 (rectangular). */
  side_slope?: number;
}

export interface ReachInput {
  id: string;
  /** Next reach downstream, or null for an outlet. */
  downstream: string | null;
  length_km: number;
  /** Give velocity and depth, or hydraulic_geometry, or manning (with slope_m_m). */
  velocity_m_s?: number;
  depth_m?: number;
  hydraulic_geometry?: HydraulicGeometry;
  /** Velocity (Q/A) and mean depth (A/T) from Manning's equation at normal depth for the reach's flow. */
  manning?: ManningInput;
  kd20_per_day: number;
  ka20_per_day?: number;
  /** Default: "given" when ka20_per_day is present, else "depth-velocity". */
  ka_method?: KaMethod;
  /** Apply the floor k_a ≥ 0.6/H (Chin 2006) to the 20 °C value, before temperature correction. Default false. */
  ka_floor?: boolean;
  /** Multiplies the reach's k_a at 20 °C as its method (and floor) gives it — a calibrated correction. Default 1. */
  ka_multiplier?: number;
  slope_m_m?: number;
  /** Settling rate, default 0. */
  ks20_per_day?: number;
  /** Nitrification rate, default 0. */
  kn20_per_day?: number;
  /** Sediment oxygen demand, default 0. */
  sod20_g_m2_day?: number;
  /** Distributed CBODu load along the reach, mg/L/d; default 0. */
  distributed_cbodu_mg_l_day?: number;
  /** When present the reach holds its water at this temperature; else mixed temperature. */
  temperature_c?: number;
  /** Default 0 m. */
  elevation_m?: number;
  /** Default 0 g/kg. */
  salinity_g_kg?: number;
}

/** Water entering the network: concentrations of the entering water. */
export interface WaterInput {
  flow_m3_s: number;
  cbodu_mg_l?: number;
  /** With bottle_k_per_day, an alternative to cbodu_mg_l. */
  bod5_mg_l?: number;
  /** Default 0.23 /d. */
  bottle_k_per_day?: number;
  /** Default 0. */
  nbodu_mg_l?: number;
  do_mg_l: number;
  temperature_c: number;
}

export interface HeadwaterInput extends WaterInput {
  reach: string;
}

/** A tributary or lateral inflow that is not itself modelled (a load allocation, LA). */
export interface InflowInput extends WaterInput {
  id?: string;
  reach: string;
  km: number;
}

export interface DischargerInput extends WaterInput {
  id: string;
  reach: string;
  km: number;
  /** A placeholder future discharger: its load is reserve capacity, fixed, not allocated. */
  future?: boolean;
  /** Cost weight per kg/d removed for the min-removal objective; default 1. */
  removal_cost?: number;
}

export interface KineticsInput {
  theta_kd?: number;
  theta_ka?: number;
  theta_sod?: number;
  theta_kn?: number;
  theta_ks?: number;
  /** Default "constant". */
  deoxygenation_rule?: DeoxygenationThetaRule;
}

/** What an allocation optimises (the list: lib/domain ALLOCATION_OBJECTIVES). */
export type { AllocationObjective };

/** One design condition overriding temperatures and headwater/inflow flows. */
export interface ConditionInput {
  name: string;
  /** Sets every reach's held temperature. */
  temperature_c?: number;
  /** Overrides per headwater, matched by reach id. */
  headwaters?: Array<{ reach: string; flow_m3_s?: number; temperature_c?: number; do_mg_l?: number }>;
  /** Overrides per lateral inflow or tributary, matched by its id. */
  inflows?: Array<{ id: string; flow_m3_s?: number; temperature_c?: number; do_mg_l?: number }>;
  /** Effluent flows per discharger, matched by id (the allocation's loads stay the unknowns). */
  dischargers?: Array<{ id: string; flow_m3_s: number }>;
}

export interface AllocationInput {
  objective: AllocationObjective;
  bounds?: Record<string, { min_kg_day?: number; max_kg_day?: number }>;
  /** Technology floor as effluent BOD5 (mg/L) at design flow, e.g. 30 (40 CFR 133.102). Default none. */
  floor_bod5_mg_l?: number;
  /** MOS as a DO buffer added to the criterion (mg/L). Default 0. */
  mos_do_mg_l?: number;
  /** MOS as a fraction of the loading capacity (0–1). Default 0. */
  mos_fraction?: number;
  /** Reserve capacity as a fraction of the loading capacity (0–1). Default 0. */
  reserve_fraction?: number;
  /** Extra design conditions checked in the same LP, besides the file's own. */
  conditions?: ConditionInput[];
}

export interface ModelFile {
  reaches: ReachInput[];
  headwaters: HeadwaterInput[];
  dischargers: DischargerInput[];
  inflows?: InflowInput[];
  criterion_do_mg_l: number;
  /** Profile spacing, default 0.5 km. */
  step_km?: number;
  kinetics?: KineticsInput;
  allocation?: AllocationInput;
}
