import { sql } from "kysely";
import type { Db } from "../client";
import type { Insertable } from "kysely";
import type { NetworkNodesTable, OutfallsTable, ReachesTable } from "../schema";
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
    report: unknown;
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
      report: JSON.stringify(v.report),
      total_length_km: v.totalLengthKm,
      note: v.note,
      created_by: v.createdBy,
    })
    .returningAll()
    .executeTakeFirstOrThrow();
}

/** Insert rows in chunks (PostgreSQL caps a statement at 65 535 parameters). */
async function insertChunked<T>(rows: T[], size: number, insert: (chunk: T[]) => Promise<unknown>): Promise<void> {
  for (let i = 0; i < rows.length; i += size) await insert(rows.slice(i, i + size));
}

export const insertNodes = (db: Db, rows: Insertable<NetworkNodesTable>[]) =>
  insertChunked(rows, 2000, (c) => db.insertInto("network_nodes").values(c).execute());
export const insertReaches = (db: Db, rows: Insertable<ReachesTable>[]) =>
  insertChunked(rows, 1000, (c) => db.insertInto("reaches").values(c).execute());
export const insertOutfalls = (db: Db, rows: Insertable<OutfallsTable>[]) =>
  insertChunked(rows, 1000, (c) => db.insertInto("outfalls").values(c).execute());

export async function listNetworks(db: Db, basinId: string) {
  return db
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
    .orderBy("n.version", "desc")
    .execute();
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

/** Facility ids of a basin by permit id, for the given permits (one query per 5 000). */
export async function facilityIdsByPermit(db: Db, basinId: string, permits: readonly string[]): Promise<Map<string, string>> {
  const out = new Map<string, string>();
  for (let i = 0; i < permits.length; i += 5000) {
    const rows = await db
      .selectFrom("facilities")
      .select(["id", "permit_id"])
      .where("basin_id", "=", basinId)
      .where(sql<boolean>`permit_id = any(${permits.slice(i, i + 5000)}::text[])`)
      .execute();
    for (const r of rows) out.set(r.permit_id, r.id);
  }
  return out;
}

/** New facilities (name, permit id) of a basin in chunks; returns their ids by permit id. */
export async function insertFacilitiesByPermit(db: Db, basinId: string, rows: ReadonlyArray<{ name: string; permitId: string }>): Promise<Map<string, string>> {
  const out = new Map<string, string>();
  await insertChunked([...rows], 2000, async (c) => {
    const made = await db
      .insertInto("facilities")
      .values(c.map((r) => ({ basin_id: basinId, name: r.name, permit_id: r.permitId })))
      .returning(["id", "permit_id"])
      .execute();
    for (const m of made) out.set(m.permit_id, m.id);
  });
  return out;
}
