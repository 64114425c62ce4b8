/** Plain-word names of the scenario choices, shared by the scenario editor and the reports. */
export const OBJECTIVE_NAMES: Record<string, string> = {
  "max-total": "Most total load",
  "min-removal": "Least total removal",
  "equal-percent": "Equal percent removal",
  "equal-concentration": "Equal effluent concentration",
  "max-min-share": "Most even share",
};

/** Reaeration choices of a scenario and the formulas a run records per reach. */
export const REAERATION_NAMES: Record<string, string> = {
  "depth-velocity": "Chosen per reach by depth and velocity",
  given: "Given rate coefficient",
  "oconnor-dobbins": "O'Connor–Dobbins",
  churchill: "Churchill–Elmore–Buckingham",
  "owens-gibbs": "Owens–Edwards–Gibbs",
  "tsivoglou-neal": "Tsivoglou–Neal",
};

export const nameOf = (names: Record<string, string>, key: unknown): string => names[String(key)] ?? String(key);
