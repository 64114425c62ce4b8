import type { DischargerMapping, ReachMapping } from "@/geo";

/**
 * The invented Tamsel River demo files (made by scripts/make-demo-gis.ts)
 * and the field mappings a planner would choose for them.
 */
export const DEMO_GIS_FILES = {
  reaches: "tests/fixtures/demo/tamsel-reaches.zip",
  reachesGeoJson: "tests/fixtures/demo/tamsel-reaches.geojson",
  dischargers: "tests/fixtures/demo/tamsel-dischargers.csv",
} as const;

/** The zipped shapefile carries US customary fields. */
export const DEMO_REACH_MAPPING: ReachMapping = {
  reachId: "REACH_ID",
  name: "NAME",
  downstreamId: "DOWN_ID",
  designFlow: { source: "FLOW_CFS", unit: "cfs" },
  velocity: { source: "VEL_FPS", unit: "ft/s" },
  depth: { source: "DEPTH_FT", unit: "ft" },
  slope: { source: "SLOPE" },
  temperature: { source: "TEMP_F", unit: "degF" },
  elevation: { source: "ELEV_FT", unit: "ft" },
  deoxygenationRate: { source: "KD_20" },
};

/** The GeoJSON copy carries SI fields. */
export const DEMO_GEOJSON_REACH_MAPPING: ReachMapping = {
  reachId: "reach_id",
  name: "name",
  downstreamId: "downstream_id",
  designFlow: { source: "design_flow_m3s", unit: "m3/s" },
  velocity: { source: "velocity_m_s", unit: "m/s" },
  depth: { source: "depth_m", unit: "m" },
  slope: { source: "slope" },
  temperature: { source: "temperature_c", unit: "degC" },
  elevation: { source: "elevation_m", unit: "m" },
  deoxygenationRate: { source: "kd_per_day" },
};

export const DEMO_DISCHARGER_MAPPING: DischargerMapping = {
  name: "facility",
  permitId: "permit_id",
  designFlow: { source: "design_flow_mgd", unit: "MGD" },
  effluentBod: { source: "bod5_mg_l", kind: "BOD5" },
  bottleRate: { source: "bottle_rate_per_day" },
  dissolvedOxygen: { source: "do_mg_l" },
  temperature: { source: "temperature_f", unit: "degF" },
  contactEmail: "contact_email",
};
