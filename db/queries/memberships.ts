import type { Db } from "../client";
import type { BasinRole } from "../schema";

export async function findMembershipRole(db: Db, basinId: string, userId: string): Promise<BasinRole | null> {
  const row = await db
    .selectFrom("memberships")
    .select("role")
    .where("basin_id", "=", basinId)
    .where("user_id", "=", userId)
    .executeTakeFirst();
  return row?.role ?? null;
}

export async function userLeadsAnyBasin(db: Db, userId: string): Promise<boolean> {
  const row = await db
    .selectFrom("memberships")
    .select("basin_id")
    .where("user_id", "=", userId)
    .where("role", "=", "lead")
    .executeTakeFirst();
  return row !== undefined;
}

export interface MemberRow {
  user_id: string;
  email: string;
  name: string;
  role: BasinRole;
  created_at: Date;
}

export async function listMembers(db: Db, basinId: string): Promise<MemberRow[]> {
  return db
    .selectFrom("memberships as m")
    .innerJoin("users as u", "u.id", "m.user_id")
    .select(["m.user_id", "u.email", "u.name", "m.role", "m.created_at"])
    .where("m.basin_id", "=", basinId)
    .orderBy("u.name")
    .execute();
}

export async function insertMembership(db: Db, basinId: string, userId: string, role: BasinRole): Promise<void> {
  await db.insertInto("memberships").values({ basin_id: basinId, user_id: userId, role }).execute();
}

export async function updateMembershipRole(db: Db, basinId: string, userId: string, role: BasinRole): Promise<boolean> {
  const res = await db
    .updateTable("memberships")
    .set({ role })
    .where("basin_id", "=", basinId)
    .where("user_id", "=", userId)
    .executeTakeFirst();
  return res.numUpdatedRows > 0n;
}

export async function deleteMembership(db: Db, basinId: string, userId: string): Promise<boolean> {
  const res = await db
    .deleteFrom("memberships")
    .where("basin_id", "=", basinId)
    .where("user_id", "=", userId)
    .executeTakeFirst();
  return res.numDeletedRows > 0n;
}

export async function countLeads(db: Db, basinId: string): Promise<number> {
  const row = await db
    .selectFrom("memberships")
    .select((eb) => eb.fn.countAll<string>().as("n"))
    .where("basin_id", "=", basinId)
    .where("role", "=", "lead")
    .executeTakeFirstOrThrow();
  return Number(row.n);
}
