import { mkdirSync } from "node:fs";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { readMailbox } from "@/lib/email/mailbox";
import { launchBrowser, signInAs } from "./support/browser";

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

/** Waits for the worker to deliver a message to `address` through the fake SMTP server. */
async function waitForMail(address: string, timeoutMs = 30_000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const found = (await readMailbox(mailDir)).find((m) => m.to.includes(address));
    if (found) return found;
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`no e-mail reached ${address} within ${timeoutMs} ms`);
}

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

    const mail = await waitForMail(email);
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
