import { mkdirSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { demoUserPage, launchBrowser } from "./support/browser";

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

describe("gauges and their low flows", () => {
  it("a planner reads the demo gauge's design flows and its frequency plot, at 1440 and 390 px", async () => {
    for (const width of [1440, 390]) {
      const page = await signedIn("planner", width);
      await page.goto(`${baseUrl}/basins/${basinId}`);
      await page.getByRole("link", { name: "Gauges" }).click();
      await page.waitForURL(`${baseUrl}/basins/${basinId}/gauges`);
      const table = page.getByTestId("gauge-table");
      await expect.poll(() => table.textContent()).toContain("Tamsel River at Quillford");
      await page.screenshot({ path: `${SHOTS}/gauges-${width}.png`, fullPage: true });
      await table.getByRole("link", { name: "Tamsel River at Quillford" }).click();
      await page.waitForURL(/\/gauges\/[0-9a-f-]{36}$/);
      const flows = page.getByTestId("design-flow-table");
      for (const name of ["1Q10", "7Q10", "30Q5", "7Q2"]) expect(await flows.textContent()).toContain(name);
      await expect.poll(() => page.getByTestId("gauge-provenance").textContent()).toMatch(/TQ-0410 · on reach TR-04 · daily record 1994-04-01 to 2024-03-31/);
      // the plot draws one dot per year and the fitted line
      await expect.poll(() => page.locator(".recharts-scatter-symbol").count(), { timeout: 15_000 }).toBeGreaterThan(20);
      expect(await page.locator(".recharts-line-curve").count()).toBe(1);
      await page.screenshot({ path: `${SHOTS}/gauge-detail-${width}.png`, fullPage: true });
      await page.context().close();
    }
  });

  it("a planner uploads a short record through the form and lands on its page, warned that it is short; a bad file is refused naming its line", async () => {
    const page = await signedIn("planner", 1440);
    await page.goto(`${baseUrl}/basins/${basinId}/gauges`);
    const dir = join(tmpdir(), `sagline-e2e-gauge-${process.pid}`);
    mkdirSync(dir, { recursive: true });
    const bad = join(dir, "bad.csv");
    writeFileSync(bad, "date,flow\n2020-04-01,1.5\n2020-04-02,plenty\n");
    await page.getByLabel("Record file").setInputFiles(bad);
    await page.getByLabel("Gauge name").fill("Sedge Run at the mill (test)");
    await page.getByRole("button", { name: "Upload and compute low flows" }).click();
    await expect.poll(() => page.locator("form[aria-label='Upload a daily flow record']").textContent()).toMatch(/line 3: flow "plenty" is not a number/);
    const lines = ["date,flow"];
    for (let d = Date.UTC(2018, 3, 1); d < Date.UTC(2022, 3, 1); d += 86_400_000) lines.push(`${new Date(d).toISOString().slice(0, 10)},${(0.4 + 0.2 * Math.cos(d / 5e9)).toFixed(3)}`);
    const good = join(dir, "short.csv");
    writeFileSync(good, lines.join("\n"));
    await page.getByLabel("Record file").setInputFiles(good);
    await page.getByLabel("cfs (ft³/s)").check();
    await page.getByRole("button", { name: "Upload and compute low flows" }).click();
    await page.waitForURL(/\/gauges\/[0-9a-f-]{36}$/, { timeout: 30_000 });
    await expect.poll(() => page.getByRole("status").or(page.getByRole("alert")).allTextContents()).toEqual(expect.arrayContaining([expect.stringMatching(/Only 4 complete climatic years/)]));
    expect(await page.getByTestId("gauge-provenance").textContent()).toMatch(/read in cfs from short\.csv/);
    await page.context().close();
  });

  it("a planner takes a condition's design flow from the gauge's 7Q10 in the scenario editor; it is saved with where it came from and a run uses it", async () => {
    for (const width of [1440, 390]) {
      const page = await signedIn("planner", width);
      await page.goto(`${baseUrl}/basins/${basinId}/scenarios`);
      await page.getByLabel("New scenario on the newest network").fill(`Gauged 7Q10 (${width})`);
      await page.getByRole("button", { name: "Create scenario" }).click();
      await page.waitForURL(/\/scenarios\/[0-9a-f-]{36}$/);
      const scenarioId = page.url().split("/").at(-1)!;
      const choice = page.getByLabel("or from a gauge").first();
      await choice.waitFor();
      await expect.poll(() => choice.locator("option").count()).toBeGreaterThan(1);
      const label = (await choice.locator("option").allTextContents()).find((t) => t.startsWith("7Q10 at Tamsel River at Quillford"))!;
      expect(label).toBeDefined();
      await choice.selectOption({ label });
      await expect.poll(() => page.getByTestId("effective-scale-0").textContent()).toMatch(/^× \d\.\d{3} \(from the gauge\)$/);
      await page.getByRole("button", { name: "Save changes" }).click();
      await page.getByText("Saved (version 2).").waitFor();
      await page.screenshot({ path: `${SHOTS}/scenario-gauge-flow-${width}.png`, fullPage: width > 500 });
      const saved = (await (await page.request.get(`${baseUrl}/api/basins/${basinId}/scenarios/${scenarioId}`)).json()) as {
        inputs: { conditions: { gaugeFlow: { statistic: string; source: { gaugeName: string; reachId: string } } | null }[] };
      };
      expect(saved.inputs.conditions[0].gaugeFlow).toMatchObject({ statistic: "7Q10", source: { gaugeName: "Tamsel River at Quillford", reachId: "TR-04" } });
      if (width === 1440) {
        // a model run: every headwater carries its network design flow × 7Q10 / TR-04's network design flow
        const run = (await (await page.request.post(`${baseUrl}/api/basins/${basinId}/scenarios/${scenarioId}/runs`, { data: { kind: "model" } })).json()) as { id: string };
        const file = (await (await page.request.get(`${baseUrl}/api/basins/${basinId}/runs/${run.id}/model-file`)).json()) as { headwaters: { reach: string; flow_m3_s: number }[] };
        const scenario = (await (await page.request.get(`${baseUrl}/api/basins/${basinId}/scenarios/${scenarioId}`)).json()) as { networkId: string; inputs: { conditions: { gaugeFlow: { source: { valueM3s: number } } }[] } };
        const network = (await (await page.request.get(`${baseUrl}/api/basins/${basinId}/networks/${scenario.networkId}`)).json()) as { reaches: { id: string; attributes: { designFlowM3s?: number } }[] };
        const design = (id: string) => network.reaches.find((r) => r.id === id)!.attributes.designFlowM3s!;
        const scale = scenario.inputs.conditions[0].gaugeFlow.source.valueM3s / design("TR-04");
        const tr01 = file.headwaters.find((h) => h.reach === "TR-01")!;
        expect(tr01.flow_m3_s).toBeCloseTo(design("TR-01") * scale, 9);
      }
      await page.context().close();
    }
  });

  it("a stakeholder sees no Gauges tab and is refused the page", async () => {
    const page = await signedIn("stakeholder", 1440);
    await page.goto(`${baseUrl}/basins/${basinId}`);
    expect(await page.getByRole("link", { name: "Gauges" }).count()).toBe(0);
    await page.goto(`${baseUrl}/basins/${basinId}/gauges`);
    await expect.poll(() => page.locator("main").textContent()).toMatch(/Only .* can see the network, scenarios and runs/);
    await page.context().close();
  });
});
