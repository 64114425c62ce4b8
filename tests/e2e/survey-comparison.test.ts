import { mkdirSync } from "node:fs";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { createDb, type Db } from "@/db/client";
import { stopBoss } from "@/lib/jobs/queue";
import { kmToMi } from "@/lib/model/units";
import { headwaterReaches, pathToOutlet } from "@/lib/results/path";
import { runConditions } from "@/lib/results/run-conditions";
import { surveyResiduals } from "@/lib/results/survey-residuals";
import { createRun, processRun, type RunDto } from "@/lib/services/runs";
import { createScenario } from "@/lib/services/scenarios";
import { uploadSurvey, type SurveyDto } from "@/lib/services/surveys";
import { scenarioCreateSchema } from "@/lib/validation/scenario";
import { surveyUploadSchema } from "@/lib/validation/surveys";
import { commitDemo } from "../support/demo-network";
import { scoped } from "../support/scoped";
import { demoSurveyBytes, uploadDemoSurvey } from "../support/survey";
import { buildWorld, WORLD_PASSWORD, type World, type WorldUserKey } from "../support/world";
import { launchBrowser, signInAs } from "./support/browser";

/**
 * A run's modelled DO against the demo synoptic survey on the run page: the planner picks
 * the survey (none by default), its samples are drawn on the profile chart of the condition
 * shown, the residuals table has a row per sample whose figures are the pure function's, with
 * the statistics line; a survey placed on a later network version is flagged; readers who
 * may not read surveys never ask for them. At 1440 and 390 px, nothing wider than the phone.
 */
const baseUrl = inject("baseUrl");
const SHOTS = "test-results/screens";
const SURVEY_NAME = "August 2026 main-stem survey";
let browser: Browser;
let db: Db;
let w: World;
let runId: string;
let survey: SurveyDto;

async function pageAs(who: WorldUserKey, width: number): Promise<Page> {
  const context = await browser.newContext({ viewport: { width, height: width > 500 ? 900 : 844 }, deviceScaleFactor: 1 });
  const page = await context.newPage();
  await signInAs(page, baseUrl, w.users[who].email, WORLD_PASSWORD);
  return page;
}

/** The run as the page reads it, and the condition it shows first (the governing one). */
async function shownCondition(page: Page) {
  const run = (await (await page.request.get(`${baseUrl}/api/basins/${w.basinId}/runs/${runId}`)).json()) as RunDto;
  const result = run.result!;
  const i = runConditions(result).governing;
  return { condition: result.conditions[i], model: run.modelFiles[Math.min(i, run.modelFiles.length - 1)].file };
}

/** Page wider than the screen? The outermost elements past its right edge, for the message. */
async function sideways(page: Page) {
  return page.evaluate(() => {
    const culprits: string[] = [];
    const walk = (el: Element) => {
      const style = getComputedStyle(el);
      if (el.getBoundingClientRect().right > window.innerWidth + 0.5 && ![...el.children].some((c) => c.getBoundingClientRect().right > window.innerWidth + 0.5)) {
        culprits.push(`${el.tagName.toLowerCase()}.${(el.getAttribute("class") ?? "").slice(0, 60)}`);
      }
      if (["auto", "scroll", "hidden", "clip"].includes(style.overflowX)) return;
      for (const c of el.children) walk(c);
    };
    walk(document.body);
    return { scrollWidth: document.documentElement.scrollWidth, innerWidth: window.innerWidth, culprits: culprits.slice(0, 8) };
  });
}

beforeAll(async () => {
  mkdirSync(SHOTS, { recursive: true });
  process.env.DATABASE_URL = inject("e2eDatabaseUrl");
  db = createDb(inject("e2eDatabaseUrl"), 2);
  w = await buildWorld(db);
  // the km column and the chart's axis in miles: a US basin
  await db.updateTable("basins").set({ unit_system: "US" }).where("id", "=", w.basinId).execute();
  await commitDemo(db, w.users.planner, w.basinId);
  survey = await uploadDemoSurvey(db, w.users.planner, w.basinId);
  const scenario = await scoped(createScenario)(db, w.users.planner, w.basinId, scenarioCreateSchema.parse({ name: "Survey comparison basis", inputs: { conditions: [{ name: "7Q10" }] } }));
  const run = await scoped(createRun)(db, w.users.planner, w.basinId, scenario.id, "model");
  runId = run.id;
  await processRun(db, run.id);
  // the browser tests' worker may have taken the run first
  for (let i = 0; i < 240; i++) {
    const { status } = await db.selectFrom("runs").select("status").where("id", "=", run.id).executeTakeFirstOrThrow();
    if (status === "done") break;
    if (status === "failed") throw new Error("the fixture's model run failed");
    await new Promise((r) => setTimeout(r, 250));
  }
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await stopBoss();
  await db?.destroy();
});

describe("a run's DO against a synoptic survey", () => {
  it("a planner picks the survey: the samples on the chart, a residual row per sample with the function's figures, the statistics, at 1440 and 390 px", async () => {
    expect(survey.samples).toHaveLength(16);
    for (const width of [1440, 390]) {
      const page = await pageAs("planner", width);
      const asked: string[] = [];
      // the survey API only (the basin's tabs may prefetch a surveys page)
      page.on("request", (r) => {
        const path = new URL(r.url()).pathname;
        if (path.startsWith("/api/") && path.includes("/surveys")) asked.push(path);
      });
      await page.goto(`${baseUrl}/basins/${w.basinId}/runs/${runId}`);
      await page.getByTestId("run-results").waitFor({ timeout: 60_000 });
      const select = page.getByLabel("Compare with a survey");
      await expect.poll(() => select.locator("option").allTextContents()).toEqual(["None", `${SURVEY_NAME} — 2026-08-12 — network v1`]);
      // none by default: the list was asked for, no survey's samples
      expect(await select.inputValue()).toBe("");
      expect(asked).toEqual([`/api/basins/${w.basinId}/surveys`]);
      expect(await page.getByTestId("observed-point").count()).toBe(0);
      expect(await page.getByTestId("survey-residuals").count()).toBe(0);

      await select.selectOption({ label: `${SURVEY_NAME} — 2026-08-12 — network v1` });
      const table = page.getByTestId("survey-residuals-table");
      await table.waitFor();
      expect(asked).toContain(`/api/basins/${w.basinId}/surveys/${survey.id}`);
      // the map shows the survey's samples too: all 16 demo stations were placed by their coordinates
      await expect.poll(() => page.getByTestId("map-observed-note").textContent()).toMatch(/the compared survey's 16 samples with coordinates/);

      // the chart from the page's own start reach draws the samples on its path
      const { condition, model } = await shownCondition(page);
      const start = headwaterReaches(model)[0];
      const onDefaultPath = survey.samples.filter((s) => pathToOutlet(model, start).includes(s.reach)).length;
      await expect.poll(() => page.getByTestId("observed-point").count()).toBe(onDefaultPath);
      expect(await page.getByTestId("observed-key").textContent()).toBe(`Observed (${SURVEY_NAME})`);
      // from TR-01 the path is the whole main stem, which carries every station (two per reach TR-01 … TR-08)
      await page.getByLabel("From", { exact: true }).selectOption("TR-01");
      await expect.poll(() => page.getByTestId("observed-point").count()).toBe(16);
      expect(await page.getByTestId("observed-off-path").count()).toBe(0);

      // every row's figures are surveyResiduals' under the condition shown, in miles and to 2 decimals
      const expected = surveyResiduals(condition.run, survey.samples);
      expect(expected.rows.every((r) => r.onNetwork)).toBe(true);
      const headers = await table.locator("thead th").allTextContents();
      expect(headers).toEqual(["Station", "Reach", "At (mi from reach head)", "Time", "Observed (mg/L)", "Modelled (mg/L)", "Residual (mg/L)"]);
      const cells = await table.locator("tbody tr").evaluateAll((trs) => trs.map((tr) => [...tr.querySelectorAll("td")].map((td) => td.textContent ?? "")));
      expect(cells).toHaveLength(16);
      cells.forEach((c, i) => {
        const r = expected.rows[i];
        expect(c[0]).toBe(r.station);
        expect(c[1]).toBe(r.reach);
        expect(c[2]).toBe(kmToMi(r.km).toFixed(2));
        expect(c[3]).toBe(r.time!.replace("T", " "));
        for (const j of [4, 5, 6]) expect(c[j]).toMatch(/^[+-]?\d+\.\d{2}$/);
        expect(Number(c[4])).toBe(Number(r.observed_mg_l.toFixed(2)));
        expect(Number(c[5])).toBe(Number(r.modelled_mg_l!.toFixed(2)));
        expect(Number(c[6])).toBe(Number(r.residual_mg_l!.toFixed(2)));
      });
      const s = expected.statistics;
      const line = await page.getByTestId("survey-statistics").textContent();
      expect(line).toMatch(/^n = 16 · RMSE \d+\.\d{2} mg\/L · bias [+-]?\d+\.\d{2} mg\/L \(mean of modelled − observed\) · NSE (-?\d+\.\d{2}|— .*)$/);
      expect(line).toContain(`RMSE ${s.rmse_mg_l!.toFixed(2)} mg/L`);
      expect(Number(/bias ([+-]?\d+\.\d{2})/.exec(line!)![1])).toBe(Number(s.bias_mg_l!.toFixed(2)));
      if (s.nse !== null) expect(line).toContain(`NSE ${s.nse.toFixed(2)}`);
      // same network version: no warning; the planning caution stays at the top of the page
      expect(await page.getByTestId("survey-network-mismatch").count()).toBe(0);
      expect(await page.getByTestId("planning-caution").count()).toBe(1);

      await page.getByTestId("survey-residuals").scrollIntoViewIfNeeded();
      await page.waitForLoadState("networkidle").catch(() => undefined);
      await page.screenshot({ path: `${SHOTS}/survey-comparison-${width}.png`, fullPage: true });
      const m = await sideways(page);
      expect(m.scrollWidth <= m.innerWidth, `${m.scrollWidth}px wide on a ${m.innerWidth}px screen; ${m.culprits.join("; ")}`).toBe(true);
      await page.context().close();
    }
  });

  it("a survey placed on a later network version than the run's is flagged with both versions", async () => {
    await commitDemo(db, w.users.planner, w.basinId);
    const later = await scoped(uploadSurvey)(db, w.users.planner, w.basinId, { name: "tamsel-survey-2026-08.csv", bytes: demoSurveyBytes() }, surveyUploadSchema.parse({ name: "Resurvey on version 2" }));
    expect(later.networkVersion).toBe(2);
    const page = await pageAs("planner", 1440);
    await page.goto(`${baseUrl}/basins/${w.basinId}/runs/${runId}`);
    await page.getByTestId("run-results").waitFor({ timeout: 60_000 });
    const select = page.getByLabel("Compare with a survey");
    await expect.poll(() => select.locator("option").count()).toBe(3);
    await select.selectOption({ label: "Resurvey on version 2 — 2026-08-12 — network v2" });
    await expect
      .poll(() => page.getByTestId("survey-network-mismatch").textContent())
      .toMatch(/^The survey's stations were placed on network version 2; this run used version 1\./);
    await page.context().close();
  });

  for (const who of ["stakeholder", "discharger"] as const) {
    it(`a ${who} is refused the run page and never asks for the basin's surveys`, async () => {
      const page = await pageAs(who, 1440);
      const statuses: number[] = [];
      page.on("response", (r) => {
        const path = new URL(r.url()).pathname;
        if (path.startsWith("/api/") && path.includes("/surveys")) statuses.push(r.status());
      });
      await page.goto(`${baseUrl}/basins/${w.basinId}/runs/${runId}`);
      await expect.poll(() => page.locator("main").textContent()).toMatch(/Only .* can see the network, scenarios and runs/);
      await page.waitForLoadState("networkidle").catch(() => undefined);
      expect(await page.getByLabel("Compare with a survey").count()).toBe(0);
      expect(statuses).toEqual([]);
      await page.context().close();
    });
  }
});
