import { beforeAll, describe, expect, it } from "vitest";
import * as registerRoute from "@/app/api/account/register/route";
import * as resetConfirmRoute from "@/app/api/account/password-reset/confirm/route";
import * as resetRequestRoute from "@/app/api/account/password-reset/route";
import * as verifyRoute from "@/app/api/account/verify/route";
import * as followRoute from "@/app/api/basins/[basinId]/follow/route";
import * as invitationsRoute from "@/app/api/basins/[basinId]/invitations/route";
import * as invitationRoute from "@/app/api/basins/[basinId]/invitations/[invitationId]/route";
import * as acceptRoute from "@/app/api/invitations/[token]/accept/route";
import * as previewRoute from "@/app/api/invitations/[token]/route";
import * as inviteRegisterRoute from "@/app/api/invitations/[token]/register/route";
import { basinFollowersWithEmail } from "@/db/queries/follows";
import { findUserByEmail, insertUser } from "@/db/queries/users";
import { checkSignIn, hashPassword, verifyCredentials } from "@/lib/services/users";
import { drainAfterResponse } from "@/lib/security/after-response";
import { fileDb } from "../support/file-db";
import { callRoute } from "../support/call-route";
import { buildWorld, WORLD_PASSWORD, type World } from "../support/world";

const db = fileDb();
let w: World;

beforeAll(async () => {
  w = await buildWorld(db);
});

const uniq = () => Math.random().toString(36).slice(2, 10);
const PASSWORD = "a-long-password-1";

/** The outbox rows addressed to one recipient, oldest first. */
async function mailTo(address: string) {
  return db
    .selectFrom("email_outbox")
    .select(["subject", "text_body", "html_body", "kind"])
    .where("to_address", "=", address)
    .orderBy("id")
    .execute();
}

/** The token of the last link to `path` e-mailed to `address`. */
async function linkToken(address: string, path: string): Promise<string> {
  const rows = await mailTo(address);
  const text = rows.at(-1)?.text_body ?? "";
  const match = text.match(new RegExp(`https?://[^\\s]+${path}\\?token=([A-Za-z0-9_-]+)`));
  if (!match) throw new Error(`no ${path} link in the mail to ${address}: ${text}`);
  return match[1];
}

const errorOf = (json: unknown) => (json as { error: { code: string; message: string; details?: { path: string; message: string }[] } }).error;
const paths = (json: unknown) => (errorOf(json).details ?? []).map((d) => d.path);

async function registerPerson(email = `person-${uniq()}@public.test`) {
  const res = await callRoute(registerRoute.POST, "POST", {
    body: { name: "Ida Marsh", email, password: PASSWORD, confirmPassword: PASSWORD },
  });
  expect(res.status, JSON.stringify(res.json)).toBe(201);
  return email;
}

describe("self-registration with e-mail confirmation", () => {
  it("registers, refuses sign-in until confirmed, confirms once with the e-mailed link", async () => {
    const email = await registerPerson();
    const user = await findUserByEmail(db, email);
    expect(user?.email_verified_at).toBeNull();

    // the right password on an unconfirmed address: refused, and the reason is told
    expect(await verifyCredentials(db, email, PASSWORD)).toBeNull();
    expect(await checkSignIn(db, email, PASSWORD)).toEqual({ ok: false, reason: "unverified" });
    // a wrong password says nothing about confirmation
    expect(await checkSignIn(db, email, "wrong-password-123")).toEqual({ ok: false, reason: "mismatch" });

    const mail = await mailTo(email);
    expect(mail).toHaveLength(1);
    expect(mail[0].kind).toBe("account");
    expect(mail[0].subject).toMatch(/Confirm your e-mail address/);
    const token = await linkToken(email, "/verify");
    expect(mail[0].html_body).toContain(`/verify?token=${token}`);
    // only a hash is stored
    const stored = await db.selectFrom("account_tokens").select("token_hash").where("user_id", "=", user!.id).execute();
    expect(stored.map((s) => s.token_hash)).not.toContain(token);

    const ok = await callRoute(verifyRoute.POST, "POST", { body: { token } });
    expect(ok.status).toBe(200);
    expect(ok.json).toEqual({ email });
    const signedIn = await verifyCredentials(db, email, PASSWORD);
    expect(signedIn?.email).toBe(email);

    const again = await callRoute(verifyRoute.POST, "POST", { body: { token } });
    expect(again.status).toBe(400);
    expect(paths(again.json)).toEqual(["token"]);
    expect(errorOf(again.json).message).toMatch(/already been used/);
  });

  it("refuses an expired confirmation link and an unknown one", async () => {
    const email = await registerPerson();
    const token = await linkToken(email, "/verify");
    const user = (await findUserByEmail(db, email))!;
    await db.updateTable("account_tokens").set({ expires_at: new Date(Date.now() - 1000) }).where("user_id", "=", user.id).execute();
    const expired = await callRoute(verifyRoute.POST, "POST", { body: { token } });
    expect(expired.status).toBe(400);
    expect(paths(expired.json)).toEqual(["token"]);
    expect(errorOf(expired.json).message).toMatch(/expired/);
    expect(await verifyCredentials(db, email, PASSWORD)).toBeNull();

    const unknown = await callRoute(verifyRoute.POST, "POST", { body: { token: "A".repeat(43) } });
    expect(unknown.status).toBe(400);
    expect(paths(unknown.json)).toEqual(["token"]);
  });

  it("says which field is wrong and refuses an address that already has an account", async () => {
    const bad = (body: Record<string, unknown>) =>
      callRoute(registerRoute.POST, "POST", {
        body: { name: "Ida Marsh", email: `x-${uniq()}@public.test`, password: PASSWORD, confirmPassword: PASSWORD, ...body },
      });
    const short = await bad({ password: "short", confirmPassword: "short" });
    expect(short.status).toBe(422);
    expect(paths(short.json)).toContain("password");
    const email = await bad({ email: "not-an-address" });
    expect(email.status).toBe(422);
    expect(paths(email.json)).toEqual(["email"]);
    const mismatch = await bad({ confirmPassword: "something-else-entirely" });
    expect(mismatch.status).toBe(422);
    expect(paths(mismatch.json)).toEqual(["confirmPassword"]);

    const taken = await callRoute(registerRoute.POST, "POST", {
      body: { name: "Someone", email: w.users.planner.email.toUpperCase(), password: PASSWORD, confirmPassword: PASSWORD },
    });
    expect(taken.status).toBe(409);
    expect(paths(taken.json)).toEqual(["email"]);
  });
});

describe("password reset by e-mail", () => {
  it("answers 202 for an unknown address and queues nothing", async () => {
    const nobody = `nobody-${uniq()}@public.test`;
    const res = await callRoute(resetRequestRoute.POST, "POST", { body: { email: nobody } });
    await drainAfterResponse(); // the route answers first and looks the address up afterwards
    expect(res.status).toBe(202);
    expect(await mailTo(nobody)).toHaveLength(0);
  });

  it("queues one link for a known address; the link sets the password once", async () => {
    // an account of its own: the reset ends its sessions, which later tests would otherwise use
    const u = await insertUser(db, { email: `resetter-${uniq()}@public.test`, name: "Resetter", password_hash: await hashPassword(WORLD_PASSWORD) });
    const res = await callRoute(resetRequestRoute.POST, "POST", { body: { email: u.email } });
    await drainAfterResponse(); // the route answers first and looks the address up afterwards
    expect(res.status).toBe(202);
    // the same answer as for an unknown address
    const unknown = await callRoute(resetRequestRoute.POST, "POST", { body: { email: `nobody-${uniq()}@public.test` } });
    await drainAfterResponse(); // the route answers first and looks the address up afterwards
    expect(res.json).toEqual(unknown.json);
    const mail = await mailTo(u.email);
    expect(mail).toHaveLength(1);
    expect(mail[0].subject).toMatch(/new Sagline password/);
    const token = await linkToken(u.email, "/reset-password");

    const newPassword = "a-brand-new-password";
    const short = await callRoute(resetConfirmRoute.POST, "POST", { body: { token, password: "short", confirmPassword: "short" } });
    expect(short.status).toBe(422);
    expect(paths(short.json)).toContain("password");

    const ok = await callRoute(resetConfirmRoute.POST, "POST", { body: { token, password: newPassword, confirmPassword: newPassword } });
    expect(ok.status).toBe(200);
    expect(await verifyCredentials(db, u.email, WORLD_PASSWORD)).toBeNull();
    expect((await verifyCredentials(db, u.email, newPassword))?.id).toBe(u.id);

    const again = await callRoute(resetConfirmRoute.POST, "POST", {
      body: { token, password: "yet-another-password", confirmPassword: "yet-another-password" },
    });
    expect(again.status).toBe(400);
    expect(paths(again.json)).toEqual(["token"]);
    expect((await verifyCredentials(db, u.email, newPassword))?.id).toBe(u.id);
  });

  it("a newer reset link retires the older one; resetting confirms an unconfirmed address", async () => {
    const email = await registerPerson();
    await callRoute(resetRequestRoute.POST, "POST", { body: { email } });
    await drainAfterResponse(); // the route answers first and looks the address up afterwards
    const first = await linkToken(email, "/reset-password");
    await callRoute(resetRequestRoute.POST, "POST", { body: { email } });
    await drainAfterResponse(); // the route answers first and looks the address up afterwards
    const second = await linkToken(email, "/reset-password");
    expect(second).not.toBe(first);
    const old = await callRoute(resetConfirmRoute.POST, "POST", { body: { token: first, password: PASSWORD, confirmPassword: PASSWORD } });
    expect(old.status).toBe(400);
    const pw = "reset-and-confirmed";
    const ok = await callRoute(resetConfirmRoute.POST, "POST", { body: { token: second, password: pw, confirmPassword: pw } });
    expect(ok.status).toBe(200);
    expect((await verifyCredentials(db, email, pw))?.email).toBe(email);
  });

  it("refuses an expired reset link", async () => {
    const u = w.users.target;
    await callRoute(resetRequestRoute.POST, "POST", { body: { email: u.email } });
    await drainAfterResponse(); // the route answers first and looks the address up afterwards
    const token = await linkToken(u.email, "/reset-password");
    await db.updateTable("account_tokens").set({ expires_at: new Date(Date.now() - 1) }).where("user_id", "=", u.id).execute();
    const res = await callRoute(resetConfirmRoute.POST, "POST", { body: { token, password: PASSWORD, confirmPassword: PASSWORD } });
    expect(res.status).toBe(400);
    expect(errorOf(res.json).message).toMatch(/expired/);
    expect(await verifyCredentials(db, u.email, WORLD_PASSWORD)).not.toBeNull();
  });
});

describe("invitations sent by leads", () => {
  const invite = (body: Record<string, unknown>, userId = w.users.lead.id, basinId = w.basinId) =>
    callRoute(invitationsRoute.POST, "POST", { userId, params: { basinId }, body });

  async function audit(action: string, targetId: string) {
    return db.selectFrom("audit_events").selectAll().where("action", "=", action).where("target_id", "=", targetId).execute();
  }

  it("a discharger invited with a facility creates the account and joins, linked to the facility", async () => {
    const email = `plant-contact-${uniq()}@public.test`;
    const sent = await invite({ email, role: "discharger", facilityId: w.facilityId });
    expect(sent.status, JSON.stringify(sent.json)).toBe(201);
    const inv = sent.json as { id: string; status: string; facilityId: string };
    expect(inv).toMatchObject({ status: "pending", facilityId: w.facilityId, role: "discharger" });
    expect(await audit("invitation.sent", inv.id)).toHaveLength(1);

    const list = await callRoute(invitationsRoute.GET, "GET", { userId: w.users.lead.id, params: { basinId: w.basinId } });
    expect((list.json as { id: string }[]).map((i) => i.id)).toContain(inv.id);

    const mail = await mailTo(email);
    expect(mail).toHaveLength(1);
    expect(mail[0].subject).toContain(`World`);
    const token = await linkToken(email, "/invite");

    const preview = await callRoute(previewRoute.GET, "GET", { params: { token } });
    expect(preview.status).toBe(200);
    expect(preview.json).toMatchObject({ email, role: "discharger", status: "pending", accountExists: false, basinId: w.basinId });

    const weak = await callRoute(inviteRegisterRoute.POST, "POST", {
      params: { token },
      body: { name: "Noor Vale", password: "short", confirmPassword: "short" },
    });
    expect(weak.status).toBe(422);
    expect(paths(weak.json)).toContain("password");

    const joined = await callRoute(inviteRegisterRoute.POST, "POST", {
      params: { token },
      body: { name: "Noor Vale", password: PASSWORD, confirmPassword: PASSWORD },
    });
    expect(joined.status, JSON.stringify(joined.json)).toBe(201);
    const user = (await findUserByEmail(db, email))!;
    expect(user.email_verified_at).not.toBeNull();
    expect((await verifyCredentials(db, email, PASSWORD))?.id).toBe(user.id);
    const membership = await db.selectFrom("memberships").select("role").where("basin_id", "=", w.basinId).where("user_id", "=", user.id).executeTakeFirst();
    expect(membership?.role).toBe("discharger");
    const link = await db.selectFrom("facility_users").select("facility_id").where("user_id", "=", user.id).execute();
    expect(link.map((l) => l.facility_id)).toEqual([w.facilityId]);
    expect(await audit("invitation.accepted", inv.id)).toHaveLength(1);
    const added = await audit("member.added", user.id);
    expect(added).toHaveLength(1);
    expect(added[0].details).toMatchObject({ role: "discharger", invitationId: inv.id });

    // accepting twice is refused, and the list no longer shows it
    const twice = await callRoute(inviteRegisterRoute.POST, "POST", {
      params: { token },
      body: { name: "Noor Vale", password: PASSWORD, confirmPassword: PASSWORD },
    });
    expect(twice.status).toBe(409);
    expect(errorOf(twice.json).message).toMatch(/already been accepted/);
    const asMember = await callRoute(acceptRoute.POST, "POST", { userId: user.id, params: { token } });
    expect(asMember.status).toBe(409);
    const after = await callRoute(invitationsRoute.GET, "GET", { userId: w.users.lead.id, params: { basinId: w.basinId } });
    expect((after.json as { id: string }[]).map((i) => i.id)).not.toContain(inv.id);
  });

  it("an existing account accepts while signed in as the invited address; another account is refused", async () => {
    const guest = await insertUser(db, { email: `guest-${uniq()}@public.test`, name: "Guest Reader", password_hash: "x" });
    const sent = await invite({ email: guest.email, role: "stakeholder" });
    expect(sent.status).toBe(201);
    const token = await linkToken(guest.email, "/invite");
    expect((await callRoute(previewRoute.GET, "GET", { params: { token } })).json).toMatchObject({ accountExists: true });

    const anon = await callRoute(acceptRoute.POST, "POST", { params: { token } });
    expect(anon.status).toBe(401);
    const wrong = await callRoute(acceptRoute.POST, "POST", { userId: w.users.outsider.id, params: { token } });
    expect(wrong.status).toBe(403);
    expect(errorOf(wrong.json).message).toContain(`sent to ${guest.email}`);
    expect(errorOf(wrong.json).message).toContain(w.users.outsider.email);
    // creating an account for an address that has one is refused too
    const dup = await callRoute(inviteRegisterRoute.POST, "POST", {
      params: { token },
      body: { name: "Guest", password: PASSWORD, confirmPassword: PASSWORD },
    });
    expect(dup.status).toBe(409);

    const ok = await callRoute(acceptRoute.POST, "POST", { userId: guest.id, params: { token } });
    expect(ok.status).toBe(200);
    expect(ok.json).toEqual({ basinId: w.basinId, email: guest.email, role: "stakeholder" });
    const membership = await db.selectFrom("memberships").select("role").where("basin_id", "=", w.basinId).where("user_id", "=", guest.id).executeTakeFirst();
    expect(membership?.role).toBe("stakeholder");
    expect(await audit("member.added", guest.id)).toHaveLength(1);
  });

  it("a revoked invitation cannot be accepted; revoking is audited and happens once", async () => {
    const email = `revoked-${uniq()}@public.test`;
    const sent = await invite({ email, role: "planner" });
    const id = (sent.json as { id: string }).id;
    const token = await linkToken(email, "/invite");
    const del = await callRoute(invitationRoute.DELETE, "DELETE", { userId: w.users.lead.id, params: { basinId: w.basinId, invitationId: id } });
    expect(del.status).toBe(204);
    expect(await audit("invitation.revoked", id)).toHaveLength(1);
    const again = await callRoute(invitationRoute.DELETE, "DELETE", { userId: w.users.lead.id, params: { basinId: w.basinId, invitationId: id } });
    expect(again.status).toBe(409);
    const res = await callRoute(inviteRegisterRoute.POST, "POST", {
      params: { token },
      body: { name: "Late Comer", password: PASSWORD, confirmPassword: PASSWORD },
    });
    expect(res.status).toBe(409);
    expect(errorOf(res.json).message).toMatch(/withdrawn/);
    expect(await findUserByEmail(db, email)).toBeUndefined();
    expect((await callRoute(previewRoute.GET, "GET", { params: { token } })).json).toMatchObject({ status: "revoked" });
  });

  it("an expired invitation cannot be accepted", async () => {
    const email = `expired-${uniq()}@public.test`;
    const sent = await invite({ email, role: "stakeholder" });
    const token = await linkToken(email, "/invite");
    await db.updateTable("invitations").set({ expires_at: new Date(Date.now() - 1) }).where("id", "=", (sent.json as { id: string }).id).execute();
    const res = await callRoute(inviteRegisterRoute.POST, "POST", {
      params: { token },
      body: { name: "Late Comer", password: PASSWORD, confirmPassword: PASSWORD },
    });
    expect(res.status).toBe(409);
    expect(errorOf(res.json).message).toMatch(/expired/);
  });

  it("only those who manage members may invite", async () => {
    for (const key of ["planner", "discharger", "stakeholder", "outsider"] as const) {
      const res = await invite({ email: `nope-${uniq()}@public.test`, role: "stakeholder" }, w.users[key].id);
      expect(res.status, key).toBe(403);
    }
    const anon = await callRoute(invitationsRoute.POST, "POST", {
      params: { basinId: w.basinId },
      body: { email: `nope-${uniq()}@public.test`, role: "stakeholder" },
    });
    expect(anon.status).toBe(401);
  });

  it("names the field at fault in a bad invitation", async () => {
    const noFacility = await invite({ email: `d-${uniq()}@public.test`, role: "discharger" });
    expect(noFacility.status).toBe(422);
    expect(paths(noFacility.json)).toEqual(["facilityId"]);
    const unknownFacility = await invite({ email: `d-${uniq()}@public.test`, role: "discharger", facilityId: crypto.randomUUID() });
    expect(unknownFacility.status).toBe(422);
    expect(paths(unknownFacility.json)).toEqual(["facilityId"]);
    const facilityForStakeholder = await invite({ email: `s-${uniq()}@public.test`, role: "stakeholder", facilityId: w.facilityId });
    expect(facilityForStakeholder.status).toBe(422);
    expect(paths(facilityForStakeholder.json)).toEqual(["facilityId"]);
    const badEmail = await invite({ email: "not-an-address", role: "stakeholder" });
    expect(badEmail.status).toBe(422);
    expect(paths(badEmail.json)).toEqual(["email"]);
    const badRole = await invite({ email: `r-${uniq()}@public.test`, role: "owner" });
    expect(badRole.status).toBe(422);
    expect(paths(badRole.json)).toEqual(["role"]);
    const member = await invite({ email: w.users.planner.email, role: "stakeholder" });
    expect(member.status).toBe(409);
    expect(paths(member.json)).toEqual(["email"]);
    const email = `twice-${uniq()}@public.test`;
    expect((await invite({ email, role: "stakeholder" })).status).toBe(201);
    const twice = await invite({ email, role: "stakeholder" });
    expect(twice.status).toBe(409);
    expect(paths(twice.json)).toEqual(["email"]);
    // a facility of another basin is not this basin's
    const other = await db.insertInto("facilities").values({ basin_id: w.otherBasinId, name: "Elsewhere", permit_id: `E-${uniq()}` }).returning("id").executeTakeFirstOrThrow();
    const foreign = await invite({ email: `f-${uniq()}@public.test`, role: "discharger", facilityId: other.id });
    expect(foreign.status).toBe(422);
    expect(paths(foreign.json)).toEqual(["facilityId"]);
  });

  it("an unknown or malformed invitation link is not found", async () => {
    expect((await callRoute(previewRoute.GET, "GET", { params: { token: "B".repeat(43) } })).status).toBe(404);
    expect((await callRoute(previewRoute.GET, "GET", { params: { token: "short" } })).status).toBe(404);
  });
});

describe("following a basin", () => {
  const follow = (method: "GET" | "PUT" | "DELETE", userId: string | undefined, basinId = w.basinId) =>
    callRoute(followRoute[method], method, { userId, params: { basinId } });

  it("any signed-in person follows and unfollows; followers with a confirmed address get notices", async () => {
    expect((await follow("GET", w.users.outsider.id)).json).toEqual({ basinId: w.basinId, followed: false });
    expect((await follow("PUT", w.users.outsider.id)).json).toEqual({ basinId: w.basinId, followed: true });
    expect((await follow("PUT", w.users.outsider.id)).status).toBe(200);
    expect((await follow("GET", w.users.outsider.id)).json).toEqual({ basinId: w.basinId, followed: true });
    expect((await follow("PUT", w.users.stakeholder.id)).status).toBe(200);

    const unconfirmed = await insertUser(db, {
      email: `unconfirmed-${uniq()}@public.test`,
      name: "Not Yet",
      password_hash: "x",
      email_verified_at: null,
    });
    expect((await follow("PUT", unconfirmed.id)).status).toBe(200);

    const followers = await basinFollowersWithEmail(db, w.basinId);
    expect(followers.map((f) => f.id).sort()).toEqual([w.users.outsider.id, w.users.stakeholder.id].sort());
    expect(followers[0]).toEqual({ id: expect.any(String), name: expect.any(String), email: expect.stringContaining("@") });
    expect(await basinFollowersWithEmail(db, w.otherBasinId)).toEqual([]);

    expect((await follow("DELETE", w.users.outsider.id)).json).toEqual({ basinId: w.basinId, followed: false });
    expect((await follow("DELETE", w.users.outsider.id)).status).toBe(200);
    expect((await basinFollowersWithEmail(db, w.basinId)).map((f) => f.id)).toEqual([w.users.stakeholder.id]);
  });

  it("signed out: 401; an unknown basin: 404", async () => {
    expect((await follow("PUT", undefined)).status).toBe(401);
    expect((await follow("PUT", w.users.outsider.id, crypto.randomUUID())).status).toBe(404);
    expect((await follow("GET", w.users.outsider.id, "not-a-uuid")).status).toBe(404);
  });
});
