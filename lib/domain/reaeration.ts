/**
 * How a reach's reaeration rate k_a is obtained (docs/MODEL.md §3). A formula is what
 * actually produced a k_a and is recorded with every run; a method is what a model file or
 * a scenario may ask for: one of the formulas, or `depth-velocity`, which picks one of
 * DEPTH_VELOCITY_FORMULAS by depth and velocity.
 */
export const KA_FORMULAS = ["given", "oconnor-dobbins", "churchill", "owens-gibbs", "tsivoglou-neal"] as const;
export type KaFormula = (typeof KA_FORMULAS)[number];

export const KA_METHODS = [...KA_FORMULAS, "depth-velocity"] as const;
export type KaMethod = (typeof KA_METHODS)[number];

/** The formulas that need only velocity and depth, among which `depth-velocity` chooses. */
export const DEPTH_VELOCITY_FORMULAS = ["owens-gibbs", "oconnor-dobbins", "churchill"] as const satisfies readonly KaFormula[];
export type DepthVelocityFormula = (typeof DEPTH_VELOCITY_FORMULAS)[number];

/** The method a scenario uses unless it says otherwise. */
export const DEFAULT_KA_METHOD: KaMethod = "depth-velocity";

/** Reaeration methods and formulas as a reader sees them (the scenario editor lists them in this order). */
export const REAERATION_NAMES: Readonly<Record<KaMethod, string>> = {
  "depth-velocity": "Chosen per reach by depth and velocity",
  given: "Given rate coefficient",
  "oconnor-dobbins": "O'Connor–Dobbins",
  churchill: "Churchill–Elmore–Buckingham",
  "owens-gibbs": "Owens–Edwards–Gibbs",
  "tsivoglou-neal": "Tsivoglou–Neal",
};
