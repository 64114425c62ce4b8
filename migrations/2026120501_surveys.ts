import { sql, type Kysely } from "kysely";

// Synoptic surveys of a basin: the original file (with its SHA-256), the units it was read
// in, the network version its stations were placed on, and every sample as placed (reach,
// km, snap distance) with its values in Sagline's units (lib/survey/). A basin keeps several.

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("surveys")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("basin_id", "uuid", (c) => c.notNull().references("basins.id").onDelete("cascade"))
    .addColumn("network_id", "uuid", (c) => c.notNull().references("networks.id"))
    .addColumn("name", "text", (c) => c.notNull().check(sql`length(name) between 1 and 120`))
    .addColumn("units", "jsonb", (c) => c.notNull())
    .addColumn("file_name", "text", (c) => c.notNull())
    .addColumn("size_bytes", "integer", (c) => c.notNull())
    .addColumn("sha256", "text", (c) => c.notNull().check(sql`sha256 ~ '^[0-9a-f]{64}$'`))
    .addColumn("content", "bytea", (c) => c.notNull())
    .addColumn("first_time", "text")
    .addColumn("last_time", "text")
    .addColumn("station_count", "integer", (c) => c.notNull())
    .addColumn("sample_count", "integer", (c) => c.notNull())
    .addColumn("samples", "jsonb", (c) => c.notNull())
    .addColumn("uploaded_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("uploaded_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex("surveys_basin_idx").on("surveys").columns(["basin_id", "uploaded_at"]).execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("surveys").execute();
}
