import { randomBytes } from "node:crypto";
import { RateLimiterPostgres } from "rate-limiter-flexible";
import { afterEach, beforeAll, describe, expect, it } from "vitest";
import * as registerRoute from "@/app/api/account/register/route";
import * as resetRequestRoute from "@/app/api/account/password-reset/route";
import * as invitationsRoute from "@/app/api/basins/[basinId]/invitations/route";
import * as commentsRoute from "@/app/api/basins/[basinId]/threads/[threadId]/comments/route";
import { createDb, poolOf } from "@/db/client";
import { insertUser } from "@/db/queries/users";
import { authOptions } from "@/lib/auth/options";
import { signInRetryAt } from "@/lib/auth/sign-in-errors";
import { drainAfterResponse } from "@/lib/security/after-response";
import { clientAddress } from "@/lib/security/client-address";
import { limitSetting } from "@/lib/security/rate-limit";
import { hashPassword } from "@/lib/services/users";
import { callRoute } from "../support/call-route";
import { fileDb } from "../support/file-db";
import { planAt } from "../support/plan-fixture";
import { buildWorld, WORLD_PASSWORD, type World } from "../support/world";

const db = fileDb();
const tag = () => randomBytes(4).toString("hex");
/** A client address no other test in this file has used (random ones collided now and then, sharing a count). */
let addresses = 0;
const address = () => {
  const n = ++addresses;
  if (n > 500) throw new Error("rate-limits test: out of test addresses");
  return n <= 250 ? `203.0.113.${n}` : `192.0.2.${n - 250}`;
};

// Small limits for this file; each test uses fresh accounts and addresses.
const SMALL: Record<string, string> = {
  SAGLINE_RATE_LIMIT_SIGNIN_ACCOUNT: "3/600",
  SAGLINE_RATE_LIMIT_SIGNIN_ADDRESS: "6/600",
  SAGLINE_RATE_LIMIT_REGISTER_ADDRESS: "2/600",
  SAGLINE_RATE_LIMIT_RESET_EMAIL: "2/600",
  SAGLINE_RATE_LIMIT_RESET_ADDRESS: "50/600",
  SAGLINE_RATE_LIMIT_INVITE_ACTOR: "2/600",
  SAGLINE_RATE_LIMIT_COMMENT_ACTOR: "2/600",
};
beforeAll(() => Object.assign(process.env, SMALL));
afterEach(() => delete process.env.TRUSTED_PROXY);

type Authorize = (credentials: Record<string, string>, req: { headers: Record<string, string> }) => Promise<unknown>;
const authorize = (authOptions.providers[0] as unknown as { options: { authorize: Authorize } }).options.authorize;
const signIn = (email: string, password: string, from = "198.51.100.7") =>
  authorize({ email, password }, { headers: { "x-forwarded-for": from } }).then(
    (user) => (user ? "ok" : "mismatch"),
    (error: Error) => error.message,
  );

async function person() {
  return insertUser(db, { email: `rl-${tag()}@limits.test`, name: "Rate Limited", password_hash: await hashPassword(WORLD_PASSWORD) });
}

describe("sign-in limits", () => {
  it("locks an account after its failed attempts, says until when, even for the right password; other accounts go on", async () => {
    const u = await person();
    const from = address();
    for (let i = 0; i < 3; i++) expect(await signIn(u.email, "not-the-password", from)).toBe("mismatch");
    const locked = await signIn(u.email, WORLD_PASSWORD, from);
    const retryAt = signInRetryAt(locked);
    expect(retryAt, locked).not.toBeNull();
    expect(retryAt!.getTime()).toBeGreaterThan(Date.now() + 500 * 1000);
    expect(retryAt!.getTime()).toBeLessThanOrEqual(Date.now() + 601 * 1000);
    const other = await person();
    expect(await signIn(other.email, WORLD_PASSWORD, address())).toBe("ok");
  });

  it("a success clears the account's failures", async () => {
    const u = await person();
    const from = address();
    await signIn(u.email, "wrong-1", from);
    await signIn(u.email, "wrong-2", from);
    expect(await signIn(u.email, WORLD_PASSWORD, from)).toBe("ok");
    await signIn(u.email, "wrong-3", from);
    await signIn(u.email, "wrong-4", from);
    expect(await signIn(u.email, WORLD_PASSWORD, from)).toBe("ok");
  });

  it("parallel guesses cannot slip past the count: only the limit's worth reach the password check", async () => {
    const u = await person();
    const results = await Promise.all(Array.from({ length: 20 }, (_, i) => signIn(u.email, `guess-${i}`, address())));
    expect(results.filter((r) => r === "mismatch")).toHaveLength(3);
    expect(results.filter((r) => signInRetryAt(r) !== null)).toHaveLength(17);
  });

  it("limits one client address across many accounts", async () => {
    const from = address();
    const people = await Promise.all(Array.from({ length: 7 }, () => person()));
    const outcomes: string[] = [];
    for (const p of people) outcomes.push(await signIn(p.email, "spray-password", from));
    expect(outcomes.slice(0, 6)).toEqual(Array(6).fill("mismatch"));
    expect(signInRetryAt(outcomes[6])).not.toBeNull();
    // the same person from another address is not held up by that one
    expect(await signIn(people[6].email, WORLD_PASSWORD, address())).toBe("ok");
  });

  it("is kept in PostgreSQL, so another server process sees the same count", async () => {
    const u = await person();
    await signIn(u.email, "wrong", address());
    const other = createDb(process.env.DATABASE_URL, 1);
    try {
      const { points, seconds } = limitSetting("signin_account");
      const elsewhere = new RateLimiterPostgres({
        storeClient: poolOf(other),
        storeType: "pool",
        tableName: "rate_limits",
        tableCreated: true,
        clearExpiredByTimeout: false,
        keyPrefix: "signin_account",
        points,
        duration: seconds,
      });
      expect((await elsewhere.get(u.email))?.consumedPoints).toBe(1);
      await elsewhere.consume(u.email, 2);
      expect(signInRetryAt(await signIn(u.email, WORLD_PASSWORD, address()))).not.toBeNull();
    } finally {
      await other.destroy();
    }
  });
});

const expect429 = (res: { status: number; json: unknown; headers: Headers }, message: RegExp) => {
  expect(res.status).toBe(429);
  const retryAfter = Number(res.headers.get("retry-after"));
  expect(retryAfter).toBeGreaterThan(0);
  expect(retryAfter).toBeLessThanOrEqual(600);
  const error = (res.json as { error: { code: string; message: string; details: { retryAfterSeconds: number } } }).error;
  expect(error.code).toBe("rate_limited");
  expect(error.message).toMatch(message);
  expect(error.message).toMatch(/try again in \d+ (minute|second)s?/);
  expect(error.details.retryAfterSeconds).toBe(retryAfter);
};

describe("registration and password-reset limits", () => {
  it("limits accounts created from one client address", async () => {
    const from = address();
    const reg = () =>
      callRoute(registerRoute.POST, "POST", {
        headers: { "x-forwarded-for": from },
        body: { name: "New Person", email: `new-${tag()}@limits.test`, password: "a-long-password-1", confirmPassword: "a-long-password-1" },
      });
    expect((await reg()).status).toBe(201);
    expect((await reg()).status).toBe(201);
    expect429(await reg(), /accounts created from your network address/);
    // nothing was written for the refused one
    expect((await callRoute(registerRoute.POST, "POST", { headers: { "x-forwarded-for": address() }, body: { name: "Another", email: `new-${tag()}@limits.test`, password: "a-long-password-1", confirmPassword: "a-long-password-1" } })).status).toBe(201);
  });

  it("limits reset e-mails per address, known or not, with the same answers", async () => {
    const u = await person();
    const nobody = `nobody-${tag()}@limits.test`;
    const ask = (email: string) => callRoute(resetRequestRoute.POST, "POST", { headers: { "x-forwarded-for": address() }, body: { email } });
    for (let i = 0; i < 2; i++) {
      const known = await ask(u.email);
      const unknown = await ask(nobody);
      expect([known.status, unknown.status]).toEqual([202, 202]);
      expect(known.json).toEqual(unknown.json);
    }
    const k = await ask(u.email);
    const n = await ask(nobody);
    expect429(k, /password-reset e-mails for this address/);
    expect(n.status).toBe(429);
    expect((n.json as { error: { message: string } }).error.message).toBe((k.json as { error: { message: string } }).error.message);
    await drainAfterResponse();
    const sent = await db.selectFrom("email_outbox").select("id").where("to_address", "=", u.email).execute();
    expect(sent).toHaveLength(2);
  });

  it("answers known and unknown addresses alike in time: the look-up happens after the answer", async () => {
    process.env.SAGLINE_RATE_LIMIT_RESET_EMAIL = "1000/600";
    try {
      const u = await person();
      const time = async (email: string) => {
        const t = performance.now();
        const res = await callRoute(resetRequestRoute.POST, "POST", { body: { email } });
        const ms = performance.now() - t;
        expect(res.status).toBe(202);
        await drainAfterResponse();
        return ms;
      };
      const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
      const known: number[] = [];
      const unknown: number[] = [];
      for (let i = 0; i < 15; i++) {
        known.push(await time(u.email));
        unknown.push(await time(`nobody-${tag()}@limits.test`));
      }
      // structurally: the known address's e-mail exists only after the deferred work ran
      const rows = await db.selectFrom("email_outbox").select("id").where("to_address", "=", u.email).execute();
      expect(rows).toHaveLength(15);
      // loosely in time (both answer before any look-up; the old gap was ~4×)
      const [k, n] = [median(known), median(unknown)];
      expect(k / n, `known ${k.toFixed(1)} ms, unknown ${n.toFixed(1)} ms`).toBeLessThan(2.5);
      expect(n / k, `known ${k.toFixed(1)} ms, unknown ${n.toFixed(1)} ms`).toBeLessThan(2.5);
    } finally {
      process.env.SAGLINE_RATE_LIMIT_RESET_EMAIL = SMALL.SAGLINE_RATE_LIMIT_RESET_EMAIL;
    }
  });
});

describe("invitation and comment limits", () => {
  let w: World;
  let threadId: string;
  beforeAll(async () => {
    w = await buildWorld(db);
    threadId = (await planAt(db, w, "review")).planThreadId;
  });

  it("limits invitations per sender", async () => {
    const invite = () =>
      callRoute(invitationsRoute.POST, "POST", { userId: w.users.lead.id, params: { basinId: w.basinId }, body: { email: `inv-${tag()}@limits.test`, role: "stakeholder" } });
    expect((await invite()).status).toBe(201);
    expect((await invite()).status).toBe(201);
    expect429(await invite(), /invitations sent by you/);
  });

  it("limits comments per person; others still comment", async () => {
    const comment = (userId: string) =>
      callRoute(commentsRoute.POST, "POST", { userId, params: { basinId: w.basinId, threadId }, body: { body: `a comment ${tag()}` } });
    expect((await comment(w.users.outsider.id)).status).toBe(201);
    expect((await comment(w.users.outsider.id)).status).toBe(201);
    expect429(await comment(w.users.outsider.id), /comments posted by you/);
    const count = await db.selectFrom("comments").select("id").where("thread_id", "=", threadId).where("author_id", "=", w.users.outsider.id).execute();
    expect(count).toHaveLength(2);
    expect((await comment(w.users.stakeholder.id)).status).toBe(201);
  });
});

describe("the client address", () => {
  const h = (xff?: string) => new Headers(xff ? { "x-forwarded-for": xff } : {});
  it("without TRUSTED_PROXY is the address Next.js wrote from the socket (the last entry)", () => {
    expect(clientAddress(h("127.0.0.1"), {})).toBe("127.0.0.1");
    expect(clientAddress(h("::ffff:10.1.2.3"), {})).toBe("10.1.2.3");
    expect(clientAddress(h(), {})).toBeNull();
  });
  it("with TRUSTED_PROXY=N skips the N−1 proxies and ignores what the client wrote further left", () => {
    expect(clientAddress(h("6.6.6.6, 198.51.100.9"), { TRUSTED_PROXY: "1" })).toBe("198.51.100.9");
    expect(clientAddress(h("6.6.6.6, 198.51.100.9, 10.0.0.2"), { TRUSTED_PROXY: "2" })).toBe("198.51.100.9");
    expect(() => clientAddress(h("1.2.3.4"), { TRUSTED_PROXY: "lots" })).toThrow(/TRUSTED_PROXY/);
  });
  it("limits are configurable and a bad setting is refused by name", () => {
    expect(limitSetting("comment_actor", { SAGLINE_RATE_LIMIT_COMMENT_ACTOR: "7/60" })).toEqual({ points: 7, seconds: 60 });
    expect(limitSetting("comment_actor", { SAGLINE_RATE_LIMIT_SCALE: "10" }).points).toBe(300);
    expect(() => limitSetting("comment_actor", { SAGLINE_RATE_LIMIT_COMMENT_ACTOR: "lots" })).toThrow(/SAGLINE_RATE_LIMIT_COMMENT_ACTOR/);
  });
});
