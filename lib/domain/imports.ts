/** The two layers of a network import (imports.layer, field_mappings.layer). */
export const IMPORT_LAYERS = ["reaches", "dischargers"] as const;
export type ImportLayer = (typeof IMPORT_LAYERS)[number];

/** The file formats an upload may hold (imports.format). */
export const IMPORT_FORMATS = ["shapefile", "geojson", "csv"] as const;
export type ImportFormat = (typeof IMPORT_FORMATS)[number];

/**
 * The topology options of a network import when the planner gives none: the wizard's
 * starting values, the API's defaults (lib/validation/network.ts), the CLI's and the
 * pure validation's (geo/validate.ts, geo/topology.ts, geo/snapping.ts).
 */
export const IMPORT_DEFAULTS = {
  /** Line ends closer than this (m) are one node. */
  toleranceM: 5,
  /** An outfall farther than this (m) from every reach is an error unless reassigned. */
  maxSnapDistanceM: 500,
  /** A longer reach is flagged (km). */
  maxReachLengthKm: 10,
  /** Several outlets are an error unless the planner allows them. */
  allowMultipleOutlets: false,
} as const satisfies ImportOptionDefaults;

export interface ImportOptionDefaults {
  toleranceM: number;
  maxSnapDistanceM: number;
  maxReachLengthKm: number;
  allowMultipleOutlets: boolean;
}

/** A fresh copy of the defaults, for a form's starting state or a stored draft. */
export const importDefaults = (): ImportOptionDefaults => ({ ...IMPORT_DEFAULTS });
