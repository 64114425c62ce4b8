import type { Db } from "../client";

/** Follow a basin; following twice is a no-op. */
export async function insertFollow(db: Db, basinId: string, userId: string): Promise<void> {
  await db
    .insertInto("basin_follows")
    .values({ basin_id: basinId, user_id: userId })
    .onConflict((oc) => oc.columns(["basin_id", "user_id"]).doNothing())
    .execute();
}

export async function deleteFollow(db: Db, basinId: string, userId: string): Promise<void> {
  await db.deleteFrom("basin_follows").where("basin_id", "=", basinId).where("user_id", "=", userId).execute();
}

export async function isFollowing(db: Db, basinId: string, userId: string): Promise<boolean> {
  const row = await db
    .selectFrom("basin_follows")
    .select("user_id")
    .where("basin_id", "=", basinId)
    .where("user_id", "=", userId)
    .executeTakeFirst();
  return row !== undefined;
}

/**
 * Who follows a basin, for its notices: accounts with a confirmed e-mail
 * address only (an unconfirmed address may not be the person's own).
 */
export async function basinFollowersWithEmail(db: Db, basinId: string): Promise<{ id: string; name: string; email: string }[]> {
  return db
    .selectFrom("basin_follows as f")
    .innerJoin("users as u", "u.id", "f.user_id")
    .select(["u.id", "u.name", "u.email"])
    .where("f.basin_id", "=", basinId)
    .where("u.email_verified_at", "is not", null)
    .orderBy("u.name")
    .execute();
}
