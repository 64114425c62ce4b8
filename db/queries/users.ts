import type { Db } from "../client";
import type { NewUser, UserRow } from "../schema";

export async function findUserById(db: Db, id: string): Promise<UserRow | undefined> {
  if (!isUuid(id)) return undefined;
  return db.selectFrom("users").selectAll().where("id", "=", id).executeTakeFirst();
}

export async function findUserByEmail(db: Db, email: string): Promise<UserRow | undefined> {
  return db.selectFrom("users").selectAll().where("email", "=", email.trim().toLowerCase()).executeTakeFirst();
}

export async function insertUser(db: Db, user: NewUser): Promise<UserRow> {
  return db.insertInto("users").values(user).returningAll().executeTakeFirstOrThrow();
}

export async function listUsers(db: Db): Promise<UserRow[]> {
  return db.selectFrom("users").selectAll().orderBy("name").execute();
}

/** UUID syntax check so a malformed id is "not found", not a database error. */
export function isUuid(value: string): boolean {
  return /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(value);
}
