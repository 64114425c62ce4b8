import { isLoadObjective, type UnitSystem } from "@/lib/domain";
import { kgToLb } from "@/lib/model/units";
import type { AllocationResult, BindingCheckpoint } from "@/lib/model/allocation/types";

/**
 * The DO gained is stated per 1000 kg/d (or lb/d) given up: per single kg/d it reads
 * 0.000428 mg/L, a figure nobody compares at a glance; per 1000 it is 0.428 mg/L.
 */
export const GAIN_PER = 1000;

/** A binding checkpoint with its shadow price stated in the basin's units. */
export interface BindingRow extends BindingCheckpoint {
  /** The dual in `dual_unit` (loads in kg/d or lb/d for the load objectives). */
  dual_shown: number;
  dual_unit: string;
  /** DO gained at the checkpoint per GAIN_PER units of total load given up, in `gain_unit`; null for the non-load objectives. */
  gain_shown: number | null;
  gain_unit: string | null;
}

/**
 * The binding checkpoints of an allocation with their duals in plain units: for the load
 * objectives "kg/d (or lb/d) of total allocation per mg/L" and its inverse "mg/L of DO
 * per kg/d (or lb/d) given up"; for the others the objective's own unit per mg/L.
 * Example: dual 2000 kg/d per mg/L in US units → 4409.2 lb/d per mg/L, gain 0.227 mg/L per 1000 lb/d.
 */
export function bindingRows(allocation: AllocationResult, system: UnitSystem): BindingRow[] {
  const load = isLoadObjective(allocation.objective);
  const us = system === "US";
  const loadUnit = us ? "lb/d" : "kg/d";
  return allocation.binding.map((b) => {
    if (!load) return { ...b, dual_shown: b.dual, dual_unit: `${allocation.objective_units} per mg/L`, gain_shown: null, gain_unit: null };
    const gain = b.do_gain_mg_l_per_kg_day;
    return {
      ...b,
      dual_shown: us ? kgToLb(b.dual) : b.dual,
      dual_unit: `${loadUnit} of total load per mg/L`,
      // per lb/d: a pound is 0.4536 kg, so the DO gained per lb is that much smaller
      gain_shown: gain === null ? null : GAIN_PER * (us ? gain / kgToLb(1) : gain),
      gain_unit: `mg/L per ${GAIN_PER} ${loadUnit} given up`,
    };
  });
}
