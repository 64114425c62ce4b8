import { sql, type Kysely } from "kysely";

// Plan versions count within a lineage: a plan that revises an earlier one takes the
// next version of that plan's lineage; a plan that starts afresh is version 1 of a
// lineage of its own (lineage_id = its own id). Plans made before this migration were
// numbered across their basin as one sequence, so each basin's existing plans become
// one lineage, named after its first plan, and keep their numbers.

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable("plans").addColumn("lineage_id", "uuid").execute();
  await sql`
    update plans p set lineage_id = first.id
    from (select distinct on (basin_id) basin_id, id from plans order by basin_id, version) first
    where first.basin_id = p.basin_id`.execute(db);
  await db.schema.alterTable("plans").alterColumn("lineage_id", (c) => c.setNotNull()).execute();
  await db.schema.alterTable("plans").dropConstraint("plans_basin_version_key").execute();
  await db.schema.alterTable("plans").addUniqueConstraint("plans_lineage_version_key", ["lineage_id", "version"]).execute();
  await db.schema.createIndex("plans_basin_lineage_idx").on("plans").columns(["basin_id", "lineage_id"]).execute();
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropIndex("plans_basin_lineage_idx").execute();
  await db.schema.alterTable("plans").dropConstraint("plans_lineage_version_key").execute();
  // versions may now repeat within a basin; renumber by creation before restoring the basin-wide key
  await sql`
    update plans p set version = n.v
    from (select id, row_number() over (partition by basin_id order by created_at, id) as v from plans) n
    where n.id = p.id`.execute(db);
  await db.schema.alterTable("plans").addUniqueConstraint("plans_basin_version_key", ["basin_id", "version"]).execute();
  await db.schema.alterTable("plans").dropColumn("lineage_id").execute();
}
