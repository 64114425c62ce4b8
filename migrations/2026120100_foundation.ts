import { sql, type Kysely } from "kysely";

// Typed Kysely<any> on purpose: a migration must never import today's app types.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("users")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("email", "text", (c) => c.notNull())
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("password_hash", "text", (c) => c.notNull())
    .addColumn("is_admin", "boolean", (c) => c.notNull().defaultTo(false))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("updated_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint("users_email_lower", sql`email = lower(email)`)
    .execute();
  await db.schema.createIndex("users_email_key").on("users").column("email").unique().execute();

  await db.schema
    .createTable("basins")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("slug", "text", (c) => c.notNull().unique())
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("description", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("do_criterion_mg_l", sql`numeric(6, 3)`, (c) => c.notNull().defaultTo(5))
    .addColumn("unit_system", "text", (c) => c.notNull().defaultTo("SI"))
    .addColumn("created_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("updated_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint("basins_unit_system", sql`unit_system in ('SI', 'US')`)
    .addCheckConstraint("basins_criterion_range", sql`do_criterion_mg_l > 0 and do_criterion_mg_l < 20`)
    .addCheckConstraint("basins_slug_format", sql`slug ~ '^[a-z0-9]+(-[a-z0-9]+)*$'`)
    .execute();

  await db.schema
    .createTable("memberships")
    .addColumn("basin_id", "uuid", (c) => c.notNull().references("basins.id").onDelete("cascade"))
    .addColumn("user_id", "uuid", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("role", "text", (c) => c.notNull())
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("memberships_pkey", ["basin_id", "user_id"])
    .addCheckConstraint("memberships_role", sql`role in ('lead', 'planner', 'discharger', 'stakeholder')`)
    .execute();
  await db.schema.createIndex("memberships_user_idx").on("memberships").column("user_id").execute();

  await db.schema
    .createTable("facilities")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("basin_id", "uuid", (c) => c.notNull().references("basins.id").onDelete("cascade"))
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("permit_id", "text", (c) => c.notNull())
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint("facilities_basin_permit_key", ["basin_id", "permit_id"])
    .execute();

  await db.schema
    .createTable("facility_users")
    .addColumn("facility_id", "uuid", (c) => c.notNull().references("facilities.id").onDelete("cascade"))
    .addColumn("user_id", "uuid", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("facility_users_pkey", ["facility_id", "user_id"])
    .execute();

  await db.schema
    .createTable("audit_events")
    .addColumn("id", "bigserial", (c) => c.primaryKey())
    .addColumn("basin_id", "uuid", (c) => c.references("basins.id").onDelete("cascade"))
    .addColumn("actor_id", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("action", "text", (c) => c.notNull())
    .addColumn("target_type", "text", (c) => c.notNull())
    .addColumn("target_id", "text")
    .addColumn("details", "jsonb", (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex("audit_events_basin_idx").on("audit_events").columns(["basin_id", "created_at"]).execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  for (const table of ["audit_events", "facility_users", "facilities", "memberships", "basins", "users"]) {
    await db.schema.dropTable(table).execute();
  }
}
