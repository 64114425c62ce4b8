import bcrypt from "bcryptjs";
import type { Db } from "@/db/client";
import { insertAuditEvent } from "@/db/queries/audit";
import { bumpSessionVersion, findUserByEmail, insertUser, listUsers as listUserRows } from "@/db/queries/users";
import type { Actor } from "@/lib/auth/guard";
import { requireSiteAction } from "@/lib/auth/guard";
import { conflict } from "@/lib/errors";
import { clearLimit, consumeAll } from "@/lib/security/rate-limit";
import type { UserCreateInput } from "@/lib/validation/user";
import { userDto, type UserDto } from "./dto";

const BCRYPT_COST = 10;

export async function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_COST);
}

// A fixed hash to compare against when the e-mail is unknown, so a wrong
// e-mail and a wrong password take the same time (same cost as real hashes).
const DUMMY_HASH = "$2b$10$CwTycUXWue0Thq9StjUM0uJ8.jV1oXh0ZiYy6Yq0Qx1J7o7bqf9cK";

export type SignInCheck =
  | { ok: true; user: UserDto; sessionVersion: number }
  | { ok: false; reason: "mismatch" | "unverified" };

/**
 * Check e-mail and password. A mismatch never says which of the two was
 * wrong; "unverified" is told only to someone who knows the password.
 * bcryptjs's promise API works in slices between event-loop turns, so a
 * compare never holds up other requests for its whole ~70 ms.
 */
export async function checkSignIn(db: Db, email: string, password: string): Promise<SignInCheck> {
  const user = await findUserByEmail(db, email);
  const ok = await bcrypt.compare(password, user?.password_hash ?? DUMMY_HASH);
  if (!user || !ok) return { ok: false, reason: "mismatch" };
  if (!user.email_verified_at) return { ok: false, reason: "unverified" };
  return { ok: true, user: userDto(user), sessionVersion: user.session_version };
}

/**
 * Sign-in behind its rate limits (lib/security/rate-limit.ts): every attempt
 * counts against the client address, and against the account before the
 * password is compared (so many parallel guesses cannot all slip in before the
 * count catches up); a success clears the account's count. Throws
 * RateLimitedError when either is spent; no password is compared then.
 */
export async function signInLimited(db: Db, email: string, password: string, address: string | null): Promise<SignInCheck> {
  const account = email.trim().toLowerCase();
  await consumeAll([
    ["signin_address", address],
    ["signin_account", account],
  ]);
  const check = await checkSignIn(db, account, password);
  if (check.ok) await clearLimit("signin_account", account);
  return check;
}

/** Check e-mail and password; returns the user or null (wrong either way, or the address is not confirmed yet). */
export async function verifyCredentials(db: Db, email: string, password: string): Promise<UserDto | null> {
  const check = await checkSignIn(db, email, password);
  return check.ok ? check.user : null;
}

/** Ends every session the person has (they must sign in again); call inside the change's transaction. */
export async function endSessions(db: Db, userId: string): Promise<void> {
  await bumpSessionVersion(db, userId);
}

/** Admin: create an account. 409 when the e-mail is taken. */
export async function createUser(db: Db, actor: Actor | null, input: UserCreateInput): Promise<UserDto> {
  const admin = requireSiteAction(actor, "users.manage");
  const passwordHash = await hashPassword(input.password);
  return db.transaction().execute(async (trx) => {
    if (await findUserByEmail(trx, input.email)) {
      throw conflict(`A user with e-mail ${input.email} already exists`, [{ path: "email", message: "Already in use" }]);
    }
    const user = await insertUser(trx, {
      email: input.email,
      name: input.name,
      password_hash: passwordHash,
      is_admin: input.isAdmin,
      // an administrator vouches for the address
      email_verified_at: new Date(),
    });
    await insertAuditEvent(trx, {
      basinId: null,
      actorId: admin.id,
      action: "user.created",
      targetType: "user",
      targetId: user.id,
      details: { email: user.email, isAdmin: user.is_admin },
    });
    return userDto(user);
  });
}

export async function listUsers(db: Db, actor: Actor | null): Promise<UserDto[]> {
  requireSiteAction(actor, "users.manage");
  return (await listUserRows(db)).map(userDto);
}
