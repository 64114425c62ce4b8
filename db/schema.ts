import type { ColumnType, Generated, Insertable, Selectable, Updateable } from "kysely";

/** Timestamps: read as Date, written as Date or ISO string, defaulted by the database. */
type CreatedAt = ColumnType<Date, Date | string | undefined, never>;
type UpdatedAt = ColumnType<Date, Date | string | undefined, Date | string>;

export type UnitSystem = "SI" | "US";
export type BasinRole = "lead" | "planner" | "discharger" | "stakeholder";

export interface UsersTable {
  id: Generated<string>;
  email: string;
  name: string;
  password_hash: string;
  is_admin: Generated<boolean>;
  created_at: CreatedAt;
  updated_at: UpdatedAt;
}

export interface BasinsTable {
  id: Generated<string>;
  slug: string;
  name: string;
  description: Generated<string>;
  /** DO criterion, mg/L (NUMERIC parsed to number by db/client.ts). */
  do_criterion_mg_l: ColumnType<number, number | undefined, number>;
  unit_system: ColumnType<UnitSystem, UnitSystem | undefined, UnitSystem>;
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

export interface Database {
  users: UsersTable;
  basins: BasinsTable;
  memberships: MembershipsTable;
  facilities: FacilitiesTable;
  facility_users: FacilityUsersTable;
  audit_events: AuditEventsTable;
}

export type UserRow = Selectable<UsersTable>;
export type NewUser = Insertable<UsersTable>;
export type BasinRow = Selectable<BasinsTable>;
export type NewBasin = Insertable<BasinsTable>;
export type BasinUpdate = Updateable<BasinsTable>;
export type FacilityRow = Selectable<FacilitiesTable>;
