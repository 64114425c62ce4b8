import { sql, type Kysely } from "kysely";

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("scenarios")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("basin_id", "uuid", (c) => c.notNull().references("basins.id").onDelete("cascade"))
    .addColumn("network_id", "uuid", (c) => c.notNull().references("networks.id"))
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("description", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("inputs", "jsonb", (c) => c.notNull())
    // optimistic locking: every save must name the version it started from
    .addColumn("version", "integer", (c) => c.notNull().defaultTo(1))
    .addColumn("created_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("updated_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("updated_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint("scenarios_basin_name_key", ["basin_id", "name"])
    .execute();

  await db.schema
    .createTable("runs")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("basin_id", "uuid", (c) => c.notNull().references("basins.id").onDelete("cascade"))
    .addColumn("scenario_id", "uuid", (c) => c.notNull().references("scenarios.id"))
    .addColumn("scenario_version", "integer", (c) => c.notNull())
    .addColumn("kind", "text", (c) => c.notNull())
    .addColumn("status", "text", (c) => c.notNull().defaultTo("queued"))
    .addColumn("progress", "real", (c) => c.notNull().defaultTo(0))
    .addColumn("error", "text")
    .addColumn("inputs_hash", "text", (c) => c.notNull())
    .addColumn("model_file", "jsonb", (c) => c.notNull())
    .addColumn("model_version", "text", (c) => c.notNull())
    .addColumn("methods", "jsonb", (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn("result", "jsonb")
    .addColumn("created_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("started_at", "timestamptz")
    .addColumn("finished_at", "timestamptz")
    .addCheckConstraint("runs_kind", sql`kind in ('model', 'allocation')`)
    .addCheckConstraint("runs_status", sql`status in ('queued', 'running', 'done', 'failed')`)
    .addCheckConstraint("runs_progress", sql`progress >= 0 and progress <= 1`)
    .execute();
  await db.schema.createIndex("runs_scenario_idx").on("runs").columns(["scenario_id", "created_at"]).execute();
  await db.schema.createIndex("runs_reuse_idx").on("runs").columns(["basin_id", "kind", "inputs_hash"]).execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("runs").execute();
  await db.schema.dropTable("scenarios").execute();
}
