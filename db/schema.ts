import type { ColumnType, Generated, Insertable, Selectable, Updateable } from "kysely";
import type { BasinRole, ImportFormat, ImportLayer, PlanStatus, RunKind, RunStatus, ThreadStatus, UnitSystem } from "@/lib/domain";

// The vocabulary's types come from lib/domain (one tuple each); re-exported here for the
// queries and services that have always read them from the schema.
export type { BasinRole, ImportFormat, ImportLayer, PlanStatus, RunKind, RunStatus, ThreadStatus, UnitSystem };

/** Timestamps: read as Date, written as Date or ISO string, defaulted by the database. */
type CreatedAt = ColumnType<Date, Date | string | undefined, never>;
type UpdatedAt = ColumnType<Date, Date | string | undefined, Date | string>;

export interface UsersTable {
  id: Generated<string>;
  email: string;
  name: string;
  password_hash: string;
  is_admin: Generated<boolean>;
  created_at: CreatedAt;
  updated_at: UpdatedAt;
  /** Null until the address is confirmed (self-registered accounts); unverified accounts cannot sign in. */
  email_verified_at: ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;
  /** Compared with the one in a session's JWT; raised to end every session the person has. */
  session_version: Generated<number>;
}

export interface BasinsTable {
  id: Generated<string>;
  slug: string;
  name: string;
  description: Generated<string>;
  /** DO criterion, mg/L (NUMERIC parsed to number by db/client.ts). */
  do_criterion_mg_l: ColumnType<number, number | undefined, number>;
  unit_system: ColumnType<UnitSystem, UnitSystem | undefined, UnitSystem>;
  /** Shortest review period the lead allows, days (0: none). */
  min_review_days: Generated<number>;
  /** IANA time zone every date and time of the basin is shown in (null until set or a first review opens). */
  time_zone: ColumnType<string | null, string | null | undefined, string | null>;
  created_by: string | null;
  created_at: CreatedAt;
  updated_at: UpdatedAt;
}

export interface MembershipsTable {
  basin_id: string;
  user_id: string;
  role: BasinRole;
  created_at: CreatedAt;
}

export interface FacilitiesTable {
  id: Generated<string>;
  basin_id: string;
  name: string;
  permit_id: string;
  created_at: CreatedAt;
}

export interface FacilityUsersTable {
  facility_id: string;
  user_id: string;
  created_at: CreatedAt;
}

export interface AuditEventsTable {
  id: Generated<string>;
  basin_id: string | null;
  actor_id: string | null;
  action: string;
  target_type: string;
  target_id: string | null;
  details: ColumnType<Record<string, unknown>, string | undefined, string>;
  created_at: CreatedAt;
}

type Json<T> = ColumnType<T, string, string>;

export interface ImportsTable {
  id: Generated<string>;
  basin_id: string;
  layer: ImportLayer;
  format: ImportFormat;
  file_name: string;
  size_bytes: number;
  sha256: string;
  content: Buffer;
  crs: Json<Record<string, unknown>>;
  read_options: Json<Record<string, unknown>>;
  feature_count: number;
  fields: Json<unknown[]>;
  status: ColumnType<"uploaded" | "committed", "uploaded" | "committed" | undefined, "uploaded" | "committed">;
  uploaded_by: string | null;
  uploaded_at: CreatedAt;
}

/** A gauge's daily flow record and the low-flow statistics computed from it at upload. */
export interface GaugeRecordsTable {
  id: Generated<string>;
  basin_id: string;
  name: string;
  station_code: string | null;
  /** Where on the network the gauge stands (a reach id), when the planner says. */
  reach_key: string | null;
  unit: "m3/s" | "cfs";
  climatic_year_start: string;
  file_name: string;
  size_bytes: number;
  sha256: string;
  content: Buffer;
  first_day: ColumnType<string, string, string>;
  last_day: ColumnType<string, string, string>;
  day_count: number;
  missing_days: number;
  statistics: Json<unknown>;
  uploaded_by: string | null;
  uploaded_at: CreatedAt;
}

export interface TemperatureRecordsTable {
  id: Generated<string>;
  basin_id: string;
  name: string;
  station_code: string | null;
  reach_key: string | null;
  unit: "C" | "F";
  file_name: string;
  size_bytes: number;
  sha256: string;
  content: Buffer;
  first_day: ColumnType<string, string, string>;
  last_day: ColumnType<string, string, string>;
  day_count: number;
  missing_days: number;
  /** Daily means in °C (lib/hydrology/design-temperature.ts DailyValue[]). */
  days: Json<unknown>;
  /** The design temperature by the default rule, worked out at upload (null: no June–September values, or kept before it was). */
  summer: Json<unknown> | null;
  uploaded_by: string | null;
  uploaded_at: CreatedAt;
}

export interface SurveysTable {
  id: Generated<string>;
  basin_id: string;
  /** The network version the stations were placed on. */
  network_id: string;
  name: string;
  /** The units the file was read in (temperature, flow, what a plain "bod" column held). */
  units: Json<unknown>;
  file_name: string;
  size_bytes: number;
  sha256: string;
  content: Buffer;
  /** The earliest and latest sample time as written (ISO 8601), when the file gives them. */
  first_time: string | null;
  last_time: string | null;
  station_count: number;
  sample_count: number;
  /** Every sample as placed (lib/survey/place-stations.ts PlacedSample), in Sagline's units. */
  samples: Json<unknown>;
  uploaded_by: string | null;
  uploaded_at: CreatedAt;
}

export interface FieldMappingsTable {
  id: Generated<string>;
  basin_id: string;
  layer: ImportLayer;
  name: string;
  mapping: Json<Record<string, unknown>>;
  created_by: string | null;
  created_at: CreatedAt;
}

export interface NetworksTable {
  id: Generated<string>;
  basin_id: string;
  version: number;
  reach_import_id: string;
  discharger_import_id: string | null;
  reach_mapping: Json<Record<string, unknown>>;
  discharger_mapping: Json<Record<string, unknown> | null>;
  options: Json<Record<string, unknown>>;
  report: Json<{ errors: unknown[]; warnings: unknown[] }>;
  total_length_km: number;
  note: Generated<string>;
  created_by: string | null;
  created_at: CreatedAt;
}

export interface NetworkNodesTable {
  network_id: string;
  node_key: string;
  kind: string;
  lon: number;
  lat: number;
}

export interface ReachesTable {
  network_id: string;
  reach_key: string;
  name: string | null;
  downstream_key: string | null;
  upstream_node: string;
  downstream_node: string;
  part: number;
  flipped: boolean;
  geometry_length_km: number;
  length_km: number;
  coordinates: Json<[number, number][]>;
  attributes: Json<Record<string, unknown>>;
  source_index: number;
}

export interface OutfallsTable {
  network_id: string;
  facility_id: string;
  reach_key: string;
  chainage_km: number;
  snap_distance_m: number;
  assignment: string;
  lon: number;
  lat: number;
  snapped_lon: number;
  snapped_lat: number;
  attributes: Json<Record<string, unknown>>;
  source_index: number;
}

export interface ScenariosTable {
  id: Generated<string>;
  basin_id: string;
  network_id: string;
  name: string;
  description: Generated<string>;
  inputs: Json<Record<string, unknown>>;
  version: Generated<number>;
  created_by: string | null;
  created_at: CreatedAt;
  updated_by: string | null;
  updated_at: UpdatedAt;
}

export interface RunsTable {
  id: Generated<string>;
  basin_id: string;
  scenario_id: string;
  scenario_version: number;
  kind: RunKind;
  status: ColumnType<RunStatus, RunStatus | undefined, RunStatus>;
  progress: ColumnType<number, number | undefined, number>;
  error: ColumnType<string | null, string | null | undefined, string | null>;
  inputs_hash: string;
  model_file: Json<Record<string, unknown>>;
  model_version: string;
  methods: ColumnType<Record<string, unknown>, string | undefined, string>;
  result: ColumnType<Record<string, unknown> | null, string | null | undefined, string | null>;
  created_by: string | null;
  created_at: CreatedAt;
  started_at: ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;
  finished_at: ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;
}

export interface PlansTable {
  id: Generated<string>;
  basin_id: string;
  version: number;
  title: string;
  run_id: string;
  status: ColumnType<PlanStatus, PlanStatus | undefined, PlanStatus>;
  snapshot: Json<Record<string, unknown>>;
  created_by: string | null;
  created_at: CreatedAt;
  published_by: ColumnType<string | null, string | null | undefined, string | null>;
  published_at: ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;
  /** The reach lines of the plan's network version as proposed (null only for plans from before they were kept). */
  reach_lines: ColumnType<PlanReachLine[] | null, string | undefined, string | null>;
  /** The plan's lineage: the id of its version 1 (its own id when it starts a lineage). */
  lineage_id: string;
  /** What the lead acknowledged on publishing with threads left unanswered (null when none was). */
  publication_acknowledgement: ColumnType<PublicationAcknowledgement | null, string | null | undefined, string | null>;
}

/** Threads left without a response when a plan was published, as the lead acknowledged them. */
export interface PublicationAcknowledgement {
  by: string;
  byId: string;
  at: string;
  statement: string;
  threads: Array<{ id: string; topic: string; permitId: string | null; comments: number; lastCommentAt: string }>;
}

/** A published plan's PDF report, rendered once. */
export interface PlanReportFilesTable {
  plan_id: string;
  pdf: Buffer;
  created_at: CreatedAt;
}

/** One reach line as a plan keeps it. */
export interface PlanReachLine {
  network_id: string;
  network_version: number;
  reach_key: string;
  name: string | null;
  length_km: number;
  downstream_key: string | null;
  coordinates: [number, number][];
}

export interface PlanAllocationsTable {
  plan_id: string;
  facility_id: string;
  /** The facility's name as the plan was proposed. */
  facility_name: ColumnType<string | null, string | undefined, string | null>;
  permit_id: string;
  cbodu_kg_day: number;
  bod5_kg_day: number;
  bod5_mg_l: number;
  today_cbodu_kg_day: number;
  reduction_pct: number | null;
  terms: Json<Record<string, unknown>>;
}

export interface ReviewPeriodsTable {
  id: Generated<string>;
  plan_id: string;
  starts_at: ColumnType<Date, Date | string, Date | string>;
  ends_at: ColumnType<Date, Date | string, Date | string>;
  time_zone: string;
  opened_by: string | null;
  closed_at: ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;
  extensions: ColumnType<{ at: string; by: string; from: string; to: string; reason: string }[], string | undefined, string>;
  created_at: CreatedAt;
}

export interface ThreadsTable {
  id: Generated<string>;
  plan_id: string;
  facility_id: string | null;
  status: ColumnType<ThreadStatus, ThreadStatus | undefined, ThreadStatus>;
  response: ColumnType<string | null, string | null | undefined, string | null>;
  responded_by: ColumnType<string | null, string | null | undefined, string | null>;
  responded_at: ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;
}

export interface CommentsTable {
  id: Generated<string>;
  thread_id: string;
  author_id: string | null;
  author_name: string;
  author_role: string;
  body: string;
  created_at: CreatedAt;
}

export type EmailKind = "review_opened" | "thread_reply" | "review_closing" | "plan_published" | "account";
export type EmailStatus = "pending" | "sending" | "sent" | "failed";

/** The e-mail outbox: written in the event's transaction, delivered by lib/email/sender.ts. */
export interface EmailOutboxTable {
  /** BIGSERIAL, read as a string. */
  id: Generated<string>;
  basin_id: string | null;
  to_address: string;
  subject: string;
  text_body: string;
  html_body: string | null;
  kind: EmailKind;
  /** Unique: an event queued twice sends once. */
  dedupe_key: string;
  status: ColumnType<EmailStatus, EmailStatus | undefined, EmailStatus>;
  attempts: ColumnType<number, number | undefined, number>;
  last_error: string | null;
  /** Pending: when to try next. Sending: when the claim lapses and the row is due again. */
  next_attempt_at: ColumnType<Date, Date | string | undefined, Date | string>;
  created_at: CreatedAt;
  sent_at: ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;
  message_id: string | null;
}

export interface Database {
  users: UsersTable;
  basins: BasinsTable;
  memberships: MembershipsTable;
  facilities: FacilitiesTable;
  facility_users: FacilityUsersTable;
  audit_events: AuditEventsTable;
  imports: ImportsTable;
  field_mappings: FieldMappingsTable;
  networks: NetworksTable;
  network_nodes: NetworkNodesTable;
  reaches: ReachesTable;
  outfalls: OutfallsTable;
  scenarios: ScenariosTable;
  runs: RunsTable;
  plans: PlansTable;
  plan_allocations: PlanAllocationsTable;
  review_periods: ReviewPeriodsTable;
  plan_report_files: PlanReportFilesTable;
  threads: ThreadsTable;
  comments: CommentsTable;
  email_outbox: EmailOutboxTable;
  account_tokens: AccountTokensTable;
  invitations: InvitationsTable;
  basin_follows: BasinFollowsTable;
  gauge_records: GaugeRecordsTable;
  surveys: SurveysTable;
  temperature_records: TemperatureRecordsTable;
}

export type UserRow = Selectable<UsersTable>;
export type NewUser = Insertable<UsersTable>;
export type BasinRow = Selectable<BasinsTable>;
export type NewBasin = Insertable<BasinsTable>;
export type BasinUpdate = Updateable<BasinsTable>;
export type FacilityRow = Selectable<FacilitiesTable>;

export type AccountTokenKind = "verify" | "reset";
type Moment = ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;

/** Single-use e-mail links (verification, password reset); only the SHA-256 of the token is stored. */
export interface AccountTokensTable {
  id: Generated<string>;
  user_id: string;
  kind: AccountTokenKind;
  token_hash: string;
  expires_at: ColumnType<Date, Date | string, Date | string>;
  used_at: Moment;
  created_at: CreatedAt;
}

/** A lead's invitation of an e-mail address into a basin with a role (dischargers: one facility). */
export interface InvitationsTable {
  id: Generated<string>;
  basin_id: string;
  email: string;
  role: BasinRole;
  facility_id: string | null;
  invited_by: string | null;
  token_hash: string;
  expires_at: ColumnType<Date, Date | string, Date | string>;
  accepted_at: Moment;
  accepted_by: ColumnType<string | null, string | null | undefined, string | null>;
  revoked_at: Moment;
  created_at: CreatedAt;
}

/** Someone who asked for a basin's notices (review opened or closing, plan published). */
export interface BasinFollowsTable {
  basin_id: string;
  user_id: string;
  created_at: CreatedAt;
}
