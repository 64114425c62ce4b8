import { mkdirSync } from "node:fs";
import type { Browser, Page } from "playwright-core";
import { PNG } from "pngjs";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { MAP_COLOURS } from "@/components/map/map-style";
import { DEMO_USERS } from "@/db/seed/demo-data";
import { launchBrowser, signInAs } from "./support/browser";

const baseUrl = inject("baseUrl");
const SHOTS = "test-results/screens";
let browser: Browser;
let page: Page;
let basinUrl: string;

beforeAll(async () => {
  mkdirSync(SHOTS, { recursive: true });
  browser = await launchBrowser();
  page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  const planner = DEMO_USERS.find((u) => u.key === "planner")!;
  await signInAs(page, baseUrl, planner.email, planner.password);
  const basins = (await (await page.request.get(`${baseUrl}/api/basins`)).json()) as { id: string; slug: string }[];
  basinUrl = `${baseUrl}/basins/${basins.find((b) => b.slug === "tamsel-river")!.id}`;
});
afterAll(async () => {
  await browser?.close();
});

/** Pixels of the map close to a colour: proof the WebGL canvas really drew the layer. */
async function pixelsNear(hex: string, tolerance = 40): Promise<number> {
  const png = PNG.sync.read(await page.getByTestId("basin-map").screenshot());
  const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16));
  let n = 0;
  for (let i = 0; i < png.data.length; i += 4) {
    if (Math.abs(png.data[i] - r) + Math.abs(png.data[i + 1] - g) + Math.abs(png.data[i + 2] - b) < tolerance) n++;
  }
  return n;
}

describe("the basin network", () => {
  it("shows the demo network on the map with its reach and discharger tables", async () => {
    await page.goto(`${basinUrl}/network`);
    await page.locator('[data-testid="basin-map"][data-ready="true"]').waitFor();
    expect(await page.getByTestId("reach-table").locator("tbody tr").count()).toBe(17);
    expect(await page.getByTestId("outfall-table").locator("tbody tr").count()).toBe(5);
    // the map draws on a WebGL canvas: reach lines and outfalls in their colours
    expect(await page.locator('[data-testid="basin-map"] canvas').count()).toBe(1);
    await page.waitForTimeout(500);
    expect(await pixelsNear(MAP_COLOURS.reach)).toBeGreaterThan(800);
    expect(await pixelsNear(MAP_COLOURS.outfall)).toBeGreaterThan(100);
    await page.getByTestId("reach-table").getByRole("row", { name: /^TR-03 / }).getByRole("cell").first().click();
    expect(await page.getByTestId("reach-table").getByRole("row", { name: /^TR-03 / }).getAttribute("aria-selected")).toBe("true");
    await page.screenshot({ path: `${SHOTS}/network-planner.png`, fullPage: true });
    const download = page.waitForEvent("download");
    await page.getByTestId("reach-table").locator("xpath=ancestor::section").getByRole("button", { name: "Download CSV" }).click();
    const file = await download;
    expect(file.suggestedFilename()).toBe("tamsel-river-network-v1-reaches.csv");
  });

  it("imports a new version through the wizard: upload, suggested fields, report, accept, save", async () => {
    await page.goto(`${basinUrl}/network/import`);
    // choosing a file uploads it
    await page.getByLabel("Reach lines").setInputFiles("tests/fixtures/demo/tamsel-reaches.zip");
    await page.getByTestId("reach-lines-uploaded").waitFor();
    expect(await page.getByTestId("reach-lines-uploaded").textContent()).toMatch(/17 features.*UTM zone 16N/);
    await page.getByLabel("Dischargers (optional)").setInputFiles("tests/fixtures/demo/tamsel-dischargers.csv");
    await page.getByTestId("dischargers-optional-uploaded").waitFor();
    expect(await page.getByLabel("Source field for Design flow").first().inputValue()).toBe("FLOW_CFS");
    expect(await page.getByLabel("Unit of Design flow").first().inputValue()).toBe("cfs");

    await page.getByRole("button", { name: "Check the network" }).click();
    const report = page.getByTestId("validation-report");
    await report.waitFor();
    expect(await report.textContent()).toMatch(/0 error\(s\), 1 warning\(s\)/);
    expect(await page.getByTestId("outlet-summary").textContent()).toContain("Outlet: the downstream end of TR-08, from the downstream-id field.");
    expect(await page.getByTestId("snapped-dischargers").locator("tbody tr").count()).toBe(5);
    await page.screenshot({ path: `${SHOTS}/network-import-report.png`, fullPage: true });

    const save = page.getByRole("button", { name: "Save network" });
    expect(await save.isDisabled()).toBe(true);
    await page.getByLabel(/I have read the report/).check();
    await page.getByLabel("Note for this version (optional)").fill("Re-imported in the browser test");
    await save.click();
    await page.waitForURL(`${basinUrl}/network?saved=2`);
    await page.getByTestId("network-summary").getByText("v2").waitFor();
    expect(await page.getByTestId("network-saved").textContent()).toMatch(/^17 reaches and 5 outfalls, \d+\.\d\d km in all\./);
    await page.locator('[data-testid="basin-map"][data-ready="true"]').waitFor();
    await page.waitForTimeout(500);
    expect(await pixelsNear(MAP_COLOURS.reach)).toBeGreaterThan(800);
  });

  it("places dischargers from a CSV's X/Y columns in a projected system, asked for in plain words", async () => {
    await page.goto(`${basinUrl}/network/import`);
    await page.getByLabel("Reach lines").setInputFiles("tests/fixtures/demo/tamsel-reaches.zip");
    await page.getByTestId("reach-lines-uploaded").waitFor();
    await page.getByLabel("Dischargers (optional)").setInputFiles("tests/fixtures/xy/tamsel-dischargers-utm16n.csv");
    // no latitude/longitude columns: the message points at the wizard's own controls, not at API fields
    const alert = page.getByTestId("dischargers-optional-position").locator("xpath=..").getByRole("alert");
    await alert.waitFor();
    expect(await alert.textContent()).toContain('choose the columns under "Where each row is"');
    expect(await alert.textContent()).not.toContain("csvLatitude");
    await page.getByLabel("Position columns").selectOption("xy");
    await page.getByLabel("X (easting) column").fill("X");
    await page.getByLabel("Y (northing) column").fill("Y");
    await page.getByLabel("EPSG code of X and Y").fill("32616");
    await page.screenshot({ path: `${SHOTS}/network-import-xy-columns.png`, fullPage: true });
    await page.getByRole("button", { name: "Read again" }).nth(1).click();
    await page.getByTestId("dischargers-optional-uploaded").waitFor();
    expect(await page.getByTestId("dischargers-optional-uploaded").textContent()).toMatch(/5 features.*UTM zone 16N/);
    await page.getByRole("button", { name: "Check the network" }).click();
    await page.getByTestId("validation-report").waitFor();
    const rows = page.getByTestId("snapped-dischargers").locator("tbody tr");
    expect(await rows.count()).toBe(5);
    // the same reaches as the demo's latitude/longitude file (tests/fixtures/demo/README.md)
    const reachOf = async (permit: string) => rows.filter({ hasText: permit }).getByRole("combobox").inputValue();
    expect(await reachOf("DP-1001")).toBe("TR-03");
    expect(await reachOf("DP-1004")).toBe("BB-03");
  });

  it("asks the planner to choose the outlet when the line directions cannot tell, and takes the choice", async () => {
    await page.goto(`${basinUrl}/network/import`);
    await page.getByLabel("Reach lines").setInputFiles("tests/fixtures/geo/uncertain-outlet.geojson");
    await page.getByTestId("reach-lines-uploaded").waitFor();
    await page.getByRole("button", { name: "Check the network" }).click();
    const report = page.getByTestId("validation-report");
    await report.waitFor();
    expect(await report.textContent()).toMatch(/1 error\(s\)/);
    expect(await report.textContent()).toContain("The outlet cannot be told from the way the lines are drawn");
    expect(await page.getByRole("button", { name: "Save network" }).count()).toBe(0);
    await page.screenshot({ path: `${SHOTS}/network-import-outlet-uncertain.png`, fullPage: true });
    await page.getByLabel("Outlet", { exact: true }).selectOption("UP-B");
    await page.getByRole("button", { name: "Check again", exact: true }).click();
    await report.getByText("0 error(s)").waitFor();
    expect(await page.getByTestId("outlet-summary").textContent()).toBe("Outlet: the downstream end of UP-B, as you chose.");
    expect(await page.getByRole("button", { name: "Save network" }).count()).toBe(1);
  });

  it("corrects a value inline in the newest version, refusing a bad one with the field's message", async () => {
    await page.goto(`${basinUrl}/network`);
    const table = page.getByTestId("reach-table");
    await table.waitFor();
    await table.getByRole("button", { name: "Edit Depth (m) of TR-03" }).click();
    const input = table.getByRole("textbox", { name: "Depth (m) of TR-03" });
    await input.fill("-1");
    await input.press("Enter");
    await table.getByText("Depth (m) must be above zero").waitFor();
    await input.fill("0.5");
    await input.press("Enter");
    await table.getByRole("button", { name: "Edit Depth (m) of TR-03" }).filter({ hasText: "0.50" }).waitFor();
    await page.screenshot({ path: `${SHOTS}/network-inline-edit.png` });
  });

  it("reports a bad upload in plain words and keeps nothing", async () => {
    await page.goto(`${basinUrl}/network/import`);
    await page.getByLabel("Reach lines").setInputFiles({ name: "reaches.zip", mimeType: "application/zip", buffer: Buffer.from("not a zip at all") });
    const alert = page.getByRole("alert").filter({ hasText: /zip/i });
    await alert.waitFor();
    const imports = (await (await page.request.get(`${basinUrl.replace("/basins/", "/api/basins/")}/imports`)).json()) as { fileName: string }[];
    expect(imports.map((i) => i.fileName)).not.toContain("reaches.zip");
  });
});
