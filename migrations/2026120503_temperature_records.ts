import { sql, type Kysely } from "kysely";

// Daily water-temperature records of a basin: the original file (with its SHA-256), the unit
// it was read in, and the daily means in °C, from which a condition's design temperature is
// worked out by a stated rule when a scenario is saved (lib/hydrology/design-temperature.ts).

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("temperature_records")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("basin_id", "uuid", (c) => c.notNull().references("basins.id").onDelete("cascade"))
    .addColumn("name", "text", (c) => c.notNull().check(sql`length(name) between 1 and 120`))
    .addColumn("station_code", "text", (c) => c.check(sql`length(station_code) between 1 and 40`))
    .addColumn("reach_key", "text", (c) => c.check(sql`length(reach_key) between 1 and 100`))
    .addColumn("unit", "text", (c) => c.notNull().check(sql`unit in ('C', 'F')`))
    .addColumn("file_name", "text", (c) => c.notNull())
    .addColumn("size_bytes", "integer", (c) => c.notNull())
    .addColumn("sha256", "text", (c) => c.notNull().check(sql`sha256 ~ '^[0-9a-f]{64}$'`))
    .addColumn("content", "bytea", (c) => c.notNull())
    .addColumn("first_day", "date", (c) => c.notNull())
    .addColumn("last_day", "date", (c) => c.notNull())
    .addColumn("day_count", "integer", (c) => c.notNull())
    .addColumn("missing_days", "integer", (c) => c.notNull())
    .addColumn("days", "jsonb", (c) => c.notNull())
    .addColumn("uploaded_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("uploaded_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex("temperature_records_basin_idx").on("temperature_records").columns(["basin_id", "uploaded_at"]).execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("temperature_records").execute();
}
