import { sql } from "kysely";
import type { Db } from "../client";
import type { NewUser, UserRow } from "../schema";

export async function findUserById(db: Db, id: string): Promise<UserRow | undefined> {
  if (!isUuid(id)) return undefined;
  return db.selectFrom("users").selectAll().where("id", "=", id).executeTakeFirst();
}

export async function findUserByEmail(db: Db, email: string): Promise<UserRow | undefined> {
  return db.selectFrom("users").selectAll().where("email", "=", email.trim().toLowerCase()).executeTakeFirst();
}

/**
 * Inserts an account. Its e-mail address counts as confirmed now unless the
 * caller passes `email_verified_at: null` (self-registration does): accounts
 * made by an administrator, an invitation or the seed need no confirmation.
 */
export async function insertUser(db: Db, user: NewUser): Promise<UserRow> {
  return db
    .insertInto("users")
    .values({ email_verified_at: new Date(), ...user })
    .returningAll()
    .executeTakeFirstOrThrow();
}

/** Sets a new password hash and ends the account's sessions; returns false when the user does not exist. */
export async function updateUserPassword(db: Db, userId: string, passwordHash: string): Promise<boolean> {
  const res = await db
    .updateTable("users")
    .set({ password_hash: passwordHash, session_version: sql<number>`session_version + 1`, updated_at: new Date() })
    .where("id", "=", userId)
    .executeTakeFirst();
  return res.numUpdatedRows > 0n;
}

/** Raises the session version: every session signed in before now stops working. */
export async function bumpSessionVersion(db: Db, userId: string): Promise<void> {
  await db
    .updateTable("users")
    .set({ session_version: sql<number>`session_version + 1` })
    .where("id", "=", userId)
    .execute();
}

/** Marks the address confirmed (keeps the first confirmation time). */
export async function markUserVerified(db: Db, userId: string, at: Date): Promise<void> {
  await db
    .updateTable("users")
    .set({ email_verified_at: at, updated_at: at })
    .where("id", "=", userId)
    .where("email_verified_at", "is", null)
    .execute();
}

export async function listUsers(db: Db): Promise<UserRow[]> {
  return db.selectFrom("users").selectAll().orderBy("name").execute();
}

/** UUID syntax check so a malformed id is "not found", not a database error. */
export function isUuid(value: string): boolean {
  return /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(value);
}
