import { encode } from "next-auth/jwt";
import { beforeAll, describe, expect, it } from "vitest";
import * as resetConfirmRoute from "@/app/api/account/password-reset/confirm/route";
import * as basinsRoute from "@/app/api/basins/route";
import * as memberRoute from "@/app/api/basins/[basinId]/members/[userId]/route";
import * as basinRoute from "@/app/api/basins/[basinId]/route";
import { findUserById } from "@/db/queries/users";
import { loadActor } from "@/lib/auth/guard";
import { authOptions } from "@/lib/auth/options";
import { drainAfterResponse } from "@/lib/security/after-response";
import { requestPasswordReset } from "@/lib/services/accounts";
import { callRoute } from "../support/call-route";
import { fileDb } from "../support/file-db";
import { buildWorld, type World } from "../support/world";

const db = fileDb();

/** A session cookie as next-auth writes it at sign-in: the user id and the account's session version then. */
async function cookieFor(userId: string) {
  const user = (await findUserById(db, userId))!;
  const token = await authOptions.callbacks!.jwt!({ token: {}, user: { id: userId, sessionVersion: user.session_version }, account: null } as never);
  return `next-auth.session-token=${await encode({ token, secret: process.env.NEXTAUTH_SECRET! })}`;
}
const myBasins = (cookie: string) => callRoute(basinsRoute.GET, "GET", { headers: { cookie } });

describe("sessions end when the account's session version moves on", () => {
  let w: World;
  beforeAll(async () => {
    w = await buildWorld(db);
  });

  it("a password reset ends every earlier session; a new sign-in works", async () => {
    const u = w.users.outsider;
    const before = await cookieFor(u.id);
    expect((await myBasins(before)).status).toBe(200);
    await requestPasswordReset(db, u.email);
    const mail = await db.selectFrom("email_outbox").select("text_body").where("to_address", "=", u.email).orderBy("id", "desc").executeTakeFirstOrThrow();
    const token = mail.text_body.match(/reset-password\?token=([A-Za-z0-9_-]+)/)![1];
    const pw = "a-fresh-password-9";
    expect((await callRoute(resetConfirmRoute.POST, "POST", { body: { token, password: pw, confirmPassword: pw } })).status).toBe(200);
    await drainAfterResponse();
    const stale = await myBasins(before);
    expect(stale.status).toBe(401);
    expect((await myBasins(await cookieFor(u.id))).status).toBe(200);
  });

  it("removing a member, or changing their role, ends their sessions", async () => {
    const target = w.users.target;
    const first = await cookieFor(target.id);
    expect((await myBasins(first)).status).toBe(200);
    const patch = await callRoute(memberRoute.PATCH, "PATCH", { userId: w.users.lead.id, params: { basinId: w.basinId, userId: target.id }, body: { role: "planner" } });
    expect(patch.status, JSON.stringify(patch.json)).toBe(200);
    expect((await myBasins(first)).status).toBe(401);

    const second = await cookieFor(target.id);
    expect((await myBasins(second)).status).toBe(200);
    const del = await callRoute(memberRoute.DELETE, "DELETE", { userId: w.users.lead.id, params: { basinId: w.basinId, userId: target.id } });
    expect(del.status).toBe(204);
    expect((await myBasins(second)).status).toBe(401);
  });

  it("the reader used by pages and routes refuses a version behind or ahead; the session carries it", async () => {
    const u = w.users.stakeholder;
    const { session_version } = (await findUserById(db, u.id))!;
    expect(await loadActor(db, u.id, session_version)).toMatchObject({ id: u.id });
    expect(await loadActor(db, u.id, session_version + 1)).toBeNull();
    const session = await authOptions.callbacks!.session!({ session: { user: {}, expires: "" }, token: { sub: u.id, sv: 4 } } as never);
    expect((session as { user: { id: string; sv: number } }).user).toMatchObject({ id: u.id, sv: 4 });
  });

  it("a basin route, which reads the account, the basin and the role in one query, refuses a stale session the same way", async () => {
    const u = w.users.discharger;
    const cookie = await cookieFor(u.id);
    const basin = (basinId: string) => callRoute(basinRoute.GET, "GET", { params: { basinId }, headers: { cookie } });
    // twice: the second decode of the same token comes from the process's token cache
    expect((await basin(w.basinId)).status).toBe(200);
    expect((await basin(w.basinId)).status).toBe(200);
    // the same id in capitals names the same basin
    expect((await basin(w.basinId.toUpperCase())).status).toBe(200);
    // signed in, an unknown basin is not found and another basin is not this member's
    expect((await basin("00000000-0000-4000-8000-000000000000")).status).toBe(404);
    expect((await basin(w.otherBasinId)).status).toBe(403);
    // a cached token is not a live session: once the version moves on, the same cookie is refused
    await db.updateTable("users").set((eb) => ({ session_version: eb("session_version", "+", 1) })).where("id", "=", u.id).execute();
    const stale = await basin(w.basinId);
    expect(stale.status).toBe(401);
    expect((await basin("not-an-id")).status).toBe(401);
  });
});
