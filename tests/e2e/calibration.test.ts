import { mkdirSync } from "node:fs";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { CalibrationRecord } from "@/lib/calibration/payload";
import type { ModelFile } from "@/lib/model/types";
import { DEMO_STRESS_SCENARIO, DEMO_SURVEY } from "@/lib/services/demo";
import { demoUserPage, launchBrowser, noSidewaysScroll } from "./support/browser";

/**
 * Calibration to a synoptic survey in the browser: the planner fits k_d (every reach) and SOD
 * (TR-03 to TR-06) of the demo scenario to the demo survey from the survey's page, lands on the
 * run page and reads the report once the background worker has computed it; bad requests are
 * refused in the form with a readable message; a fresh scenario takes the fitted coefficients
 * and its model file carries them; a stakeholder never reaches the survey page.
 */
const baseUrl = inject("baseUrl");
const SHOTS = "test-results/screens";
const SOD_REACHES = ["TR-03", "TR-04", "TR-05", "TR-06"];
let browser: Browser;
let basinId: string;
let surveyId: string;
/** The finished calibration of the first test, used by the scenario test. */
let calibrationRunId: string | undefined;

const signedIn = (key: string, width: number): Promise<Page> => demoUserPage(browser, baseUrl, key, width);

/** The survey's page with the calibration form set to the demo scenario, its condition, k_d everywhere and SOD over SOD_REACHES. */
async function fillCalibrationForm(page: Page, sodReaches: string) {
  await page.goto(`${baseUrl}/basins/${basinId}/surveys/${surveyId}`);
  const form = page.locator("form[aria-label='Calibrate the model to this survey']");
  await form.waitFor();
  const scenarioSelect = page.getByLabel("Scenario", { exact: true });
  const label = (await scenarioSelect.locator("option").allTextContents()).find((t) => t.startsWith(`${DEMO_STRESS_SCENARIO.name} (network version`));
  expect(label).toBeDefined();
  await scenarioSelect.selectOption({ label: label! });
  await page.getByLabel("Condition of the survey's day").selectOption({ label: DEMO_STRESS_SCENARIO.inputs.conditions[0].name });
  // k_d is ticked by default, over every reach
  const kd = page.getByTestId("fit-kd20_per_day");
  expect(await kd.getByRole("checkbox").isChecked()).toBe(true);
  expect(await kd.getByLabel("one value for every reach").isChecked()).toBe(true);
  const sod = page.getByTestId("fit-sod20_g_m2_day");
  await sod.getByRole("checkbox").check();
  await sod.getByLabel("one value for these reaches:").check();
  await page.getByLabel("Reaches for Sediment oxygen demand at 20 °C (g/m²/d)").fill(sodReaches);
  await page.getByLabel("Check the fit against a second survey (optional)").selectOption({ value: "" });
  return form;
}

beforeAll(async () => {
  mkdirSync(SHOTS, { recursive: true });
  browser = await launchBrowser();
  const page = await signedIn("planner", 1440);
  const basins = (await (await page.request.get(`${baseUrl}/api/basins`)).json()) as { id: string; slug: string }[];
  basinId = basins.find((b) => b.slug === "tamsel-river")!.id;
  const surveys = (await (await page.request.get(`${baseUrl}/api/basins/${basinId}/surveys`)).json()) as { id: string; name: string }[];
  surveyId = surveys.find((s) => s.name === DEMO_SURVEY.fields.name)!.id;
  await page.context().close();
});

afterAll(async () => {
  await browser?.close();
});

describe("calibration to a survey", () => {
  it("a planner calibrates k_d and SOD of the demo scenario to the demo survey and reads the report, at 1440 and 390 px", async () => {
    const page = await signedIn("planner", 1440);
    const form = await fillCalibrationForm(page, SOD_REACHES.join(", "));
    await form.getByRole("button", { name: "Start the calibration" }).click();
    await page.waitForURL(/\/runs\/[0-9a-f-]{36}$/, { timeout: 30_000 });
    calibrationRunId = page.url().split("/").at(-1)!;
    await page.getByRole("heading", { name: `${DEMO_STRESS_SCENARIO.name} — calibration to a survey` }).waitFor();
    // the background worker computes it; the page updates by itself
    const report = page.getByTestId("calibration-report");
    await report.waitFor({ timeout: 60_000 });

    const provenance = (await page.getByTestId("calibration-provenance").textContent())!;
    expect(provenance).toContain(`Fitted to the DO of 16 samples of the survey ${DEMO_SURVEY.fields.name}`);
    expect(provenance).toContain(`on the condition “${DEMO_STRESS_SCENARIO.inputs.conditions[0].name}”`);
    expect(provenance).toMatch(/Levenberg–Marquardt\), \d+ iterations/);

    const run = (await (await page.request.get(`${baseUrl}/api/basins/${basinId}/runs/${calibrationRunId}`)).json()) as {
      kind: string;
      status: string;
      result: { calibration: CalibrationRecord };
    };
    expect(run).toMatchObject({ kind: "calibration", status: "done" });
    const c = run.result.calibration;
    expect(c.parameters.map((p) => [p.parameter, p.reaches.length > 6 ? "many" : p.reaches])).toEqual([
      ["kd20_per_day", "many"],
      ["sod20_g_m2_day", SOD_REACHES],
    ]);

    const parameterRows = page.getByTestId("calibration-parameters").locator("tbody tr");
    expect(await parameterRows.count()).toBe(2);
    for (const [i, name] of [[0, "Deoxygenation rate k_d at 20 °C (1/d)"], [1, "Sediment oxygen demand at 20 °C (g/m²/d)"]] as const) {
      const cells = await parameterRows.nth(i).locator("td").allTextContents();
      expect(cells[0]).toContain(name);
      expect(cells[2]).toMatch(/^\d+(\.\d+)?$/);
      const fitted = Number(cells[2]);
      // the value shown is the stored one, to the digits its standard error warrants
      expect(Math.abs(fitted - c.parameters[i].value)).toBeLessThan(Math.max(c.parameters[i].std_error ?? 0, 1e-3));
      expect(fitted).toBeGreaterThanOrEqual(c.fit[i].min);
      expect(fitted).toBeLessThanOrEqual(c.fit[i].max);
      expect(cells[3]).toMatch(/^± \d/);
    }
    expect(await parameterRows.nth(1).locator("td").nth(1).textContent()).toBe(SOD_REACHES.join(", "));

    const statistics = (await page.getByTestId("calibration-statistics").textContent())!;
    expect(statistics).toContain(`RMSE${c.rmse_mg_l.toFixed(3)} mg/L`);
    expect(statistics).toMatch(/Nash–Sutcliffe efficiency-?\d\.\d{3}/);
    expect(statistics).toContain(`Nash–Sutcliffe efficiency${c.nse!.toFixed(3)}`);
    expect(statistics).toContain("16 / 2");
    expect(c.rmse_mg_l).toBeGreaterThan(0);
    expect(c.rmse_mg_l).toBeLessThan(2);

    const residualRows = page.getByTestId("calibration-residuals").locator("tbody tr");
    expect(await residualRows.count()).toBe(16);
    const first = await residualRows.first().locator("td").allTextContents();
    expect(first[0]).toBe("TS-01");
    expect(first[1]).toBe("TR-01");
    // residual = observed − modelled, as shown
    expect(Number(first[5])).toBeCloseTo(Number(first[3]) - Number(first[4]), 1);
    expect(await page.getByTestId("calibration-validation").count()).toBe(0);
    // the pointer is left where the button was, over the chart: move it off, so no tooltip is drawn
    await page.mouse.move(0, 0);
    await page.screenshot({ path: `${SHOTS}/calibration-report-1440.png`, fullPage: true });
    await page.context().close();

    const phone = await signedIn("planner", 390);
    await phone.goto(`${baseUrl}/basins/${basinId}/runs/${calibrationRunId}`);
    await phone.getByTestId("calibration-report").waitFor();
    await expect.poll(() => phone.getByTestId("calibration-residuals").locator("tbody tr").count()).toBe(16);
    expect(await noSidewaysScroll(phone)).toBe(true);
    await phone.screenshot({ path: `${SHOTS}/calibration-report-390.png`, fullPage: true });
    // the survey's page with its form on the phone too
    await phone.goto(`${baseUrl}/basins/${basinId}/surveys/${surveyId}`);
    await phone.locator("form[aria-label='Calibrate the model to this survey']").waitFor();
    expect(await noSidewaysScroll(phone)).toBe(true);
    await phone.context().close();
  });

  it("a bad request is refused in the form with a readable message: a start outside its range, and a reach the scenario does not have", async () => {
    const page = await signedIn("planner", 1440);
    const runsBefore = ((await (await page.request.get(`${baseUrl}/api/basins/${basinId}/runs`)).json()) as unknown[]).length;
    const form = await fillCalibrationForm(page, SOD_REACHES.join(", "));
    await page.locator("#sod20_g_m2_day-start").fill("12");
    await form.getByRole("button", { name: "Start the calibration" }).click();
    const problems = page.getByTestId("calibration-problems");
    await expect.poll(() => problems.textContent()).toBe("Sediment oxygen demand at 20 °C (g/m²/d): start must lie within min–max");
    expect(page.url()).toBe(`${baseUrl}/basins/${basinId}/surveys/${surveyId}`);

    await page.locator("#sod20_g_m2_day-start").fill("0.5");
    await page.getByLabel("Reaches for Sediment oxygen demand at 20 °C (g/m²/d)").fill("TR-03, TR-99");
    await form.getByRole("button", { name: "Start the calibration" }).click();
    // the server's 422, naming the reach
    await expect.poll(() => problems.textContent()).toContain('Reach "TR-99" is not in the scenario\'s network');
    expect(await problems.textContent()).toContain("fit.1.reaches: Unknown reach TR-99");
    await page.screenshot({ path: `${SHOTS}/calibration-refused-1440.png`, fullPage: true });
    expect(page.url()).toBe(`${baseUrl}/basins/${basinId}/surveys/${surveyId}`);
    expect(((await (await page.request.get(`${baseUrl}/api/basins/${basinId}/runs`)).json()) as unknown[]).length).toBe(runsBefore);
    await page.context().close();
  });

  it("a coefficient fitted twice on one reach is refused with 422 when asked, not queued to fail in the worker", async () => {
    const page = await signedIn("planner", 1440);
    const scenarios = (await (await page.request.get(`${baseUrl}/api/basins/${basinId}/scenarios`)).json()) as { id: string; name: string }[];
    const scenario = scenarios.find((s) => s.name === DEMO_STRESS_SCENARIO.name)!;
    const response = await page.request.post(`${baseUrl}/api/basins/${basinId}/scenarios/${scenario.id}/calibrations`, {
      data: {
        surveyId,
        condition: DEMO_STRESS_SCENARIO.inputs.conditions[0].name,
        fit: [
          { parameter: "kd20_per_day", reaches: "all", min: 0.05, max: 3, start: 0.3 },
          { parameter: "kd20_per_day", reaches: ["TR-03"], min: 0.05, max: 3, start: 0.5 },
        ],
      },
    });
    const body = (await response.json()) as { error?: { details?: { path: string }[] } };
    expect(response.status(), JSON.stringify(body)).toBe(422);
    expect(body.error?.details?.[0]?.path).toMatch(/^fit/);
    await page.context().close();
  });

  it("a planner takes the fitted coefficients into a fresh scenario; a model run's file carries them on the fitted reaches", async () => {
    expect(calibrationRunId, "the calibration of the first test").toBeDefined();
    const page = await signedIn("planner", 1440);
    const calibration = ((await (await page.request.get(`${baseUrl}/api/basins/${basinId}/runs/${calibrationRunId}`)).json()) as { result: { calibration: CalibrationRecord } }).result.calibration;
    const kd = calibration.parameters.find((p) => p.parameter === "kd20_per_day")!.value;
    const sod = calibration.parameters.find((p) => p.parameter === "sod20_g_m2_day")!.value;

    await page.goto(`${baseUrl}/basins/${basinId}/scenarios`);
    await page.getByLabel("New scenario on the newest network").fill(`Fitted to the August survey (${process.pid})`);
    await page.getByRole("button", { name: "Create scenario" }).click();
    await page.waitForURL(/\/scenarios\/[0-9a-f-]{36}$/);
    const scenarioId = page.url().split("/").at(-1)!;

    // the same scenario before it uses the fitted set: a model file to compare with
    const modelFileOf = async () => {
      const run = (await (await page.request.post(`${baseUrl}/api/basins/${basinId}/scenarios/${scenarioId}/runs`, { data: { kind: "model" } })).json()) as { id: string };
      return (await (await page.request.get(`${baseUrl}/api/basins/${basinId}/runs/${run.id}/model-file`)).json()) as ModelFile;
    };
    const reachOf = (file: ModelFile, id: string) => file.reaches.find((r) => r.id === id)!;
    const before = await modelFileOf();

    const choice = page.getByLabel("Coefficients fitted to a survey");
    await choice.waitFor();
    expect(await choice.locator(`option[value="${calibrationRunId}"]`).textContent()).toContain(
      `${DEMO_SURVEY.fields.name} on “${DEMO_STRESS_SCENARIO.inputs.conditions[0].name}” (${DEMO_STRESS_SCENARIO.name}; RMSE ${calibration.rmse_mg_l.toFixed(2)} mg/L;`,
    );
    await choice.selectOption({ value: calibrationRunId! });
    await page.getByRole("button", { name: "Save changes" }).click();
    await page.getByText("Saved (version 2).").waitFor();
    const source = page.getByTestId("fitted-kinetics-source");
    await expect.poll(() => source.textContent()).toMatch(/^In use: /);
    expect(await source.textContent()).toContain(`fitted to the survey “${DEMO_SURVEY.fields.name}” (16 samples`);
    await page.screenshot({ path: `${SHOTS}/scenario-fitted-kinetics-1440.png`, fullPage: true });

    const after = await modelFileOf();
    for (const id of SOD_REACHES) {
      expect(reachOf(after, id).kd20_per_day).toBe(kd);
      expect(reachOf(after, id).sod20_g_m2_day).toBe(sod);
    }
    // k_d was fitted over every reach, SOD only over TR-03 to TR-06
    expect(reachOf(after, "TR-01").kd20_per_day).toBe(kd);
    expect(reachOf(after, "TR-01").sod20_g_m2_day).toBe(reachOf(before, "TR-01").sod20_g_m2_day);
    expect(typeof reachOf(before, "TR-03").kd20_per_day).toBe("number");
    expect(reachOf(before, "TR-03").kd20_per_day).not.toBe(kd);
    await page.context().close();
  });

  it("a stakeholder is refused the survey's page and never sees the calibration form", async () => {
    const page = await signedIn("stakeholder", 1440);
    await page.goto(`${baseUrl}/basins/${basinId}/surveys/${surveyId}`);
    await expect.poll(() => page.locator("main").textContent()).toMatch(/Only .* can see the network, scenarios and runs/);
    expect(await page.locator("form[aria-label='Calibrate the model to this survey']").count()).toBe(0);
    expect(await page.getByRole("button", { name: "Start the calibration" }).count()).toBe(0);
    const refused = await page.request.post(`${baseUrl}/api/basins/${basinId}/scenarios/${"0".repeat(8)}-0000-4000-8000-${"0".repeat(12)}/calibrations`, {
      data: { surveyId, condition: "x", fit: [{ parameter: "kd20_per_day", reaches: "all", min: 0.05, max: 3, start: 0.3 }] },
    });
    expect(refused.status()).toBe(403);
    await page.context().close();
  });
});
