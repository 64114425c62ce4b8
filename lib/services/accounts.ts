import { createHash, randomBytes } from "node:crypto";
import type { Db } from "@/db/client";
import {
  findAccountTokenForUpdate,
  insertAccountToken,
  markAccountTokenUsed,
  retireAccountTokens,
  type AccountTokenRecord,
} from "@/db/queries/accounts";
import { insertAuditEvent } from "@/db/queries/audit";
import { findUserByEmail, insertUser, markUserVerified, updateUserPassword } from "@/db/queries/users";
import type { AccountTokenKind } from "@/db/schema";
import { passwordResetEmail, verifyAddressEmail } from "@/lib/email/account-templates";
import { appUrl } from "@/lib/email/app-url";
import { queueEmail } from "@/lib/email/outbox";
import { AppError, conflict } from "@/lib/errors";
import type { RegisterInput, ResetConfirmInput } from "@/lib/validation/account";
import { hashPassword } from "./users";

const HOUR_MS = 60 * 60 * 1000;
/** How long each kind of e-mailed link works. */
export const TOKEN_LIFETIME_MS = { verify: 48 * HOUR_MS, reset: 1 * HOUR_MS, invite: 14 * 24 * HOUR_MS } as const;

/** A fresh random token for an e-mailed link and the SHA-256 hash that is stored instead of it. */
export function newToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, hash: hashToken(token) };
}

export function hashToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}

const tokenProblem = (message: string) => new AppError("bad_request", message, [{ path: "token", message }]);

/** Issues a single-use link of one kind for a user (older unused links of that kind stop working). */
async function issueToken(trx: Db, userId: string, kind: AccountTokenKind, now: Date) {
  await retireAccountTokens(trx, userId, kind, now);
  const { token, hash } = newToken();
  const expiresAt = new Date(now.getTime() + TOKEN_LIFETIME_MS[kind]);
  const { id } = await insertAccountToken(trx, { user_id: userId, kind, token_hash: hash, expires_at: expiresAt });
  return { id, token, expiresAt };
}

/** Finds a usable token and uses it up, inside the caller's transaction; 400 naming `token` otherwise. */
async function spendToken(trx: Db, kind: AccountTokenKind, token: string, now: Date): Promise<AccountTokenRecord> {
  const found = await findAccountTokenForUpdate(trx, kind, hashToken(token));
  if (!found) throw tokenProblem("This link is not valid; open the link from the most recent e-mail");
  if (found.used_at) throw tokenProblem("This link has already been used");
  if (found.expires_at.getTime() <= now.getTime()) throw tokenProblem("This link has expired; ask for a new one");
  if (!(await markAccountTokenUsed(trx, found.id, now))) throw tokenProblem("This link has already been used");
  return found;
}

export interface RegisteredDto {
  email: string;
  name: string;
}

/**
 * Self-registration: an unconfirmed account (it cannot sign in yet) and a
 * confirmation e-mail queued in the same transaction. 409 naming `email`
 * when the address already has an account.
 */
export async function register(db: Db, input: RegisterInput): Promise<RegisteredDto> {
  const passwordHash = await hashPassword(input.password);
  return db.transaction().execute(async (trx) => {
    if (await findUserByEmail(trx, input.email)) {
      throw conflict("An account already uses this e-mail address; sign in, or choose a new password if you forgot it", [
        { path: "email", message: "Already has an account" },
      ]);
    }
    const now = new Date();
    const user = await insertUser(trx, {
      email: input.email,
      name: input.name,
      password_hash: passwordHash,
      email_verified_at: null,
    });
    const link = await issueToken(trx, user.id, "verify", now);
    await queueEmail(trx, {
      to: user.email,
      kind: "account",
      dedupeKey: `account_verify:${link.id}`,
      ...verifyAddressEmail({ name: user.name, url: `${appUrl()}/verify?token=${link.token}`, expiresAt: link.expiresAt }),
    });
    await insertAuditEvent(trx, {
      basinId: null,
      actorId: user.id,
      action: "user.registered",
      targetType: "user",
      targetId: user.id,
      details: { email: user.email },
    });
    return { email: user.email, name: user.name };
  });
}

/** Confirms the address behind a verification link (single use, 48 h). */
export async function verifyEmail(db: Db, token: string): Promise<{ email: string }> {
  return db.transaction().execute(async (trx) => {
    const now = new Date();
    const t = await spendToken(trx, "verify", token, now);
    await markUserVerified(trx, t.user_id, now);
    await insertAuditEvent(trx, {
      basinId: null,
      actorId: t.user_id,
      action: "user.email_verified",
      targetType: "user",
      targetId: t.user_id,
    });
    return { email: t.email };
  });
}

/**
 * Queues a password-reset e-mail when the address has an account and does
 * nothing otherwise; the caller answers the same either way (202), so the
 * response never tells whether an account exists.
 */
export async function requestPasswordReset(db: Db, email: string): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const user = await findUserByEmail(trx, email);
    if (!user) return;
    const now = new Date();
    const link = await issueToken(trx, user.id, "reset", now);
    await queueEmail(trx, {
      to: user.email,
      kind: "account",
      dedupeKey: `account_reset:${link.id}`,
      ...passwordResetEmail({ name: user.name, url: `${appUrl()}/reset-password?token=${link.token}`, expiresAt: link.expiresAt }),
    });
    await insertAuditEvent(trx, {
      basinId: null,
      actorId: null,
      action: "user.password_reset_requested",
      targetType: "user",
      targetId: user.id,
    });
  });
}

/**
 * Sets a new password from a reset link (single use, 1 h). The link reached
 * the address, so the address counts as confirmed from now on.
 */
export async function resetPassword(db: Db, input: Pick<ResetConfirmInput, "token" | "password">): Promise<{ email: string }> {
  const passwordHash = await hashPassword(input.password);
  return db.transaction().execute(async (trx) => {
    const now = new Date();
    const t = await spendToken(trx, "reset", input.token, now);
    await updateUserPassword(trx, t.user_id, passwordHash);
    await markUserVerified(trx, t.user_id, now);
    await retireAccountTokens(trx, t.user_id, "reset", now);
    await insertAuditEvent(trx, {
      basinId: null,
      actorId: t.user_id,
      action: "user.password_reset",
      targetType: "user",
      targetId: t.user_id,
      details: { verifiedNow: t.email_verified_at === null },
    });
    return { email: t.email };
  });
}
