import { beforeAll, describe, expect, it } from "vitest";
import * as sessionRoute from "@/app/api/me/session/route";
import { callRoute } from "../support/call-route";
import { fileDb } from "../support/file-db";
import { buildWorld, type World } from "../support/world";

/** GET /api/me/session: what the shared pages' header shows, asked from the browser. */
const db = fileDb();
let w: World;
beforeAll(async () => {
  w = await buildWorld(db);
});

describe("who is signed in, for the header of shared pages", () => {
  it("names a signed-in reader and nothing else of the account; says signed out otherwise, without refusing", async () => {
    const me = await callRoute(sessionRoute.GET, "GET", { userId: w.users.stakeholder.id });
    expect(me.status).toBe(200);
    expect(me.json).toEqual({ signedIn: true, name: w.users.stakeholder.name });
    expect(me.headers.get("cache-control")).toBe("private, no-store");
    const out = await callRoute(sessionRoute.GET, "GET");
    expect(out.status).toBe(200);
    expect(out.json).toEqual({ signedIn: false });
    const forged = await callRoute(sessionRoute.GET, "GET", { headers: { cookie: "next-auth.session-token=not-a-token" } });
    expect(forged.json).toEqual({ signedIn: false });
  });

  it("a session ended elsewhere (signed out everywhere, password changed) reads as signed out at once", async () => {
    await db.updateTable("users").set((eb) => ({ session_version: eb("session_version", "+", 1) })).where("id", "=", w.users.planner.id).execute();
    const me = await callRoute(sessionRoute.GET, "GET", { userId: w.users.planner.id });
    expect(me.json).toEqual({ signedIn: false });
  });
});
