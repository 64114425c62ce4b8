import { mkdirSync } from "node:fs";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { DEMO_USERS } from "@/db/seed/demo-data";
import { launchBrowser, signInAs } from "./support/browser";

const baseUrl = inject("baseUrl");
const SHOTS = "test-results/screens";
let browser: Browser;

beforeAll(async () => {
  mkdirSync(SHOTS, { recursive: true });
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

const demo = (key: string) => DEMO_USERS.find((u) => u.key === key)!;

async function pageAs(key: string): Promise<Page> {
  const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  const u = demo(key);
  await signInAs(page, baseUrl, u.email, u.password);
  await page.getByTestId("basin-list").waitFor();
  return page;
}

async function openBasin(page: Page, name: string): Promise<void> {
  await page.getByRole("link", { name }).click();
  await page.getByRole("heading", { name: "About this basin" }).waitFor();
}

const tabNames = async (page: Page) =>
  (await page.getByRole("navigation", { name: "Basin sections" }).getByRole("link").allTextContents()).map((t) => t.trim());

describe("signing in", () => {
  it("shows the sign-in page to a signed-out visitor of the workspace", async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await page.goto(`${baseUrl}/basins`);
    await page.waitForURL(/\/signin/);
    await expect(page.getByRole("heading", { name: "Sign in" }).isVisible()).resolves.toBe(true);
    await page.screenshot({ path: `${SHOTS}/signin.png` });
    await page.close();
  });

  it("refuses a wrong password with a plain message", async () => {
    const page = await browser.newPage();
    await page.goto(`${baseUrl}/signin`);
    await page.getByLabel("E-mail").fill(demo("planner").email);
    await page.getByLabel("Password").fill("not-the-password");
    await page.getByRole("button", { name: "Sign in" }).click();
    const alert = page.getByRole("alert").filter({ hasText: /\S/ });
    await alert.waitFor();
    expect(await alert.textContent()).toMatch(/do not match an account/);
    expect(page.url()).toContain("/signin");
    await page.close();
  });

  it("validates the form before sending it", async () => {
    const page = await browser.newPage();
    await page.goto(`${baseUrl}/signin`);
    await page.getByLabel("E-mail").fill("not-an-email");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.getByText("Enter a valid e-mail address").waitFor();
    await page.close();
  });
});

describe("each demo role sees what its role allows", () => {
  it("lead: overview, members, settings; edits the DO criterion", async () => {
    const page = await pageAs("lead");
    await page.screenshot({ path: `${SHOTS}/basins-lead.png` });
    await openBasin(page, "Tamsel River basin");
    expect(await tabNames(page)).toEqual(["Overview", "Network", "Gauges", "Surveys", "Scenarios", "Plans", "Members & facilities", "Audit trail", "Settings"]);
    await page.screenshot({ path: `${SHOTS}/basin-overview-lead.png`, fullPage: true });

    await page.getByRole("link", { name: "Members & facilities" }).click();
    await page.getByTestId("members-table").waitFor();
    await page.getByTestId("facilities-table").waitFor();
    await page.screenshot({ path: `${SHOTS}/basin-members-lead.png`, fullPage: true });

    await page.getByRole("link", { name: "Settings" }).click();
    const criterion = page.getByLabel("DO criterion (mg/L)");
    await criterion.fill("25");
    await page.getByRole("button", { name: "Save settings" }).click();
    await page.getByText("DO criterion must be below 20 mg/L").waitFor();
    await criterion.fill("5.5");
    await page.getByRole("button", { name: "Save settings" }).click();
    await page.getByText("Saved.").waitFor();
    await page.screenshot({ path: `${SHOTS}/basin-settings-lead.png`, fullPage: true });
    await page.getByRole("link", { name: "Overview" }).click();
    await page.getByTestId("do-criterion").waitFor();
    expect(await page.getByTestId("do-criterion").textContent()).toBe("5.5 mg/L");
    await page.close();
  });

  it("planner: sees members read-only and no settings", async () => {
    const page = await pageAs("planner");
    await openBasin(page, "Tamsel River basin");
    expect(await tabNames(page)).toEqual(["Overview", "Network", "Gauges", "Surveys", "Scenarios", "Plans", "Members & facilities"]);
    await page.getByRole("link", { name: "Members & facilities" }).click();
    await page.getByTestId("members-table").waitFor();
    expect(await page.getByRole("button", { name: "Add member" }).count()).toBe(0);
    expect(await page.getByRole("combobox", { name: /Role of/ }).count()).toBe(0);
    await page.goto(`${page.url().replace(/\/members$/, "")}/settings`);
    await page.getByRole("heading", { name: "Not available to you" }).waitFor();
    await page.close();
  });

  it("discharger: sees only its own facility and not the other basin", async () => {
    const page = await pageAs("discharger");
    const names = await page.getByTestId("basin-list").getByRole("link").allTextContents();
    expect(names).toEqual(["Tamsel River basin"]);
    await openBasin(page, "Tamsel River basin");
    expect(await tabNames(page)).toEqual(["Overview", "Plans", "My facilities"]);
    await page.getByRole("heading", { name: "Your facilities" }).waitFor();
    const rows = await page.locator("table.data-table tbody tr").allTextContents();
    expect(rows).toHaveLength(1);
    expect(rows[0]).toContain("Quillford Water Reclamation Plant");
    await page.screenshot({ path: `${SHOTS}/basin-overview-discharger.png`, fullPage: true });
    const basinUrl = page.url();
    await page.goto(`${basinUrl}/members`);
    await page.getByRole("heading", { name: "Not available to you" }).waitFor();
    const res = await page.request.get(`${baseUrl}/api/basins`);
    const ids = ((await res.json()) as { id: string; slug: string }[]).map((b) => b.slug);
    expect(ids).toEqual(["tamsel-river"]);
    await page.close();
  });

  it("stakeholder: overview only, no facilities", async () => {
    const page = await pageAs("stakeholder");
    await openBasin(page, "Tamsel River basin");
    expect(await tabNames(page)).toEqual(["Overview", "Plans"]);
    expect(await page.getByRole("heading", { name: /facilities/i }).count()).toBe(0);
    await page.close();
  });

  it("admin: manages users and sees every basin", async () => {
    const page = await pageAs("admin");
    const names = await page.getByTestId("basin-list").getByRole("link").allTextContents();
    // both demo basins, though the admin is a member of neither (other test files may have made more basins by now)
    expect(names).toEqual(expect.arrayContaining(["Kestle Water basin", "Tamsel River basin"]));
    await page.getByRole("link", { name: "Users" }).click();
    await page.getByTestId("users-table").waitFor();
    await page.getByLabel("Name").fill("Orla Vance");
    await page.getByLabel("E-mail").fill("orla.vance@sagline.test");
    await page.getByLabel("Initial password").fill("orla-initial-pass");
    await page.getByRole("button", { name: "Create account" }).click();
    await page.getByText("Created Orla Vance").waitFor();
    await page.getByTestId("users-table").getByText("orla.vance@sagline.test").waitFor();
    await page.screenshot({ path: `${SHOTS}/admin-users.png`, fullPage: true });
    await page.close();
  });

  it("lead adds the new account as a stakeholder, then removes it", async () => {
    const page = await pageAs("lead");
    await openBasin(page, "Tamsel River basin");
    await page.getByRole("link", { name: "Members & facilities" }).click();
    await page.getByTestId("members-table").waitFor();
    const form = page.getByRole("form", { name: "Add a member" });
    await form.getByLabel("E-mail of an existing account").fill("nobody-here@sagline.test");
    await form.getByRole("button", { name: "Add member" }).click();
    await form.getByText("No such account").waitFor();
    await form.getByLabel("E-mail of an existing account").fill("orla.vance@sagline.test");
    await form.getByRole("button", { name: "Add member" }).click();
    const row = page.getByTestId("members-table").getByRole("row", { name: /Orla Vance/ });
    await row.waitFor();
    page.once("dialog", (d) => d.accept());
    await row.getByRole("button", { name: "Remove" }).click();
    await row.waitFor({ state: "detached" });
    await page.close();
  });
});
