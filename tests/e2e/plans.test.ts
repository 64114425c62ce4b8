import { execFileSync } from "node:child_process";
import { mkdirSync, readFileSync } from "node:fs";
import Papa from "papaparse";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { createDb, type Db } from "@/db/client";
import { DEMO_USERS } from "@/db/seed/demo-data";
import { launchBrowser, signInAs } from "./support/browser";
import { linkIn, waitForMail } from "./support/mail";

/**
 * The whole way from an allocation to an adopted plan, in the browser, with the
 * demo basin's four people and one member of the public: the planner proposes,
 * the lead opens the review, the e-mails arrive at the fake SMTP server, the
 * discharger and stakeholders comment, the planner responds, the review closes
 * itself at its end, the lead publishes, and a signed-out visitor downloads the
 * PDF report, whose text is read back with pdftotext.
 */
const baseUrl = inject("baseUrl");
const mailDir = inject("mailDir");
const SHOTS = "test-results/screens";
let browser: Browser;
let db: Db;
let basinId: string;
let planUrl: string;
let planId: string;

const user = (key: string) => DEMO_USERS.find((u) => u.key === key)!;
async function pageAs(email: string, password: string): Promise<Page> {
  const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  await signInAs(page, baseUrl, email, password);
  return page;
}
const demo = (key: string) => pageAs(user(key).email, user(key).password);

const PUBLIC = { name: "Rosa Fenwick", email: `rosa.fenwick.${Date.now().toString(36)}@example.test`, password: "kingfisher-bank-9" };

beforeAll(async () => {
  mkdirSync(SHOTS, { recursive: true });
  db = createDb(inject("e2eDatabaseUrl"), 2);
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await db?.destroy();
});

describe("from a proposed plan to a published one", () => {
  it("the planner proposes a plan from a finished allocation run", async () => {
    const page = await demo("planner");
    const api = (path: string, data?: unknown) =>
      data === undefined ? page.request.get(`${baseUrl}/api${path}`) : page.request.post(`${baseUrl}/api${path}`, { data });
    const basins = (await (await api("/basins")).json()) as { id: string; slug: string }[];
    basinId = basins.find((b) => b.slug === "tamsel-river")!.id;
    const scenario = (await (await api(`/basins/${basinId}/scenarios`, { name: "Plan basis", inputs: { conditions: [{ name: "7Q10" }] } })).json()) as { id: string };
    const run = (await (await api(`/basins/${basinId}/scenarios/${scenario.id}/runs`, { kind: "allocation" })).json()) as { id: string };
    await page.goto(`${baseUrl}/basins/${basinId}/runs/${run.id}`);
    await page.getByTestId("run-results").waitFor({ timeout: 60_000 });
    await page.getByRole("button", { name: "Propose plan" }).click();
    await page.waitForURL(/\/plans\/[0-9a-f-]{36}$/);
    planUrl = page.url();
    planId = planUrl.split("/").pop()!;
    expect(await page.getByTestId("plan-status").textContent()).toMatch(/draft/);
    expect(await page.getByTestId("plan-allocations").locator("tbody tr").count()).toBe(5);
    await page.close();
  });

  it("a stakeholder cannot see the draft", async () => {
    const page = await demo("stakeholder");
    await page.goto(planUrl);
    await page.getByRole("heading", { name: "Not available to you" }).waitFor();
    await page.close();
  });

  it("the lead's review dates are checked as typed: a past start and a too-short review are named at their fields", async () => {
    const lead = await demo("lead");
    await lead.goto(planUrl);
    await lead.getByLabel("Now, when I open it").uncheck();
    await lead.getByLabel("Review opens at").fill("2026-11-01T09:00");
    await lead.getByLabel("Review closes").fill("2026-11-05T17:00");
    const actions = lead.getByRole("region", { name: "Lead actions" });
    await actions.getByText("The review cannot open in the past").waitFor();
    expect(await lead.getByRole("button", { name: "Open the review" }).isDisabled()).toBe(true);
    await lead.getByLabel("Now, when I open it").check();
    await lead.getByLabel("Review closes").fill(new Date(Date.now() + 5 * 86_400_000).toISOString().slice(0, 16));
    await actions.getByText(/The basin's shortest review is 30 days: close it on or after/).waitFor();
    expect(await lead.getByRole("button", { name: "Open the review" }).isDisabled()).toBe(true);
    await lead.screenshot({ path: `${SHOTS}/plan-review-dates-refused.png`, fullPage: true });
    await lead.close();
  });

  it("the lead opens the review, and the members are e-mailed a link to it", async () => {
    const lead = await demo("lead");
    await lead.goto(planUrl);
    // a searchable zone: a name that is not a zone is said so, and the zone in use kept
    const zone = lead.getByLabel("Time zone");
    await zone.fill("Chicago");
    await lead.getByText(/Not a time zone; type part of a name/).waitFor();
    await zone.fill("America/Chicago");
    await lead.getByText(/^now C[SD]T$/).waitFor();
    // opens now (the default start), closes on a wall-clock time in Chicago
    await lead.getByLabel("Review closes").fill("2031-03-14T17:00");
    await lead.getByRole("button", { name: "Open the review" }).click();
    await lead.getByTestId("plan-status").filter({ hasText: "in review" }).waitFor();
    // the review period in the basin's zone, named
    expect(await lead.getByTestId("review-period").textContent()).toMatch(/to 14 Mar 2031, 17:00 CDT/);
    // the basin had no zone of its own: it takes its first review's
    await lead.goto(`${baseUrl}/basins/${basinId}/settings`);
    expect(await lead.getByLabel("Time zone").inputValue()).toBe("America/Chicago");
    await lead.close();
    for (const key of ["discharger", "stakeholder", "planner"]) {
      const mail = await waitForMail(mailDir, user(key).email, (m) => m.subject.startsWith("Review open:"));
      expect(mail.text).toMatch(/America\/Chicago/);
      // the wall-clock end as typed, in summer time (from the second Sunday of March, 9 March 2031): UTC−5
      expect(mail.text).toMatch(/14 Mar 2031, 17:00 CDT \(America\/Chicago\)/);
      expect(mail.text).toMatch(/qualified \(licensed\) engineer/);
    }
  });

  it("the discharger follows the e-mailed link, reads its own allocation and comments on it", async () => {
    const mail = await waitForMail(mailDir, user("discharger").email, (m) => m.subject.startsWith("Review open:"));
    const page = await demo("discharger");
    await page.goto(linkIn(mail, "/reviews/"));
    // a member is taken to the plan in the workspace
    await page.waitForURL(planUrl);
    await page.getByRole("link", { name: "My facilities" }).click();
    await page.waitForURL(/\/my-facilities$/);
    const own = page.getByRole("region", { name: /Facility Quillford Water Reclamation Plant/ });
    await own.getByTestId("my-allocation").waitFor();
    expect(await own.getByTestId("my-permit-terms").textContent()).toMatch(/Effluent BOD5\d+(\.\d)? mg\/L/);
    await own.getByTestId("profile-chart").locator("svg path").first().waitFor();
    expect(await own.getByTestId("lowest-below-outfall").textContent()).toMatch(/below the outfall/);
    await own.getByLabel(/Comment on/).fill("We need until 2028 to upgrade.\n<b>Not bold</b>");
    await own.getByRole("button", { name: "Add comment" }).click();
    await own.getByText("Not bold", { exact: false }).waitFor();
    expect(await own.locator("b").count()).toBe(0);
    await page.screenshot({ path: `${SHOTS}/my-facilities.png`, fullPage: true });
    await page.close();
  });

  it("a stakeholder member and a signed-in member of the public comment on the plan as a whole", async () => {
    const stakeholder = await demo("stakeholder");
    await stakeholder.goto(planUrl);
    const whole = stakeholder.getByRole("article", { name: "Thread: The plan as a whole" });
    await whole.getByLabel(/Comment on/).fill("Please keep the river fishable in August.");
    await whole.getByRole("button", { name: "Add comment" }).click();
    await whole.getByText("stakeholder ·", { exact: false }).waitFor();
    await stakeholder.close();

    // an account made by the site admin for someone outside the basin
    const admin = await demo("admin");
    const made = await admin.request.post(`${baseUrl}/api/users`, { data: { ...PUBLIC, isAdmin: false } });
    expect(made.status()).toBe(201);
    await admin.close();
    const outsider = await pageAs(PUBLIC.email, PUBLIC.password);
    await outsider.getByRole("navigation").getByRole("link", { name: "Plans under review" }).click();
    // other browser test files list plans under review too: this plan's own link
    await outsider.getByTestId("reviews-table").locator(`a[href="/reviews/${basinId}/${planId}"]`).click();
    await outsider.waitForURL(`${baseUrl}/reviews/${basinId}/${planId}`);
    await outsider.getByRole("button", { name: "Follow this basin" }).click();
    await outsider.getByRole("button", { name: "Unfollow" }).waitFor();
    const thread = outsider.getByRole("article", { name: "Thread: The plan as a whole" });
    await thread.getByLabel(/Comment on/).fill("The heron colony below Quillford needs the August flow.");
    await thread.getByRole("button", { name: "Add comment" }).click();
    await thread.getByText("stakeholder (public) ·", { exact: false }).waitFor();
    await outsider.screenshot({ path: `${SHOTS}/review-public-reader.png`, fullPage: true });
    await outsider.close();
    // the stakeholder who wrote first hears of the reply
    await waitForMail(mailDir, user("stakeholder").email, (m) => m.subject.startsWith("New reply:") && m.text.includes("heron colony"));
  });

  it("the planner responds; the discharger is e-mailed the reply and the summary exports as CSV", async () => {
    const planner = await demo("planner");
    await planner.goto(planUrl);
    const thread = planner.getByRole("article", { name: /Quillford Water Reclamation Plant/ });
    await thread.getByLabel(/Response/).fill("A compliance schedule to 2028 is proposed.");
    await thread.getByRole("button", { name: "Respond" }).click();
    await thread.getByText("Answered", { exact: true }).waitFor();
    const download = planner.waitForEvent("download");
    await planner.getByRole("button", { name: "Download the responsiveness summary (CSV)" }).click();
    const csv = readFileSync(await (await download).path(), "utf8");
    // one header row, the caution first in the Notes column (docs/exports.md)
    const parsed = Papa.parse<Record<string, string>>(csv, { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.meta.fields).toEqual(["Topic", "Permit id", "Commented at (UTC)", "Author", "Role", "Comment", "Response", "Responded by", "Thread", "Notes"]);
    expect(parsed.data[0].Notes).toMatch(/^Planning-level estimates/);
    expect(csv).toMatch(/We need until 2028 to upgrade/);
    expect(csv).toMatch(/A compliance schedule to 2028 is proposed/);
    await waitForMail(mailDir, user("discharger").email, (m) => m.subject.startsWith("New reply:") && m.text.includes("A compliance schedule to 2028"));
    await planner.screenshot({ path: `${SHOTS}/plan-review-planner.png`, fullPage: true });
    await planner.close();
  });

  it("the review closes itself at its end, and the lead publishes", async () => {
    // time passes: the period's end is moved into the past, and the worker's scheduled job closes it
    await db.updateTable("review_periods").set({ ends_at: new Date(Date.now() - 1000), starts_at: new Date(Date.now() - 86_400_000) }).where("plan_id", "=", planId).execute();
    const lead = await demo("lead");
    for (let i = 0; i < 20; i++) {
      await lead.goto(planUrl);
      if ((await lead.getByTestId("plan-status").textContent())?.includes("review closed")) break;
      await lead.waitForTimeout(1000);
    }
    expect(await lead.getByTestId("plan-status").textContent()).toMatch(/review closed/);
    // the plan as a whole had two comments and no response: listed, and to be acknowledged with a statement
    const panel = lead.getByTestId("publish-panel");
    expect(await panel.getByTestId("unanswered-count").textContent()).toBe("1 thread has comments without a response:");
    expect(await panel.getByTestId("unanswered-threads").textContent()).toMatch(/The plan as a whole — 2 comments, the last on/);
    const button = panel.getByRole("button", { name: "Approve and publish" });
    await panel.getByLabel(/I approve this plan as it stands/).check();
    expect(await button.isDisabled()).toBe(true);
    await panel.getByLabel(/publish without a response to it/).check();
    await panel.getByLabel("Why the plan is published without these responses").fill("The August flow question is taken up in the basin's next revision.");
    await lead.screenshot({ path: `${SHOTS}/publish-acknowledge.png`, fullPage: true });
    await button.click();
    await lead.getByTestId("plan-status").filter({ hasText: "published" }).waitFor();
    expect(await lead.getByTestId("publication-acknowledgement").textContent()).toMatch(/1 thread was published without a response \(The plan as a whole\)\. .* acknowledged this on .*: "The August flow question/);
    // the audit trail shows who closed, who published
    await lead.goto(`${baseUrl}/basins/${basinId}/audit?area=plans`);
    const audit = (await lead.getByTestId("audit-table").textContent()) ?? "";
    expect(audit).toMatch(/Published a plan/);
    expect(audit).toMatch(/The August flow question is taken up/);
    expect(audit).toMatch(/Closed a review period/);
    await lead.close();
  });

  it("the published plan is frozen and each discharger is e-mailed its final allocation; followers hear of it", async () => {
    const mail = await waitForMail(mailDir, user("discharger").email, (m) => m.subject.startsWith("Plan published:"));
    expect(mail.text).toMatch(/Quillford Water Reclamation Plant/);
    expect(mail.text).toMatch(/Final allocation \(CBODu\): [\d,.]+ kg\/d/);
    const follower = await waitForMail(mailDir, PUBLIC.email, (m) => m.subject.startsWith("Plan published:"));
    expect(follower.text).not.toMatch(/Final allocation/);
    // every member hears too, and each link opens the public page, no sign-in needed
    const member = await waitForMail(mailDir, user("stakeholder").email, (m) => m.subject.startsWith("Plan published:"));
    for (const m of [mail, follower, member]) expect(m.text).toContain(`/published/${basinId}/${planId}`);
    const planner = await demo("planner");
    const threads = ((await (await planner.request.get(`${baseUrl}/api/basins/${basinId}/plans/${planId}`)).json()) as { threads: { id: string }[] }).threads;
    const refused = await planner.request.post(`${baseUrl}/api/basins/${basinId}/threads/${threads[0].id}/response`, { data: { response: "Too late" } });
    expect(refused.status()).toBe(409);
    await planner.close();
  });

  it("a signed-out visitor finds it on the front page and downloads the PDF report", async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await page.goto(baseUrl);
    await page.getByTestId("published-plans").locator(`a[href="/published/${basinId}/${planId}"]`).click();
    await page.waitForURL(`${baseUrl}/published/${basinId}/${planId}`);
    const download = page.waitForEvent("download");
    await page.getByRole("link", { name: "Report (PDF)" }).click();
    const pdf = await (await download).path();
    expect(readFileSync(pdf).subarray(0, 5).toString()).toBe("%PDF-");
    const text = execFileSync("pdftotext", ["-layout", pdf, "-"], { encoding: "utf8" }).replace(/\s+/g, " ");
    expect(text).toMatch(/Tamsel River/);
    expect(text).toMatch(/Quillford Water Reclamation Plant/);
    expect(text).toMatch(/qualified \(licensed\) engineer/);
    expect(text).toMatch(/We need until 2028 to upgrade/);
    expect(text).toMatch(/A compliance schedule to 2028 is proposed/);
    // the lead's acknowledgement, in the responsiveness summary; times in the basin's zone
    expect(text).toMatch(/1 thread was published without a response \(The plan as a whole\)\. .* acknowledged this on .*"The August flow question is taken up/);
    expect(text).toMatch(/Dates and times in this report are in America\/Chicago/);
    await page.close();
  });
});
