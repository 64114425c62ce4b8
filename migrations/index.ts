import type { Migration, MigrationProvider } from "kysely";
import * as m2026120100 from "./2026120100_foundation";
import * as m2026120101 from "./2026120101_networks";
import * as m2026120102 from "./2026120102_scenarios_runs";
import * as m2026120103 from "./2026120103_plans_reviews";
import * as m2026120104 from "./2026120104_email_outbox";
import * as m2026120105 from "./2026120105_accounts";
import * as m2026120201 from "./2026120201_sessions_rate_limits";
import * as m2026120204 from "./2026120204_frozen_plan_rows";
import * as m2026120205 from "./2026120205_plan_report_files";
import * as m2026120206 from "./2026120206_review_rules";
import * as m2026120301 from "./2026120301_publication_acknowledgement";
import * as m2026120302 from "./2026120302_plan_lineage";
import * as m2026120303 from "./2026120303_basin_time_zone";
import * as m2026120401 from "./2026120401_gauge_records";
import * as m2026120501 from "./2026120501_surveys";
import * as m2026120502 from "./2026120502_calibration_runs";
import * as m2026120503 from "./2026120503_temperature_records";
import * as m2026120504 from "./2026120504_temperature_summer";

/**
 * Every migration, listed explicitly (Kysely's FileMigrationProvider does a
 * native import() that breaks under vitest and bundlers). Add new entries at
 * the end; names sort by their timestamp prefix.
 */
export const migrations: Record<string, Migration> = {
  "2026120100_foundation": m2026120100,
  "2026120101_networks": m2026120101,
  "2026120102_scenarios_runs": m2026120102,
  "2026120103_plans_reviews": m2026120103,
  "2026120104_email_outbox": m2026120104,
  "2026120105_accounts": m2026120105,
  "2026120201_sessions_rate_limits": m2026120201,
  "2026120204_frozen_plan_rows": m2026120204,
  "2026120205_plan_report_files": m2026120205,
  "2026120206_review_rules": m2026120206,
  "2026120301_publication_acknowledgement": m2026120301,
  "2026120302_plan_lineage": m2026120302,
  "2026120303_basin_time_zone": m2026120303,
  "2026120401_gauge_records": m2026120401,
  "2026120501_surveys": m2026120501,
  "2026120502_calibration_runs": m2026120502,
  "2026120503_temperature_records": m2026120503,
  "2026120504_temperature_summer": m2026120504,
};

export const migrationProvider: MigrationProvider = {
  async getMigrations() {
    return migrations;
  },
};
