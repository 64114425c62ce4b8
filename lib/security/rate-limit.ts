import { NextResponse } from "next/server";
import { RateLimiterPostgres, RateLimiterRes } from "rate-limiter-flexible";
import { getDb, poolOf } from "@/db/client";

/**
 * Rate limits kept in PostgreSQL (table `rate_limits`, migration 2026120201)
 * through rate-limiter-flexible, so they hold across every server process
 * sharing the database. Each limit allows `points` actions per `seconds`
 * window per subject (an account, an e-mail address, a client address).
 *
 * Configuration (read on every use, so tests can change it):
 * - `SAGLINE_RATE_LIMIT_<NAME>=points/seconds`, e.g. `SAGLINE_RATE_LIMIT_SIGNIN_ACCOUNT=5/600`
 * - `SAGLINE_RATE_LIMIT_SCALE=<factor>` multiplies every limit's points (the browser tests raise it).
 */
export const RATE_LIMITS = {
  /** Failed sign-ins per account (a success clears the count). */
  signin_account: { points: 10, seconds: 15 * 60, what: "sign-in attempts for this account" },
  /** Sign-in attempts (any outcome) per client address: caps password spraying and bcrypt work. */
  signin_address: { points: 100, seconds: 15 * 60, what: "sign-in attempts from your network address" },
  register_address: { points: 20, seconds: 60 * 60, what: "accounts created from your network address" },
  reset_email: { points: 3, seconds: 60 * 60, what: "password-reset e-mails for this address" },
  reset_address: { points: 20, seconds: 60 * 60, what: "password-reset requests from your network address" },
  invite_actor: { points: 50, seconds: 60 * 60, what: "invitations sent by you" },
  comment_actor: { points: 30, seconds: 10 * 60, what: "comments posted by you" },
} as const;

export type RateLimitName = keyof typeof RATE_LIMITS;

export interface LimitSetting {
  points: number;
  seconds: number;
}

/** The limit in force: the default, or the environment's `points/seconds`, times the scale. */
export function limitSetting(name: RateLimitName, env: Record<string, string | undefined> = process.env): LimitSetting {
  const fallback = RATE_LIMITS[name];
  let { points, seconds }: LimitSetting = fallback;
  const raw = env[`SAGLINE_RATE_LIMIT_${name.toUpperCase()}`];
  if (raw) {
    const m = /^\s*(\d+)\s*\/\s*(\d+)\s*$/.exec(raw);
    if (!m || Number(m[1]) < 1 || Number(m[2]) < 1) {
      throw new Error(`SAGLINE_RATE_LIMIT_${name.toUpperCase()} must be "points/seconds" with both at least 1, e.g. "10/900"; got "${raw}"`);
    }
    points = Number(m[1]);
    seconds = Number(m[2]);
  }
  const scale = Number(env.SAGLINE_RATE_LIMIT_SCALE ?? 1);
  if (!Number.isFinite(scale) || scale <= 0) throw new Error(`SAGLINE_RATE_LIMIT_SCALE must be a positive number; got "${env.SAGLINE_RATE_LIMIT_SCALE}"`);
  return { points: Math.max(1, Math.round(points * scale)), seconds };
}

const limiters = new Map<string, RateLimiterPostgres>();

function limiter(name: RateLimitName): RateLimiterPostgres {
  const { points, seconds } = limitSetting(name);
  const db = getDb();
  const cacheKey = `${name}:${points}:${seconds}`;
  let found = limiters.get(cacheKey);
  // a new process-wide pool (tests close and reopen it) needs a new limiter
  if (found && (found as unknown as { client: unknown }).client !== poolOf(db)) found = undefined;
  if (!found) {
    found = new RateLimiterPostgres({
      storeClient: poolOf(db),
      storeType: "pool",
      tableName: "rate_limits",
      // the migration made the table; the app never runs DDL at run time
      tableCreated: true,
      keyPrefix: name,
      points,
      duration: seconds,
    });
    limiters.set(cacheKey, found);
  }
  return found;
}

/** Refused: which limit, and when the subject may try again. */
export class RateLimitedError extends Error {
  readonly limit: RateLimitName;
  readonly retryAfterSeconds: number;
  readonly retryAt: Date;

  constructor(limit: RateLimitName, msBeforeNext: number) {
    const retryAfterSeconds = Math.max(1, Math.ceil(msBeforeNext / 1000));
    super(`Too many ${RATE_LIMITS[limit].what}; try again in ${describeWait(retryAfterSeconds)}`);
    this.name = "RateLimitedError";
    this.limit = limit;
    this.retryAfterSeconds = retryAfterSeconds;
    this.retryAt = new Date(Date.now() + retryAfterSeconds * 1000);
  }
}

export function describeWait(seconds: number): string {
  if (seconds < 60) return `${seconds} second${seconds === 1 ? "" : "s"}`;
  const minutes = Math.ceil(seconds / 60);
  return `${minutes} minute${minutes === 1 ? "" : "s"}`;
}

/**
 * Uses one point of `name` for `subject`; throws RateLimitedError when the
 * window's points are spent (the refused attempt is counted too, so hammering
 * a locked subject does not shorten the wait).
 */
export async function consume(name: RateLimitName, subject: string): Promise<void> {
  try {
    await limiter(name).consume(subject.toLowerCase());
  } catch (error) {
    if (error instanceof RateLimiterRes) throw new RateLimitedError(name, error.msBeforeNext);
    throw error;
  }
}

/** Forgets `subject`'s count (a successful sign-in clears its failures). */
export async function clearLimit(name: RateLimitName, subject: string): Promise<void> {
  await limiter(name).delete(subject.toLowerCase());
}

/** Runs `consume` for each [limit, subject] in turn; subjects that are null (unknown) are skipped. */
export async function consumeAll(checks: [RateLimitName, string | null][]): Promise<void> {
  for (const [name, subject] of checks) if (subject) await consume(name, subject);
}

/** The 429 answer: `Retry-After` in seconds and the API's error shape naming the limit. */
export function rateLimitedResponse(error: RateLimitedError): NextResponse {
  return NextResponse.json(
    {
      error: {
        code: "rate_limited",
        message: error.message,
        details: { limit: error.limit, retryAfterSeconds: error.retryAfterSeconds, retryAt: error.retryAt.toISOString() },
      },
    },
    { status: 429, headers: { "retry-after": String(error.retryAfterSeconds) } },
  );
}

/**
 * For route handlers: applies the limits, then runs `work`; a spent limit
 * becomes the 429 response instead (route() passes a returned Response through).
 */
export async function limited<T>(checks: [RateLimitName, string | null][], work: () => Promise<T>): Promise<T | NextResponse> {
  try {
    await consumeAll(checks);
  } catch (error) {
    if (error instanceof RateLimitedError) return rateLimitedResponse(error);
    throw error;
  }
  return work();
}
