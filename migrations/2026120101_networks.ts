import { sql, type Kysely } from "kysely";

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  // Every uploaded file is kept (bytes, hash, who, when) so a plan can be traced to its inputs.
  await db.schema
    .createTable("imports")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("basin_id", "uuid", (c) => c.notNull().references("basins.id").onDelete("cascade"))
    .addColumn("layer", "text", (c) => c.notNull())
    .addColumn("format", "text", (c) => c.notNull())
    .addColumn("file_name", "text", (c) => c.notNull())
    .addColumn("size_bytes", "integer", (c) => c.notNull())
    .addColumn("sha256", "text", (c) => c.notNull())
    .addColumn("content", "bytea", (c) => c.notNull())
    .addColumn("crs", "jsonb", (c) => c.notNull())
    .addColumn("read_options", "jsonb", (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn("feature_count", "integer", (c) => c.notNull())
    .addColumn("fields", "jsonb", (c) => c.notNull())
    .addColumn("status", "text", (c) => c.notNull().defaultTo("uploaded"))
    .addColumn("uploaded_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("uploaded_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint("imports_layer", sql`layer in ('reaches', 'dischargers')`)
    .addCheckConstraint("imports_format", sql`format in ('shapefile', 'geojson', 'csv')`)
    .addCheckConstraint("imports_status", sql`status in ('uploaded', 'committed')`)
    .addCheckConstraint("imports_sha256", sql`sha256 ~ '^[0-9a-f]{64}$'`)
    .execute();
  await db.schema.createIndex("imports_basin_idx").on("imports").columns(["basin_id", "uploaded_at"]).execute();

  await db.schema
    .createTable("field_mappings")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("basin_id", "uuid", (c) => c.notNull().references("basins.id").onDelete("cascade"))
    .addColumn("layer", "text", (c) => c.notNull())
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("mapping", "jsonb", (c) => c.notNull())
    .addColumn("created_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint("field_mappings_name_key", ["basin_id", "layer", "name"])
    .addCheckConstraint("field_mappings_layer", sql`layer in ('reaches', 'dischargers')`)
    .execute();

  await db.schema
    .createTable("networks")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("basin_id", "uuid", (c) => c.notNull().references("basins.id").onDelete("cascade"))
    .addColumn("version", "integer", (c) => c.notNull())
    .addColumn("reach_import_id", "uuid", (c) => c.notNull().references("imports.id"))
    .addColumn("discharger_import_id", "uuid", (c) => c.references("imports.id"))
    .addColumn("reach_mapping", "jsonb", (c) => c.notNull())
    .addColumn("discharger_mapping", "jsonb")
    .addColumn("options", "jsonb", (c) => c.notNull())
    .addColumn("report", "jsonb", (c) => c.notNull())
    .addColumn("total_length_km", sql`numeric(12, 4)`, (c) => c.notNull())
    .addColumn("note", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("created_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint("networks_basin_version_key", ["basin_id", "version"])
    .execute();

  await db.schema
    .createTable("network_nodes")
    .addColumn("network_id", "uuid", (c) => c.notNull().references("networks.id").onDelete("cascade"))
    .addColumn("node_key", "text", (c) => c.notNull())
    .addColumn("kind", "text", (c) => c.notNull())
    .addColumn("lon", "double precision", (c) => c.notNull())
    .addColumn("lat", "double precision", (c) => c.notNull())
    .addPrimaryKeyConstraint("network_nodes_pkey", ["network_id", "node_key"])
    .execute();

  await db.schema
    .createTable("reaches")
    .addColumn("network_id", "uuid", (c) => c.notNull().references("networks.id").onDelete("cascade"))
    .addColumn("reach_key", "text", (c) => c.notNull())
    .addColumn("name", "text")
    .addColumn("downstream_key", "text")
    .addColumn("upstream_node", "text", (c) => c.notNull())
    .addColumn("downstream_node", "text", (c) => c.notNull())
    .addColumn("part", "integer", (c) => c.notNull())
    .addColumn("flipped", "boolean", (c) => c.notNull())
    .addColumn("geometry_length_km", "double precision", (c) => c.notNull())
    .addColumn("length_km", "double precision", (c) => c.notNull())
    .addColumn("coordinates", "jsonb", (c) => c.notNull())
    .addColumn("attributes", "jsonb", (c) => c.notNull())
    .addColumn("source_index", "integer", (c) => c.notNull())
    .addPrimaryKeyConstraint("reaches_pkey", ["network_id", "reach_key"])
    .addCheckConstraint("reaches_length_positive", sql`length_km > 0`)
    .execute();

  await db.schema
    .createTable("outfalls")
    .addColumn("network_id", "uuid", (c) => c.notNull().references("networks.id").onDelete("cascade"))
    .addColumn("facility_id", "uuid", (c) => c.notNull().references("facilities.id"))
    .addColumn("reach_key", "text", (c) => c.notNull())
    .addColumn("chainage_km", "double precision", (c) => c.notNull())
    .addColumn("snap_distance_m", "double precision", (c) => c.notNull())
    .addColumn("assignment", "text", (c) => c.notNull())
    .addColumn("lon", "double precision", (c) => c.notNull())
    .addColumn("lat", "double precision", (c) => c.notNull())
    .addColumn("snapped_lon", "double precision", (c) => c.notNull())
    .addColumn("snapped_lat", "double precision", (c) => c.notNull())
    .addColumn("attributes", "jsonb", (c) => c.notNull())
    .addColumn("source_index", "integer", (c) => c.notNull())
    .addPrimaryKeyConstraint("outfalls_pkey", ["network_id", "facility_id"])
    .addForeignKeyConstraint("outfalls_reach_fkey", ["network_id", "reach_key"], "reaches", ["network_id", "reach_key"])
    .execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  for (const table of ["outfalls", "reaches", "network_nodes", "networks", "field_mappings", "imports"]) {
    await db.schema.dropTable(table).execute();
  }
}
