import { readFileSync, truncateSync } from "node:fs";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { DEMO_USERS } from "@/db/seed/demo-data";
import { launchBrowser, signInAs } from "./support/browser";

/**
 * What one request asks of the database, counted on the production server itself: it writes
 * every statement's SQL text to its SQL log (SAGLINE_SQL_LOG, db/client.ts), which this file
 * empties before a request and reads after it. Browser test files run one at a time and the
 * background worker is another process with no log, so the lines are this request's.
 */
const baseUrl = inject("baseUrl");
const sqlLog = inject("sqlLog");

// The basin+role read: route()'s one query (the account, the basin and the role) or the pages'
// scope read (the basin and the role, beside the session's account read).
const BASIN_ROLE = [/from "users" as "u" left join "basins"/, /from "basins" left join "memberships" as "m" on .* where "basins"\."id" = /];
const ACCOUNT = [/from "users" as "u" left join "basins"/, /^select \* from "users" where "id" = \$1$/];

async function statementsOf(request: () => Promise<void>): Promise<string[]> {
  truncateSync(sqlLog, 0);
  await request();
  return readFileSync(sqlLog, "utf8").split("\n").filter(Boolean);
}
const count = (lines: string[], patterns: RegExp[]) => lines.filter((l) => patterns.some((p) => p.test(l))).length;

let browser: Browser;
let planner: Page;
let basinId: string;
let runId: string;

beforeAll(async () => {
  browser = await launchBrowser();
  planner = await (await browser.newContext()).newPage();
  const who = DEMO_USERS.find((u) => u.key === "planner")!;
  await signInAs(planner, baseUrl, who.email, who.password);
  // the tab leaves the app, so nothing it loads in the background lands in the log; its cookies stay
  await planner.goto("about:blank");
  const basins = (await (await planner.request.get(`${baseUrl}/api/basins`)).json()) as { id: string; slug: string }[];
  basinId = basins.find((b) => b.slug === "tamsel-river")!.id;
  const scenarios = (await (await planner.request.get(`${baseUrl}/api/basins/${basinId}/scenarios`)).json()) as { id: string }[];
  // a model run of the demo's first scenario (an earlier identical run is handed back when there is one)
  const res = await planner.request.post(`${baseUrl}/api/basins/${basinId}/scenarios/${scenarios[0].id}/runs`, { data: { kind: "model" } });
  expect(res.status()).toBeLessThan(300);
  runId = ((await res.json()) as { id: string }).id;
  const deadline = Date.now() + 60_000;
  for (;;) {
    const s = (await (await planner.request.get(`${baseUrl}/api/basins/${basinId}/runs/${runId}/status`)).json()) as { status: string };
    if (s.status === "done") break;
    if (s.status === "failed" || Date.now() > deadline) throw new Error(`run ${runId} ended ${s.status}`);
    await planner.waitForTimeout(300);
  }
});

afterAll(async () => {
  await browser?.close();
});

describe("database reads per request (the production server's own SQL log)", () => {
  it("the run API reads the account, basin and role in one statement, and a finished run again with nothing else", async () => {
    const first = await statementsOf(async () => {
      const res = await planner.request.get(`${baseUrl}/api/basins/${basinId}/runs/${runId}`);
      expect(res.status()).toBe(200);
    });
    expect(count(first, BASIN_ROLE), first.join("\n")).toBe(1);
    expect(count(first, ACCOUNT), first.join("\n")).toBe(1);
    // a finished run is final: once this process has read it, the scope's one statement is all
    const again = await statementsOf(async () => {
      const res = await planner.request.get(`${baseUrl}/api/basins/${basinId}/runs/${runId}`);
      expect(res.status()).toBe(200);
    });
    expect(again, again.join("\n")).toHaveLength(1);
    expect(count(again, BASIN_ROLE)).toBe(1);
  });

  it("the run page (layout and page together) reads the signed-in account once and the basin and role once", async () => {
    const lines = await statementsOf(async () => {
      const res = await planner.request.get(`${baseUrl}/basins/${basinId}/runs/${runId}`);
      expect(res.status()).toBe(200);
      expect(await res.text()).toContain("Exports and methods");
    });
    expect(count(lines, BASIN_ROLE), lines.join("\n")).toBe(1);
    expect(count(lines, ACCOUNT), lines.join("\n")).toBe(1);
  });

  it("a finished run kept by the process is still refused to a member whose role may not read runs", async () => {
    const stakeholder = await (await browser.newContext()).newPage();
    const who = DEMO_USERS.find((u) => u.key === "stakeholder")!;
    await signInAs(stakeholder, baseUrl, who.email, who.password);
    await stakeholder.goto("about:blank");
    const lines = await statementsOf(async () => {
      const res = await stakeholder.request.get(`${baseUrl}/api/basins/${basinId}/runs/${runId}`);
      expect(res.status()).toBe(403);
    });
    expect(lines, lines.join("\n")).toHaveLength(1);
    expect(count(lines, BASIN_ROLE)).toBe(1);
  });
});
