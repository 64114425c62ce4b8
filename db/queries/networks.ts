import { sql } from "kysely";
import type { Db } from "../client";
import { isUuid } from "./users";

/** The next version number of a basin's network; locks the basin row until the transaction ends. */
export async function nextNetworkVersion(db: Db, basinId: string): Promise<number> {
  await sql`select id from basins where id = ${basinId} for update`.execute(db);
  const row = await db
    .selectFrom("networks")
    .select((eb) => eb.fn.max("version").as("v"))
    .where("basin_id", "=", basinId)
    .executeTakeFirst();
  return Number(row?.v ?? 0) + 1;
}

export async function insertNetwork(
  db: Db,
  v: {
    basinId: string;
    version: number;
    reachImportId: string;
    dischargerImportId: string | null;
    reachMapping: unknown;
    dischargerMapping: unknown;
    options: unknown;
    /** The validation report kept with the network, already JSON text (built in the import worker). */
    reportJson: string;
    totalLengthKm: number;
    note: string;
    createdBy: string;
  },
) {
  return db
    .insertInto("networks")
    .values({
      basin_id: v.basinId,
      version: v.version,
      reach_import_id: v.reachImportId,
      discharger_import_id: v.dischargerImportId,
      reach_mapping: JSON.stringify(v.reachMapping),
      discharger_mapping: JSON.stringify(v.dischargerMapping ?? null),
      options: JSON.stringify(v.options),
      report: v.reportJson,
      total_length_km: v.totalLengthKm,
      note: v.note,
      created_by: v.createdBy,
    })
    // not the report: a large network's warnings would be parsed back for nothing
    .returning(["id", "total_length_km", "note", "created_at"])
    .executeTakeFirstOrThrow();
}



/** A basin's network versions with their size and who saved each, newest first. */
export const networkSummaries = (db: Db, basinId: string) =>
  db
    .selectFrom("networks as n")
    .leftJoin("users as u", "u.id", "n.created_by")
    .select([
      "n.id",
      "n.version",
      "n.total_length_km",
      "n.note",
      "n.created_at",
      "u.name as created_by_name",
      (eb) => eb.selectFrom("reaches as r").whereRef("r.network_id", "=", "n.id").select((e) => e.fn.countAll<string>().as("c")).as("reach_count"),
      (eb) =>
        eb.selectFrom("outfalls as o").whereRef("o.network_id", "=", "n.id").select((e) => e.fn.countAll<string>().as("c")).as("outfall_count"),
    ])
    .where("n.basin_id", "=", basinId)
    .orderBy("n.version", "desc");

export async function listNetworks(db: Db, basinId: string) {
  return networkSummaries(db, basinId).execute();
}

export async function findNetwork(db: Db, basinId: string, networkId: string) {
  if (!isUuid(networkId)) return undefined;
  return db
    .selectFrom("networks as n")
    .leftJoin("users as u", "u.id", "n.created_by")
    .selectAll("n")
    .select("u.name as created_by_name")
    .where("n.basin_id", "=", basinId)
    .where("n.id", "=", networkId)
    .executeTakeFirst();
}

export async function latestNetworkId(db: Db, basinId: string): Promise<string | undefined> {
  const row = await db
    .selectFrom("networks")
    .select("id")
    .where("basin_id", "=", basinId)
    .orderBy("version", "desc")
    .limit(1)
    .executeTakeFirst();
  return row?.id;
}

export const networkNodes = (db: Db, networkId: string) =>
  db.selectFrom("network_nodes").selectAll().where("network_id", "=", networkId).orderBy("node_key").execute();

export const networkReaches = (db: Db, networkId: string) =>
  db.selectFrom("reaches").selectAll().where("network_id", "=", networkId).orderBy("reach_key").execute();

export const networkOutfalls = (db: Db, networkId: string) =>
  db
    .selectFrom("outfalls as o")
    .innerJoin("facilities as f", "f.id", "o.facility_id")
    .selectAll("o")
    .select(["f.name as facility_name", "f.permit_id"])
    .where("o.network_id", "=", networkId)
    .orderBy("f.name")
    .execute();

/** A network version's reach lines with their lengths, for placing survey stations (lib/survey/place-stations.ts). */
export async function reachLines(db: Db, networkId: string) {
  return db.selectFrom("reaches").select(["reach_key", "coordinates", "geometry_length_km", "length_km"]).where("network_id", "=", networkId).orderBy("reach_key").execute();
}

/** A network version's reach ids, in order (no geometry). */
export async function reachKeys(db: Db, networkId: string): Promise<string[]> {
  return (await db.selectFrom("reaches").select("reach_key").where("network_id", "=", networkId).orderBy("reach_key").execute()).map((r) => r.reach_key);
}

export async function findReach(db: Db, networkId: string, reachKey: string) {
  return db.selectFrom("reaches").selectAll().where("network_id", "=", networkId).where("reach_key", "=", reachKey).executeTakeFirst();
}

export async function updateReach(
  db: Db,
  networkId: string,
  reachKey: string,
  patch: { name?: string | null; length_km?: number; attributes: Record<string, unknown> },
): Promise<void> {
  await db
    .updateTable("reaches")
    .set({ ...patch, attributes: JSON.stringify(patch.attributes) })
    .where("network_id", "=", networkId)
    .where("reach_key", "=", reachKey)
    .execute();
}

export async function findOutfall(db: Db, networkId: string, facilityId: string) {
  if (!isUuid(facilityId)) return undefined;
  return db.selectFrom("outfalls").selectAll().where("network_id", "=", networkId).where("facility_id", "=", facilityId).executeTakeFirst();
}

export async function updateOutfallAttributes(db: Db, networkId: string, facilityId: string, attributes: Record<string, unknown>) {
  await db
    .updateTable("outfalls")
    .set({ attributes: JSON.stringify(attributes) })
    .where("network_id", "=", networkId)
    .where("facility_id", "=", facilityId)
    .execute();
}

/** Lock a network version's row until the transaction ends (serialises edits to it). */
export async function lockNetwork(db: Db, networkId: string): Promise<void> {
  await sql`select id from networks where id = ${networkId} for update`.execute(db);
}

/**
 * Of the permit ids in `permitsJson` (a JSON array of strings, in order), those that name a
 * facility of the basin, as a JSON array in the same order. Text in, text out: tens of
 * thousands of permits are matched by PostgreSQL, not escaped and collected on the event loop.
 */
export async function knownPermitsJson(db: Db, basinId: string, permitsJson: string): Promise<string> {
  const { rows } = await sql<{ known: string }>`
    select coalesce(json_agg(t.permit order by t.ord), '[]')::text as known
    from jsonb_array_elements_text(${permitsJson}::jsonb) with ordinality as t(permit, ord)
    where exists (select 1 from facilities f where f.basin_id = ${basinId} and f.permit_id = t.permit)`.execute(db);
  return rows[0].known;
}

/*
 * Bulk inserts from JSON text made in the import worker: PostgreSQL unpacks the rows
 * (jsonb_to_recordset), so the web server only passes one string per chunk instead of
 * compiling and serialising tens of thousands of parameters on its event loop.
 */

/** Nodes: [{ node_key, kind, lon, lat }]. */
export async function insertNodesJson(db: Db, networkId: string, rows: string): Promise<void> {
  await sql`insert into network_nodes (network_id, node_key, kind, lon, lat)
    select ${networkId}, r.node_key, r.kind, r.lon, r.lat
    from jsonb_to_recordset(${rows}::jsonb) as r(node_key text, kind text, lon double precision, lat double precision)`.execute(db);
}

/** Reaches: [{ reach_key, name, downstream_key, upstream_node, downstream_node, part, flipped, geometry_length_km, length_km, coordinates, attributes, source_index }]. */
export async function insertReachesJson(db: Db, networkId: string, rows: string): Promise<void> {
  await sql`insert into reaches (network_id, reach_key, name, downstream_key, upstream_node, downstream_node, part, flipped,
      geometry_length_km, length_km, coordinates, attributes, source_index)
    select ${networkId}, r.reach_key, r.name, r.downstream_key, r.upstream_node, r.downstream_node, r.part, r.flipped,
      r.geometry_length_km, r.length_km, r.coordinates, r.attributes, r.source_index
    from jsonb_to_recordset(${rows}::jsonb) as r(reach_key text, name text, downstream_key text, upstream_node text, downstream_node text,
      part integer, flipped boolean, geometry_length_km double precision, length_km double precision, coordinates jsonb, attributes jsonb,
      source_index integer)`.execute(db);
}

/** Facilities for permits the basin does not have yet: [{ name, permit_id }]; existing permits keep their facility. */
export async function insertMissingFacilitiesJson(db: Db, basinId: string, rows: string): Promise<void> {
  await sql`insert into facilities (basin_id, name, permit_id)
    select ${basinId}, r.name, r.permit_id from jsonb_to_recordset(${rows}::jsonb) as r(name text, permit_id text)
    on conflict (basin_id, permit_id) do nothing`.execute(db);
}

/** Outfalls, each joined to the basin's facility by permit id: [{ permit_id, reach_key, chainage_km, … }]. Returns the rows written. */
export async function insertOutfallsJson(db: Db, networkId: string, basinId: string, rows: string): Promise<number> {
  const res = await sql`insert into outfalls (network_id, facility_id, reach_key, chainage_km, snap_distance_m, assignment, lon, lat,
      snapped_lon, snapped_lat, attributes, source_index)
    select ${networkId}, f.id, r.reach_key, r.chainage_km, r.snap_distance_m, r.assignment, r.lon, r.lat, r.snapped_lon, r.snapped_lat,
      r.attributes, r.source_index
    from jsonb_to_recordset(${rows}::jsonb) as r(permit_id text, reach_key text, chainage_km double precision, snap_distance_m double precision,
      assignment text, lon double precision, lat double precision, snapped_lon double precision, snapped_lat double precision,
      attributes jsonb, source_index integer)
    join facilities f on f.basin_id = ${basinId} and f.permit_id = r.permit_id`.execute(db);
  return Number(res.numAffectedRows ?? 0);
}
