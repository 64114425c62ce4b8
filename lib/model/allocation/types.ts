import type { AllocationObjective } from "../types";
import type { Lp } from "./lp";
import type { PermitTerms } from "./permit";

export interface AllocateOptions {
  /** A checkpoint counts as violated when DO < criterion + MOS − tolerance. Default 1e-6 mg/L. */
  tolerance_mg_l?: number;
  /** Most rounds of constraint generation. Default 50. */
  max_iterations?: number;
  /**
   * Called with every LP handed to the solver, its solution and the column scales
   * (x_k = W_k/scale_k, kg/d); the last call is the final LP. For checks and tests.
   */
  inspect_lp?: (lp: Lp, solution: number[], scale: number[]) => void;
  /**
   * The name the results give the model file's own condition (binding, diagnosis,
   * conditions). Default "base", as the CLI prints it; a scenario run passes its first
   * condition's name.
   */
  own_condition_name?: string;
}

export interface AllocationEntry extends PermitTerms {
  id: string;
  today_cbodu_kg_day: number;
  min_kg_day: number;
  max_kg_day: number;
}

export interface BindingCheckpoint {
  condition: string;
  reach: string;
  km: number;
  do_mg_l: number;
  /**
   * Shadow price of the checkpoint: objective gained per 1 mg/L relaxation of its requirement
   * (for max-total and min-removal: kg/d CBODu per mg/L).
   */
  dual: number;
  /**
   * 1/dual for the load objectives: DO gained at this checkpoint (mg/L) per kg/d of total
   * allocation given up, with the rest re-optimised; null for the other objectives.
   */
  do_gain_mg_l_per_kg_day: number | null;
}

export interface DiagnosisEntry {
  condition: string;
  reach: string;
  km: number;
  do_mg_l: number;
  required_do_mg_l: number;
  deficit_mg_l: number;
  /** Deficit from headwaters, tributary/lateral inflows, distributed load and temperature changes. */
  from_background_mg_l: number;
  from_sod_mg_l: number;
  from_dischargers_mg_l: number;
}

export interface TmdlTable {
  wla_kg_day: number;
  la_kg_day: number;
  mos_kg_day: number;
  rc_kg_day: number;
  tmdl_kg_day: number;
  /** MOS held as a DO buffer (implicit in the loads above). */
  mos_do_mg_l: number;
}

export interface AllocationResult {
  feasible: boolean;
  objective: AllocationObjective;
  objective_value: number | null;
  /** What objective_value measures. */
  objective_units: string;
  allocations: AllocationEntry[];
  binding: BindingCheckpoint[];
  tmdl: TmdlTable | null;
  /** Present when infeasible: checkpoints failing with every discharger at its floor. */
  diagnosis?: DiagnosisEntry[];
  conditions: string[];
  iterations: number;
  checkpoints: number;
}
