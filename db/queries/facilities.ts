import type { Db } from "../client";
import type { FacilityRow } from "../schema";
import { isUuid } from "./users";

export interface FacilityWithUsers extends FacilityRow {
  users: { id: string; name: string; email: string }[];
}

export async function listFacilities(db: Db, basinId: string): Promise<FacilityWithUsers[]> {
  const facilities = await db
    .selectFrom("facilities")
    .selectAll()
    .where("basin_id", "=", basinId)
    .orderBy("name")
    .execute();
  if (facilities.length === 0) return [];
  const links = await db
    .selectFrom("facility_users as fu")
    .innerJoin("users as u", "u.id", "fu.user_id")
    .select(["fu.facility_id", "u.id", "u.name", "u.email"])
    .where(
      "fu.facility_id",
      "in",
      facilities.map((f) => f.id),
    )
    .orderBy("u.name")
    .execute();
  return facilities.map((f) => ({
    ...f,
    users: links.filter((l) => l.facility_id === f.id).map(({ id, name, email }) => ({ id, name, email })),
  }));
}

export async function findFacility(db: Db, basinId: string, facilityId: string): Promise<FacilityRow | undefined> {
  if (!isUuid(facilityId)) return undefined;
  return db
    .selectFrom("facilities")
    .selectAll()
    .where("basin_id", "=", basinId)
    .where("id", "=", facilityId)
    .executeTakeFirst();
}

export async function findFacilityByPermit(db: Db, basinId: string, permitId: string): Promise<FacilityRow | undefined> {
  return db
    .selectFrom("facilities")
    .selectAll()
    .where("basin_id", "=", basinId)
    .where("permit_id", "=", permitId)
    .executeTakeFirst();
}

export async function insertFacility(
  db: Db,
  values: { basin_id: string; name: string; permit_id: string },
): Promise<FacilityRow> {
  return db.insertInto("facilities").values(values).returningAll().executeTakeFirstOrThrow();
}

/** Facilities of a basin that a user is linked to (a discharger's own plants). */
export async function facilityIdsForUser(db: Db, basinId: string, userId: string): Promise<string[]> {
  const rows = await db
    .selectFrom("facility_users as fu")
    .innerJoin("facilities as f", "f.id", "fu.facility_id")
    .select("f.id")
    .where("f.basin_id", "=", basinId)
    .where("fu.user_id", "=", userId)
    .execute();
  return rows.map((r) => r.id);
}

export async function linkFacilityUser(db: Db, facilityId: string, userId: string): Promise<void> {
  await db
    .insertInto("facility_users")
    .values({ facility_id: facilityId, user_id: userId })
    .onConflict((oc) => oc.doNothing())
    .execute();
}

export async function unlinkFacilityUser(db: Db, facilityId: string, userId: string): Promise<boolean> {
  const res = await db
    .deleteFrom("facility_users")
    .where("facility_id", "=", facilityId)
    .where("user_id", "=", userId)
    .executeTakeFirst();
  return res.numDeletedRows > 0n;
}

/** Remove every facility link a user has in one basin (when the user leaves it). */
export async function unlinkUserFromBasinFacilities(db: Db, basinId: string, userId: string): Promise<void> {
  await db
    .deleteFrom("facility_users")
    .where("user_id", "=", userId)
    .where("facility_id", "in", (eb) => eb.selectFrom("facilities").select("id").where("basin_id", "=", basinId))
    .execute();
}
