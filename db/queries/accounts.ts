import type { Db } from "../client";
import type { AccountTokenKind } from "../schema";

export interface AccountTokenRecord {
  id: string;
  user_id: string;
  kind: AccountTokenKind;
  expires_at: Date;
  used_at: Date | null;
  email: string;
  name: string;
  email_verified_at: Date | null;
}

export async function insertAccountToken(
  db: Db,
  values: { user_id: string; kind: AccountTokenKind; token_hash: string; expires_at: Date },
): Promise<{ id: string }> {
  return db.insertInto("account_tokens").values(values).returning("id").executeTakeFirstOrThrow();
}

/** The token with that hash and kind, with its account; locked for the rest of the transaction. */
export async function findAccountTokenForUpdate(
  db: Db,
  kind: AccountTokenKind,
  tokenHash: string,
): Promise<AccountTokenRecord | undefined> {
  return db
    .selectFrom("account_tokens as t")
    .innerJoin("users as u", "u.id", "t.user_id")
    .select(["t.id", "t.user_id", "t.kind", "t.expires_at", "t.used_at", "u.email", "u.name", "u.email_verified_at"])
    .where("t.kind", "=", kind)
    .where("t.token_hash", "=", tokenHash)
    .forUpdate("t")
    .executeTakeFirst();
}

/** Uses the token once: false when it was already used (a concurrent use lost). */
export async function markAccountTokenUsed(db: Db, id: string, at: Date): Promise<boolean> {
  const res = await db
    .updateTable("account_tokens")
    .set({ used_at: at })
    .where("id", "=", id)
    .where("used_at", "is", null)
    .executeTakeFirst();
  return res.numUpdatedRows > 0n;
}

/** Retires every unused token of one kind for a user (a newer link replaces older ones). */
export async function retireAccountTokens(db: Db, userId: string, kind: AccountTokenKind, at: Date): Promise<void> {
  await db
    .updateTable("account_tokens")
    .set({ used_at: at })
    .where("user_id", "=", userId)
    .where("kind", "=", kind)
    .where("used_at", "is", null)
    .execute();
}
