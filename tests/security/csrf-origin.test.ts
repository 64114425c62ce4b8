import { describe, expect, it } from "vitest";
import * as registerRoute from "@/app/api/account/register/route";
import { callRoute } from "../support/call-route";
import { err } from "../support/errors";
import { fileDb } from "../support/file-db";

// CSRF-style posts: a write whose Origin is another site, or that the browser
// marks cross-site, is refused before anything else happens.
fileDb();
const body = { name: "Origin Test", email: `origin-${Date.now()}@example.test`, password: "a-long-enough-password-1", passwordConfirm: "a-long-enough-password-1" };

describe("writes from another origin", () => {
  it("are refused with 403 naming the Origin when it is foreign", async () => {
    for (const origin of ["https://evil.example", "http://127.0.0.1.evil.example", "null"]) {
      const res = await callRoute(registerRoute.POST, "POST", { body, headers: { origin, host: "127.0.0.1:3000" } });
      expect(res.status, origin).toBe(403);
      expect(err(res.json).details![0].path).toBe("Origin");
    }
  });

  it("are refused when the browser says cross-site and sends no Origin", async () => {
    const res = await callRoute(registerRoute.POST, "POST", { body, headers: { "sec-fetch-site": "cross-site", host: "127.0.0.1:3000" } });
    expect(res.status).toBe(403);
  });

  it("pass from the app's own origin (they then meet the route's own checks)", async () => {
    const res = await callRoute(registerRoute.POST, "POST", { body: { email: "not-an-address" }, headers: { origin: "http://127.0.0.1:3000", host: "127.0.0.1:3000" } });
    expect(res.status).toBe(422);
  });
});
