import { mkdirSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { DEMO_SURVEY } from "@/lib/services/demo";
import { demoUserPage, launchBrowser, noSidewaysScroll } from "./support/browser";

const baseUrl = inject("baseUrl");
const SHOTS = "test-results/screens";
let browser: Browser;
let basinId: string;

const signedIn = (key: string, width: number): Promise<Page> => demoUserPage(browser, baseUrl, key, width);

beforeAll(async () => {
  mkdirSync(SHOTS, { recursive: true });
  browser = await launchBrowser();
  const page = await signedIn("planner", 1440);
  const basins = (await (await page.request.get(`${baseUrl}/api/basins`)).json()) as { id: string; slug: string }[];
  basinId = basins.find((b) => b.slug === "tamsel-river")!.id;
  await page.context().close();
});

afterAll(async () => {
  await browser?.close();
});

describe("synoptic surveys", () => {
  it("a planner reads the demo survey: every station placed on its reach with its distance, at 1440 and 390 px", async () => {
    for (const width of [1440, 390]) {
      const page = await signedIn("planner", width);
      await page.goto(`${baseUrl}/basins/${basinId}`);
      await page.getByRole("link", { name: "Surveys" }).click();
      await page.waitForURL(`${baseUrl}/basins/${basinId}/surveys`);
      const table = page.getByTestId("survey-table");
      await expect.poll(() => table.textContent()).toContain(DEMO_SURVEY.fields.name);
      expect(await noSidewaysScroll(page)).toBe(true);
      await page.screenshot({ path: `${SHOTS}/surveys-${width}.png`, fullPage: true });
      await table.getByRole("link", { name: DEMO_SURVEY.fields.name }).click();
      await page.waitForURL(/\/surveys\/[0-9a-f-]{36}$/);
      const rows = page.getByTestId("survey-samples").locator("tbody tr");
      await expect.poll(() => rows.count()).toBe(16);
      expect(await rows.first().textContent()).toContain("TR-01");
      expect(await rows.last().textContent()).toContain("TR-08");
      expect(await page.getByTestId("survey-placement").textContent()).toMatch(/16 by their coordinates \(nearest reach, within 500 m; the farthest \d+ (m|ft) off its reach\), 0 at the reach and km/);
      expect(await page.getByTestId("survey-provenance").textContent()).toMatch(/16 samples at 16 stations · taken 2026-08-12 08:15 to 17:00/);
      expect(await noSidewaysScroll(page)).toBe(true);
      await page.screenshot({ path: `${SHOTS}/survey-detail-${width}.png`, fullPage: true });
      await page.context().close();
    }
  });

  it("a planner's file with rows it cannot use is refused whole, each row named; a good one is saved and shown", async () => {
    const page = await signedIn("planner", 1440);
    await page.goto(`${baseUrl}/basins/${basinId}/surveys`);
    const before = (await (await page.request.get(`${baseUrl}/api/basins/${basinId}/surveys`)).json()) as unknown[];
    const dir = join(tmpdir(), `sagline-e2e-survey-${process.pid}`);
    mkdirSync(dir, { recursive: true });
    const bad = join(dir, "bad.csv");
    writeFileSync(bad, "station,reach,km,do\nA,TR-03,1,6.1\nB,TR-99,1,5\nC,TR-04,1,forty\n");
    await page.getByLabel("Survey file").setInputFiles(bad);
    await page.getByLabel("Survey name").fill("Bad file (test)");
    await page.getByRole("button", { name: "Upload and place the stations" }).click();
    const problems = page.getByTestId("survey-problems");
    await expect.poll(() => problems.textContent()).toMatch(/Row 3, do: "forty" is not a number/);
    await page.screenshot({ path: `${SHOTS}/survey-refused-1440.png`, fullPage: true });
    expect(((await (await page.request.get(`${baseUrl}/api/basins/${basinId}/surveys`)).json()) as unknown[]).length).toBe(before.length);
    const good = join(dir, "september.csv");
    writeFileSync(good, "station,reach,km,date,time,do,temperature\nA,TR-03,1.2,2026-09-03,10:15,6.4,70.5\nB,TR-05,0.5,2026-09-03,11:40,5.8,71.6\n");
    await page.getByLabel("Survey file").setInputFiles(good);
    await page.getByLabel("Survey name").fill("September spot check (test)");
    await page.getByLabel("°F").check();
    await page.getByRole("button", { name: "Upload and place the stations" }).click();
    await page.waitForURL(/\/surveys\/[0-9a-f-]{36}$/, { timeout: 30_000 });
    await expect.poll(() => page.getByTestId("survey-placement").textContent()).toMatch(/0 by their coordinates, 2 at the reach and km the file gives/);
    expect(await page.getByTestId("survey-provenance").textContent()).toMatch(/with temperature in °F/);
    await page.context().close();
  });

  it("a planner picks a file whose station column Sagline does not know: the form shows the file's columns with samples and takes the choice", async () => {
    const page = await signedIn("planner", 1440);
    await page.goto(`${baseUrl}/basins/${basinId}/surveys`);
    const dir = join(tmpdir(), `sagline-e2e-survey-map-${process.pid}`);
    mkdirSync(dir, { recursive: true });
    const file = join(dir, "site-codes.csv");
    writeFileSync(file, "Site Code,reach,km,do\nQX-1,TR-04,0.8,5.9\nQX-2,TR-05,1.1,5.6\n");
    await page.getByLabel("Survey file").setInputFiles(file);
    const station = page.getByLabel("Station", { exact: true });
    // the guesses the server would make are shown, and no station column was recognised
    await expect.poll(() => station.locator("option").allTextContents()).toEqual(["none", "Site Code (e.g. QX-1)", "reach (e.g. TR-04)", "km (e.g. 0.8)", "do (e.g. 5.9)"]);
    expect(await page.getByLabel("DO", { exact: true }).locator("option").first().textContent()).toBe("as recognised: do");
    await page.screenshot({ path: `${SHOTS}/survey-columns-1440.png`, fullPage: true });
    await station.selectOption("Site Code");
    await page.getByLabel("Survey name").fill("Site codes (test)");
    await page.getByRole("button", { name: "Upload and place the stations" }).click();
    await page.waitForURL(/\/surveys\/[0-9a-f-]{36}$/, { timeout: 30_000 });
    const rows = page.getByTestId("survey-samples").locator("tbody tr");
    await expect.poll(() => rows.count()).toBe(2);
    expect(await rows.first().textContent()).toContain("QX-1");
    await page.context().close();
  });

  it("a stakeholder sees no Surveys tab and is refused the page", async () => {
    const page = await signedIn("stakeholder", 1440);
    await page.goto(`${baseUrl}/basins/${basinId}`);
    expect(await page.getByRole("link", { name: "Surveys" }).count()).toBe(0);
    await page.goto(`${baseUrl}/basins/${basinId}/surveys`);
    await expect.poll(() => page.locator("main").textContent()).toMatch(/Only .* can see the network, scenarios and runs/);
    await page.context().close();
  });
});
