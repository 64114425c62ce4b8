import { mkdirSync } from "node:fs";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { DEMO_USERS } from "@/db/seed/demo-data";
import { launchBrowser, signInAs } from "./support/browser";
import { waitForMail } from "./support/mail";

const baseUrl = inject("baseUrl");
const mailDir = inject("mailDir");
const SHOTS = "test-results/screens";
let browser: Browser;

beforeAll(async () => {
  mkdirSync(SHOTS, { recursive: true });
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("a member of the public creates an account", () => {
  it("registers, is told to confirm first, confirms through the e-mailed link and signs in", async () => {
    const email = `wren.aldous.${Date.now().toString(36)}@example.test`;
    const password = "heron-pool-2027";
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });

    await page.goto(`${baseUrl}/signin`);
    await page.getByRole("link", { name: "Create an account" }).click();
    await page.waitForURL(`${baseUrl}/register`);
    await page.getByLabel("Your name").fill("Wren Aldous");
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password", { exact: true }).fill(password);
    await page.getByLabel("Password again").fill(password);
    await page.getByRole("button", { name: "Create account" }).click();
    await page.getByText("Check your e-mail").waitFor();
    await page.screenshot({ path: `${SHOTS}/register-sent.png` });

    // not confirmed yet: the sign-in form says so
    await page.goto(`${baseUrl}/signin`);
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password").fill(password);
    await page.getByRole("button", { name: "Sign in" }).click();
    const alert = page.getByRole("alert").filter({ hasText: /\S/ });
    await alert.waitFor();
    expect(await alert.textContent()).toMatch(/Confirm your e-mail address first/);

    const mail = await waitForMail(mailDir, email);
    expect(mail.subject).toMatch(/Confirm your e-mail address/);
    const link = mail.text.match(/https?:\/\/\S+\/verify\?token=[A-Za-z0-9_-]+/)?.[0];
    expect(link, mail.text).toBeDefined();
    expect(link!.startsWith(baseUrl)).toBe(true);

    await page.goto(link!);
    await page.getByText("Your e-mail address is confirmed").waitFor();
    await page.screenshot({ path: `${SHOTS}/verify-done.png` });

    // the link works once
    const again = await browser.newPage();
    await again.goto(link!);
    await again.getByText("already been used").waitFor();
    await again.close();

    await signInAs(page, baseUrl, email, password);
    expect(page.url()).toBe(`${baseUrl}/basins`);
    await page.close();
  });
});

describe("a lead invites a discharger by e-mail", () => {
  it("sends the invitation from the members page; the invitee creates the account and joins, linked to the facility", async () => {
    const lead = DEMO_USERS.find((u) => u.key === "lead")!;
    const email = `oona.faircloth.${Date.now().toString(36)}@example.test`;
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await signInAs(page, baseUrl, lead.email, lead.password);
    // the smaller demo basin, so the other browser tests' member lists stay as seeded
    await page.getByRole("link", { name: "Kestle Water basin" }).click();
    await page.getByRole("heading", { name: "About this basin" }).waitFor();
    await page.getByRole("link", { name: "Members & facilities" }).click();
    const form = page.getByRole("form", { name: "Invite by e-mail" });
    await form.waitFor();
    await form.getByLabel("E-mail to invite").fill(email);
    await form.getByLabel("Role").selectOption("discharger");
    await form.getByRole("button", { name: "Send invitation" }).click();
    // a discharger invitation must name its facility
    await page.getByText("Choose the facility this discharger represents").waitFor();
    await form.getByLabel("Facility (dischargers)").selectOption({ label: "Kestle Village Lagoons (KW-0001)" });
    await form.getByRole("button", { name: "Send invitation" }).click();
    await page.getByText(`Invitation sent to ${email}`).waitFor();
    const listed = page.getByTestId("invitations-table");
    await listed.getByText(email).waitFor();
    await page.screenshot({ path: `${SHOTS}/members-invitations.png`, fullPage: true });
    await page.close();

    const mail = await waitForMail(mailDir, email);
    expect(mail.subject).toContain("Kestle Water basin");
    const link = mail.text.match(/https?:\/\/\S+\/invite\?token=[A-Za-z0-9_-]+/)?.[0];
    expect(link, mail.text).toBeDefined();

    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const invitee = await context.newPage();
    await invitee.goto(link!);
    await invitee.getByRole("heading", { name: "Join Kestle Water basin" }).waitFor();
    await invitee.getByLabel("Your name").fill("Oona Faircloth");
    await invitee.getByLabel("Password", { exact: true }).fill("lagoon-keeper-77");
    await invitee.getByLabel("Password again").fill("lagoon-keeper-77");
    await invitee.getByRole("button", { name: "Create account and join" }).click();
    await invitee.getByRole("heading", { name: "Your facilities" }).waitFor();
    expect(await invitee.locator("table.data-table tbody tr").allTextContents()).toEqual([
      expect.stringContaining("Kestle Village Lagoons"),
    ]);
    await invitee.screenshot({ path: `${SHOTS}/invitation-joined.png`, fullPage: true });
    await context.close();
  });
});
