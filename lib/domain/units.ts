/** The unit system a basin shows its quantities in (basins.unit_system); computation is always SI. */
export const UNIT_SYSTEMS = ["SI", "US"] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

export const UNIT_SYSTEM_NAMES: Readonly<Record<UnitSystem, string>> = {
  SI: "SI",
  US: "US customary",
};

/** The units a reader meets first in each system (length, flow, load), for the basin settings and overview. */
export const UNIT_SYSTEM_UNITS: Readonly<Record<UnitSystem, string>> = {
  SI: "km, m³/s, kg/d",
  US: "mi, cfs, lb/d",
};

/** "US customary (mi, cfs, lb/d)". */
export const unitSystemLabel = (system: UnitSystem): string => `${UNIT_SYSTEM_NAMES[system]} (${UNIT_SYSTEM_UNITS[system]})`;
