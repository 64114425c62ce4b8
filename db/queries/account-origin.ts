import type { Db } from "@/db/client";

/**
 * Whether a site administrator made this account (audit `user.created`, lib/services/users
 * createUser) — staff waiting to be added to a basin — rather than the person registering
 * it themselves (`user.registered`: a member of the public).
 */
export async function createdByAdministrator(db: Db, userId: string): Promise<boolean> {
  const row = await db
    .selectFrom("audit_events")
    .select("id")
    .where("basin_id", "is", null)
    .where("action", "=", "user.created")
    .where("target_type", "=", "user")
    .where("target_id", "=", userId)
    .limit(1)
    .executeTakeFirst();
  return row !== undefined;
}
