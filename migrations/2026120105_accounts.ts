import { sql, type Kysely } from "kysely";

// Accounts for the public: e-mail verification, password reset, invitations
// sent by basin leads, and following a basin for its notices.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable("users").addColumn("email_verified_at", "timestamptz").execute();
  // Every account that exists before self-registration was made by an
  // administrator or the seed: those addresses count as confirmed.
  await sql`update users set email_verified_at = now()`.execute(db);

  // Single-use links sent by e-mail; only a SHA-256 hash of the token is kept.
  await db.schema
    .createTable("account_tokens")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("user_id", "uuid", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("kind", "text", (c) => c.notNull())
    .addColumn("token_hash", "text", (c) => c.notNull().unique())
    .addColumn("expires_at", "timestamptz", (c) => c.notNull())
    .addColumn("used_at", "timestamptz")
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint("account_tokens_kind", sql`kind in ('verify', 'reset')`)
    .execute();
  await db.schema.createIndex("account_tokens_user_idx").on("account_tokens").columns(["user_id", "kind"]).execute();

  await db.schema
    .createTable("invitations")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("basin_id", "uuid", (c) => c.notNull().references("basins.id").onDelete("cascade"))
    .addColumn("email", "text", (c) => c.notNull())
    .addColumn("role", "text", (c) => c.notNull())
    // a facility that goes away takes its pending discharger invitations with it
    .addColumn("facility_id", "uuid", (c) => c.references("facilities.id").onDelete("cascade"))
    .addColumn("invited_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("token_hash", "text", (c) => c.notNull().unique())
    .addColumn("expires_at", "timestamptz", (c) => c.notNull())
    .addColumn("accepted_at", "timestamptz")
    .addColumn("accepted_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("revoked_at", "timestamptz")
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint("invitations_email_lower", sql`email = lower(email)`)
    .addCheckConstraint("invitations_role", sql`role in ('lead', 'planner', 'discharger', 'stakeholder')`)
    // a discharger invitation names exactly one facility; no other role names one
    .addCheckConstraint("invitations_facility_role", sql`(role = 'discharger') = (facility_id is not null)`)
    .addCheckConstraint("invitations_one_outcome", sql`accepted_at is null or revoked_at is null`)
    .execute();
  await db.schema.createIndex("invitations_basin_idx").on("invitations").columns(["basin_id", "created_at"]).execute();

  await db.schema
    .createTable("basin_follows")
    .addColumn("basin_id", "uuid", (c) => c.notNull().references("basins.id").onDelete("cascade"))
    .addColumn("user_id", "uuid", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("basin_follows_pkey", ["basin_id", "user_id"])
    .execute();
  await db.schema.createIndex("basin_follows_user_idx").on("basin_follows").column("user_id").execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("basin_follows").execute();
  await db.schema.dropTable("invitations").execute();
  await db.schema.dropTable("account_tokens").execute();
  await db.schema.alterTable("users").dropColumn("email_verified_at").execute();
}
