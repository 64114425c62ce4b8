import type { Db } from "../client";
import type { BasinRole, BasinRow, BasinUpdate, NewBasin } from "../schema";
import { isUuid } from "./users";

export type BasinRecord = BasinRow;

export async function findBasinById(db: Db, id: string): Promise<BasinRecord | undefined> {
  if (!isUuid(id)) return undefined;
  return db.selectFrom("basins").selectAll().where("id", "=", id).executeTakeFirst();
}

export async function findBasinBySlug(db: Db, slug: string): Promise<BasinRecord | undefined> {
  return db.selectFrom("basins").selectAll().where("slug", "=", slug).executeTakeFirst();
}

export interface BasinWithRole extends BasinRecord {
  role: BasinRole | null;
  member_count: number;
}

/** Basins a user belongs to (or every basin, for a site admin), with the user's role. */
export async function listBasinsForUser(db: Db, userId: string, all: boolean): Promise<BasinWithRole[]> {
  let query = db
    .selectFrom("basins")
    .leftJoin("memberships as m", (join) => join.onRef("m.basin_id", "=", "basins.id").on("m.user_id", "=", userId))
    .selectAll("basins")
    .select("m.role")
    .select((eb) =>
      eb
        .selectFrom("memberships as mc")
        .whereRef("mc.basin_id", "=", "basins.id")
        .select((e) => e.fn.countAll<string>().as("n"))
        .as("member_count"),
    )
    .orderBy("basins.name");
  if (!all) query = query.where("m.user_id", "is not", null);
  const rows = await query.execute();
  return rows.map((r) => ({ ...r, role: r.role ?? null, member_count: Number(r.member_count ?? 0) }));
}

export async function insertBasin(db: Db, basin: NewBasin): Promise<BasinRecord> {
  return db.insertInto("basins").values(basin).returningAll().executeTakeFirstOrThrow();
}

export async function updateBasin(db: Db, id: string, patch: BasinUpdate): Promise<BasinRecord | undefined> {
  return db
    .updateTable("basins")
    .set({ ...patch, updated_at: new Date() })
    .where("id", "=", id)
    .returningAll()
    .executeTakeFirst();
}

/** A basin and one user's role in it, in one round trip (the guard's hot path). */
export async function findBasinWithRole(db: Db, basinId: string, userId: string): Promise<{ basin: BasinRecord; role: BasinRole | null } | undefined> {
  if (!isUuid(basinId)) return undefined;
  const row = await db
    .selectFrom("basins")
    .leftJoin("memberships as m", (join) => join.onRef("m.basin_id", "=", "basins.id").on("m.user_id", "=", userId))
    .selectAll("basins")
    .select("m.role")
    .where("basins.id", "=", basinId)
    .executeTakeFirst();
  if (!row) return undefined;
  const { role, ...basin } = row;
  return { basin, role: role ?? null };
}

/** Lock a basin's row to the end of the transaction: serialises changes to its membership. */
export async function lockBasin(db: Db, basinId: string): Promise<void> {
  await db.selectFrom("basins").select("id").where("id", "=", basinId).forUpdate().executeTakeFirst();
}

/** Give a basin a time zone unless it has one (the first review's zone becomes the basin's). */
export async function setBasinTimeZoneIfUnset(db: Db, basinId: string, timeZone: string): Promise<void> {
  await db.updateTable("basins").set({ time_zone: timeZone }).where("id", "=", basinId).where("time_zone", "is", null).execute();
}

/**
 * A signed-in request's account and, when `basinId` names a basin, that basin and the
 * account's role in it, in one round trip (route()'s hot path for basin routes). `user`
 * is undefined when the account is gone; `basin` is undefined when the basin is.
 */
export async function findUserInBasin(
  db: Db,
  userId: string,
  basinId: string,
): Promise<{ user: { id: string; email: string; name: string; is_admin: boolean; session_version: number } | undefined; basin: BasinRecord | undefined; role: BasinRole | null }> {
  if (!isUuid(userId)) return { user: undefined, basin: undefined, role: null };
  if (!isUuid(basinId)) return { user: await findUserFields(db, userId), basin: undefined, role: null };
  const row = await db
    .selectFrom("users as u")
    .leftJoin("basins", (join) => join.on("basins.id", "=", basinId))
    .leftJoin("memberships as m", (join) => join.onRef("m.basin_id", "=", "basins.id").onRef("m.user_id", "=", "u.id"))
    .selectAll("basins")
    .select(["m.role", "u.id as u_id", "u.email as u_email", "u.name as u_name", "u.is_admin as u_is_admin", "u.session_version as u_session_version"])
    .where("u.id", "=", userId)
    .executeTakeFirst();
  if (!row) return { user: undefined, basin: undefined, role: null };
  const { role, u_id, u_email, u_name, u_is_admin, u_session_version, ...basin } = row;
  const user = { id: u_id, email: u_email, name: u_name, is_admin: u_is_admin, session_version: u_session_version };
  return basin.id === null ? { user, basin: undefined, role: null } : { user, basin: basin as BasinRecord, role: role ?? null };
}

function findUserFields(db: Db, userId: string) {
  return db.selectFrom("users").select(["id", "email", "name", "is_admin", "session_version"]).where("id", "=", userId).executeTakeFirst();
}
