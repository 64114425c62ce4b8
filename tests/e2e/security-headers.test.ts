import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { createDb, type Db } from "@/db/client";
import { DEMO_USERS } from "@/db/seed/demo-data";
import { stopBoss } from "@/lib/jobs/queue";
import { launchBrowser, signInAs } from "./support/browser";
import { inkPixels } from "./support/pixels";
import { planAt } from "../support/plan-fixture";
import { buildWorld } from "../support/world";

// The production server's Content-Security-Policy must leave every page working:
// the map pages (maplibre's worker, canvas and images), sign-in (next-auth's own
// CSRF token and form) and writes from the app's own pages (Origin checked).
const baseUrl = inject("baseUrl");
let browser: Browser;
let db: Db;
let publishedUrl: string;

beforeAll(async () => {
  process.env.DATABASE_URL = inject("e2eDatabaseUrl");
  db = createDb(inject("e2eDatabaseUrl"), 2);
  const w = await buildWorld(db);
  const { planId } = await planAt(db, w, "published");
  publishedUrl = `${baseUrl}/published/${w.basinId}/${planId}`;
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await stopBoss();
  await db?.destroy();
});

/** A page that records every CSP violation and every console error. */
async function watchedPage(): Promise<{ page: Page; problems: string[] }> {
  const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  const problems: string[] = [];
  await page.exposeFunction("__cspViolation", (s: string) => problems.push(`violation: ${s}`));
  await page.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (e) =>
      (window as unknown as { __cspViolation: (s: string) => void }).__cspViolation(`${e.violatedDirective} ${e.blockedURI} at ${e.sourceFile}:${e.lineNumber}:${e.columnNumber}`),
    );
  });
  page.on("console", (m) => {
    // a 4xx the test provokes on purpose is logged by Chromium as a failed resource; nothing else may be
    if (/Failed to load resource: the server responded with a status of 4\d\d/.test(m.text())) return;
    if (m.type() === "error" || /Content Security Policy/i.test(m.text())) problems.push(`console: ${m.text()}`);
  });
  page.on("pageerror", (e) => problems.push(`pageerror: ${e.message}`));
  return { page, problems };
}

describe("security headers in the production server", () => {
  it("are sent on pages and API answers", async () => {
    for (const path of ["/", "/signin", "/api/health"]) {
      const res = await fetch(`${baseUrl}${path}`);
      const csp = res.headers.get("content-security-policy") ?? "";
      expect(csp, path).toContain("frame-ancestors 'none'");
      expect(csp, path).not.toContain("unsafe-eval");
      expect(res.headers.get("x-frame-options"), path).toBe("DENY");
      expect(res.headers.get("x-content-type-options"), path).toBe("nosniff");
      expect(res.headers.get("referrer-policy"), path).toBe("strict-origin-when-cross-origin");
      expect(res.headers.get("permissions-policy"), path).toContain("camera=()");
    }
  });

  it("a published plan's map draws, signed out, with no CSP violation or console error", async () => {
    const { page, problems } = await watchedPage();
    await page.goto(publishedUrl);
    await page.getByTestId("public-plan").waitFor();
    const map = '[aria-label="Map of dissolved oxygen"] [data-ready="true"]';
    await page.locator(map).waitFor({ timeout: 30_000 });
    expect(await inkPixels(page, map)).toBeGreaterThan(2000);
    // a CSV built in the browser is a blob: download
    const download = page.waitForEvent("download");
    await page.getByRole("button", { name: "Download profile CSV" }).first().click();
    await download;
    expect(problems).toEqual([]);
    await page.close();
  });

  it("sign-in, the basin map and a write from the app's own page work under the policy", async () => {
    const { page, problems } = await watchedPage();
    const planner = DEMO_USERS.find((u) => u.key === "planner")!;
    await signInAs(page, baseUrl, planner.email, planner.password);
    const basins = (await (await page.request.get(`${baseUrl}/api/basins`)).json()) as { id: string; slug: string }[];
    const basinId = basins.find((b) => b.slug === "tamsel-river")!.id;
    await page.goto(`${baseUrl}/basins/${basinId}/network`);
    await page.locator('[data-testid="basin-map"][data-ready="true"]').waitFor({ timeout: 30_000 });
    expect(await inkPixels(page, '[data-testid="basin-map"]')).toBeGreaterThan(2000);
    // the browser sends its Origin with a write; the app's own is accepted (422: the route's own check)
    const status = await page.evaluate(async (id) => {
      const res = await fetch(`/api/basins/${id}/scenarios`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({}) });
      return res.status;
    }, basinId);
    expect(status).toBe(422);
    expect(problems).toEqual([]);
    await page.close();
  });
});
