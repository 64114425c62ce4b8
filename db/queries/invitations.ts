import type { Db } from "../client";
import type { BasinRole } from "../schema";
import { isUuid } from "./users";

export interface InvitationRecord {
  id: string;
  basin_id: string;
  basin_name: string;
  email: string;
  role: BasinRole;
  facility_id: string | null;
  facility_name: string | null;
  invited_by: string | null;
  inviter_name: string | null;
  expires_at: Date;
  accepted_at: Date | null;
  revoked_at: Date | null;
  created_at: Date;
}

function selectInvitations(db: Db) {
  return db
    .selectFrom("invitations as i")
    .innerJoin("basins as b", "b.id", "i.basin_id")
    .leftJoin("facilities as f", "f.id", "i.facility_id")
    .leftJoin("users as u", "u.id", "i.invited_by")
    .select([
      "i.id",
      "i.basin_id",
      "b.name as basin_name",
      "i.email",
      "i.role",
      "i.facility_id",
      "f.name as facility_name",
      "i.invited_by",
      "u.name as inviter_name",
      "i.expires_at",
      "i.accepted_at",
      "i.revoked_at",
      "i.created_at",
    ]);
}

export async function insertInvitation(
  db: Db,
  values: {
    basin_id: string;
    email: string;
    role: BasinRole;
    facility_id: string | null;
    invited_by: string;
    token_hash: string;
    expires_at: Date;
  },
): Promise<{ id: string }> {
  return db.insertInto("invitations").values(values).returning("id").executeTakeFirstOrThrow();
}

export async function findInvitation(db: Db, basinId: string, id: string): Promise<InvitationRecord | undefined> {
  if (!isUuid(id)) return undefined;
  return selectInvitations(db).where("i.basin_id", "=", basinId).where("i.id", "=", id).executeTakeFirst();
}

export async function findInvitationByTokenHash(db: Db, tokenHash: string): Promise<InvitationRecord | undefined> {
  return selectInvitations(db).where("i.token_hash", "=", tokenHash).executeTakeFirst();
}

/** Locks the invitation row for the rest of the transaction (accepting it twice at once). */
export async function lockInvitation(db: Db, id: string): Promise<void> {
  await db.selectFrom("invitations").select("id").where("id", "=", id).forUpdate().execute();
}

/** Invitations neither accepted nor revoked (expired ones included), newest first. */
export async function listOpenInvitations(db: Db, basinId: string): Promise<InvitationRecord[]> {
  return selectInvitations(db)
    .where("i.basin_id", "=", basinId)
    .where("i.accepted_at", "is", null)
    .where("i.revoked_at", "is", null)
    .orderBy("i.created_at", "desc")
    .execute();
}

/** An unexpired open invitation of this address into the basin, if any. */
export async function findLiveInvitationForEmail(
  db: Db,
  basinId: string,
  email: string,
  now: Date,
): Promise<{ id: string } | undefined> {
  return db
    .selectFrom("invitations")
    .select("id")
    .where("basin_id", "=", basinId)
    .where("email", "=", email)
    .where("accepted_at", "is", null)
    .where("revoked_at", "is", null)
    .where("expires_at", ">", now)
    .executeTakeFirst();
}

/** Accepts once: false when it was accepted or revoked meanwhile. */
export async function markInvitationAccepted(db: Db, id: string, userId: string, at: Date): Promise<boolean> {
  const res = await db
    .updateTable("invitations")
    .set({ accepted_at: at, accepted_by: userId })
    .where("id", "=", id)
    .where("accepted_at", "is", null)
    .where("revoked_at", "is", null)
    .executeTakeFirst();
  return res.numUpdatedRows > 0n;
}

export async function markInvitationRevoked(db: Db, id: string, at: Date): Promise<boolean> {
  const res = await db
    .updateTable("invitations")
    .set({ revoked_at: at })
    .where("id", "=", id)
    .where("accepted_at", "is", null)
    .where("revoked_at", "is", null)
    .executeTakeFirst();
  return res.numUpdatedRows > 0n;
}
