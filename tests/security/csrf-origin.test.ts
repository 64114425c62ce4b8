import { describe, expect, it } from "vitest";
import * as registerRoute from "@/app/api/account/register/route";
import * as scenariosRoute from "@/app/api/basins/[basinId]/scenarios/route";
import { callRoute } from "../support/call-route";
import { err } from "../support/errors";
import { fileDb } from "../support/file-db";

// CSRF-style posts: a write whose Origin is another site, or (without Origin)
// whose Referer or Sec-Fetch-Site says so, is refused before anything else happens.
fileDb();
const body = { name: "Origin Test", email: `origin-${Date.now()}@example.test`, password: "a-long-enough-password-1", passwordConfirm: "a-long-enough-password-1" };
const bad = { email: "not-an-address" };
const at = (headers: Record<string, string | null>) => ({ host: "127.0.0.1:3000", ...headers });

describe("writes from another origin", () => {
  it("are refused with 403 naming the Origin when it is foreign, a sibling port or sub-domain included", async () => {
    for (const origin of ["https://evil.example", "http://127.0.0.1.evil.example", "http://127.0.0.1:3001", "https://127.0.0.1:3000", "null"]) {
      const res = await callRoute(registerRoute.POST, "POST", { body, headers: at({ origin }) });
      expect(res.status, origin).toBe(403);
      expect(err(res.json).details![0].path).toBe("Origin");
    }
  });

  it("are refused without Origin when the Referer is another site", async () => {
    const res = await callRoute(registerRoute.POST, "POST", { body, headers: at({ origin: null, "sec-fetch-site": null, referer: "https://evil.example/page" }) });
    expect(res.status).toBe(403);
    expect(err(res.json).details![0]).toMatchObject({ path: "Referer", message: "https://evil.example" });
  });

  it("are refused without Origin or Referer when the browser says cross-site or same-site", async () => {
    for (const site of ["cross-site", "same-site"]) {
      const res = await callRoute(registerRoute.POST, "POST", { body, headers: at({ origin: null, "sec-fetch-site": site }) });
      expect(res.status, site).toBe(403);
      expect(err(res.json).details![0].path).toBe("Sec-Fetch-Site");
    }
  });

  it("are refused on signed-in routes too, before the session is looked at", async () => {
    const res = await callRoute(scenariosRoute.POST, "POST", { params: { basinId: "b" }, body: { name: "x" }, headers: at({ origin: "https://evil.example" }) });
    expect(res.status).toBe(403);
  });

  it("pass from the app's own origin, by Origin, by Referer or from a client sending neither (they then meet the route's own checks)", async () => {
    const own = [
      at({ origin: "http://127.0.0.1:3000" }),
      at({ origin: null, referer: "http://127.0.0.1:3000/register" }),
      at({ origin: null, "sec-fetch-site": null }),
      // NEXTAUTH_URL's origin is the app's whatever Host a proxy passes on
      { host: "internal:8080", origin: new URL(process.env.NEXTAUTH_URL ?? "http://127.0.0.1:3000").origin },
    ];
    for (const headers of own) {
      const res = await callRoute(registerRoute.POST, "POST", { body: bad, headers });
      expect(res.status, JSON.stringify(headers)).toBe(422);
    }
  });

  it("do not affect reads: a GET from another origin is answered as usual", async () => {
    const res = await callRoute(scenariosRoute.GET, "GET", { params: { basinId: "b" }, headers: { origin: "https://evil.example" } });
    expect(res.status).toBe(401);
  });
});
