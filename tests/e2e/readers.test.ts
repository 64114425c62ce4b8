import { mkdirSync } from "node:fs";
import { randomBytes } from "node:crypto";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { createDb, type Db } from "@/db/client";
import { findUserByEmail, markUserVerified } from "@/db/queries/users";
import { stopBoss } from "@/lib/jobs/queue";
import type { ModelFile, RunResult } from "@/lib/model";
import { downstreamOf, profileSeries } from "@/lib/results/profile-series";
import { runConditions } from "@/lib/results/run-conditions";
import { register } from "@/lib/services/accounts";
import { DEMO_PERMIT, readerBasin, readerPlan } from "../support/reader-plans";
import { buildWorld, WORLD_PASSWORD, type World } from "../support/world";
import { launchBrowser, signInAs } from "./support/browser";

/**
 * The readers of plans, in the browser: a discharger's My facilities under a plan with two
 * critical conditions (the governing one named, with its figure) and after a later version
 * is proposed (it stays on the published plan), and a self-registered account's landing page.
 */
const baseUrl = inject("baseUrl");
const SHOTS = "test-results/screens";
const WIDE = { width: 1440, height: 900 };
const NARROW = { width: 390, height: 844 };
let browser: Browser;
let db: Db;
let w: World;
let published: string;
let later: string;

const TWO_CONDITIONS = [{ name: "Design low flow" }, { name: "Hot, dry 7Q10", temperatureC: 27 }];

async function pageAs(email: string, password: string, viewport = WIDE): Promise<Page> {
  const page = await browser.newPage({ viewport });
  await signInAs(page, baseUrl, email, password);
  return page;
}

/** The lowest DO below DP-1001's outfall under each condition of the plan's run, as the page must show it (2 decimals). */
async function expectedBelowOutfall(planId: string) {
  const row = await db.selectFrom("plans").select("snapshot").where("id", "=", planId).executeTakeFirstOrThrow();
  const s = row.snapshot as unknown as { run: { result: { conditions: { name: string; run: RunResult }[] }; modelFiles: { file: ModelFile }[] } };
  const model = s.run.modelFiles[0].file;
  const reach = model.dischargers.find((d) => d.id === DEMO_PERMIT)!.reach;
  const figures = s.run.result.conditions.map((c) => downstreamOf(profileSeries(c.run, model, reach, "SI"), DEMO_PERMIT)!.lowest!.do_mg_l.toFixed(2));
  return { governing: runConditions(s.run.result).governing, names: s.run.result.conditions.map((c) => c.name), figures };
}

beforeAll(async () => {
  mkdirSync(SHOTS, { recursive: true });
  process.env.DATABASE_URL = inject("e2eDatabaseUrl");
  db = createDb(inject("e2eDatabaseUrl"), 2);
  w = await buildWorld(db);
  await readerBasin(db, w);
  ({ planId: published } = await readerPlan(db, w, { stage: "published", conditions: TWO_CONDITIONS, title: "Tamsel River DO plan" }));
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await stopBoss();
  await db?.destroy();
});

describe("a discharger's My facilities", () => {
  it("shows DO below the outfall under the governing condition of a two-condition plan, named, with the other a choice away", async () => {
    const expected = await expectedBelowOutfall(published);
    // the hot condition governs, and its figure differs from the first condition's: showing the first would fail here
    expect(expected.names[expected.governing]).toBe("Hot, dry 7Q10");
    expect(expected.figures[0]).not.toBe(expected.figures[1]);
    const page = await pageAs(w.users.discharger.email, WORLD_PASSWORD);
    await page.goto(`${baseUrl}/basins/${w.basinId}/my-facilities`);
    const own = page.getByRole("region", { name: /Facility Quillford Water Reclamation Plant/ });
    await own.getByTestId("profile-chart").locator("svg path").first().waitFor();
    expect(await own.getByTestId("below-outfall-condition").textContent()).toMatch(/Under Hot, dry 7Q10, the condition that governs the plan \(lowest DO of its 2 critical conditions\)/);
    expect(await own.getByTestId("lowest-below-outfall").textContent()).toContain(`${expected.figures[1]} mg/L`);
    await page.screenshot({ path: `${SHOTS}/my-facilities-governing-1440.png`, fullPage: true });
    // the other condition, chosen
    await own.getByLabel("Critical condition").selectOption({ label: "Design low flow" });
    await own.getByTestId("lowest-below-outfall").filter({ hasText: `${expected.figures[0]} mg/L` }).waitFor();
    expect(await own.getByTestId("below-outfall-condition").textContent()).toMatch(/the governing one is Hot, dry 7Q10/);
    await page.close();
  });

  it("stays on the published plan after a later version is proposed, with every version named by state and date", async () => {
    ({ planId: later } = await readerPlan(db, w, { stage: "open", conditions: TWO_CONDITIONS, title: "Tamsel River DO plan, revised" }));
    for (const [viewport, name] of [
      [WIDE, "1440"],
      [NARROW, "390"],
    ] as const) {
      const page = await pageAs(w.users.discharger.email, WORLD_PASSWORD, viewport);
      await page.goto(`${baseUrl}/basins/${w.basinId}/my-facilities`);
      const shown = page.getByTestId("my-plan-shown");
      await shown.waitFor();
      expect(await shown.textContent()).toMatch(/Published \d{1,2} \w{3} \d{4} — version \d+ \(final\) — the plan that governs your allocation/);
      expect(await shown.getByRole("link").getAttribute("href")).toBe(`/basins/${w.basinId}/plans/${published}`);
      const versions = await page.getByTestId("my-plan-versions").locator("li").allTextContents();
      expect(versions).toHaveLength(2);
      expect(versions[0]).toMatch(/^In review until \d{1,2} \w{3} \d{4} — version \d+/);
      expect(versions[1]).toMatch(/^Published \d{1,2} \w{3} \d{4} — version \d+ \(final\)/);
      await page.getByText("A later version is proposed").waitFor();
      await page.getByTestId("profile-chart").locator("svg path").first().waitFor();
      await page.screenshot({ path: `${SHOTS}/my-facilities-published-${name}.png`, fullPage: true });
      if (name === "1440") {
        // the later version, one click away, says it is not the one in force
        await page.getByTestId("my-plan-versions").getByRole("link", { name: /In review until/ }).click();
        await page.waitForURL(new RegExp(`plan=${later}$`));
        await page.getByText("Not the plan that governs").waitFor();
      }
      await page.close();
    }
  });
});

describe("a self-registered account outside every basin", () => {
  it("lands on the plans under review and published, and can follow a basin", async () => {
    const email = `reader-${randomBytes(4).toString("hex")}@example.test`;
    const password = "otter-holt-2027";
    await register(db, { name: "Corin Ashdown", email, password, confirmPassword: password });
    const user = (await findUserByEmail(db, email))!;
    // (the e-mailed confirmation link is tested in accounts.test.ts)
    await markUserVerified(db, user.id, new Date());
    for (const [viewport, name] of [
      [WIDE, "1440"],
      [NARROW, "390"],
    ] as const) {
      const page = await pageAs(email, password, viewport);
      await page.getByTestId("reader-landing").waitFor();
      expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe("Plans you can read and comment on");
      expect(await page.locator("body").textContent()).not.toMatch(/once an administrator has created your account/);
      // other test files' plans are listed too (and may share a title): this world's plan by its link
      expect(await page.getByTestId("reader-reviews").locator(`a[href="/reviews/${w.basinId}/${later}"]`).textContent()).toBe("Tamsel River DO plan, revised");
      expect(await page.getByTestId("reader-published").getByRole("link", { name: "Tamsel River DO plan" }).first().getAttribute("href")).toMatch(/^\/published\//);
      const follow = page.getByRole("listitem", { name: `Follow ${(await db.selectFrom("basins").select("name").where("id", "=", w.basinId).executeTakeFirstOrThrow()).name}` });
      await page.screenshot({ path: `${SHOTS}/basins-public-account-${name}.png`, fullPage: true });
      if (name === "1440") {
        await follow.getByRole("button", { name: "Follow this basin" }).click();
        await follow.getByRole("button", { name: "Unfollow" }).waitFor();
      } else {
        await follow.getByRole("button", { name: "Unfollow" }).waitFor();
      }
      await page.close();
    }
  });

  it("reads a plan under review with a map of its facilities", async () => {
    const page = await pageAs(w.users.outsider.email, WORLD_PASSWORD);
    await page.goto(`${baseUrl}/reviews/${w.basinId}/${later}`);
    const map = page.getByRole("region", { name: "Map of the facilities" });
    await map.locator('[data-testid="basin-map"][data-ready="true"]').waitFor({ timeout: 30_000 });
    const names = await map.getByTestId("map-facilities").locator("li").allTextContents();
    expect(names).toHaveLength(5);
    expect(names.join(" ")).toContain("Quillford Water Reclamation Plant");
    await page.screenshot({ path: `${SHOTS}/review-map-1440.png`, fullPage: true });
    await page.close();
    const narrow = await pageAs(w.users.outsider.email, WORLD_PASSWORD, NARROW);
    await narrow.goto(`${baseUrl}/reviews/${w.basinId}/${later}`);
    await narrow.locator('[data-testid="basin-map"][data-ready="true"]').waitFor({ timeout: 30_000 });
    // nothing of the map and its list is wider than the phone
    const wide = await narrow.getByRole("region", { name: "Map of the facilities" }).evaluate((el) => el.getBoundingClientRect().right);
    expect(wide).toBeLessThanOrEqual(NARROW.width);
    await narrow.screenshot({ path: `${SHOTS}/review-map-390.png`, fullPage: true });
    await narrow.close();
  });
});
