import { spawn, execFileSync, type ChildProcess } from "node:child_process";
import { existsSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import type { TestProject } from "vitest/node";
import { createDb } from "@/db/client";
import { migrateToLatest } from "@/db/migrate";
import { seedDemo } from "@/db/seed/demo";
import { loadDemoNetwork } from "@/lib/services/demo";
import { hashPassword } from "@/lib/services/users";
import { createThrowawayDatabase, dropDatabase, ensureTestCluster } from "../support/test-db";

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
    e2eDatabaseUrl: string;
    /** The web server's SQL statement log (SAGLINE_SQL_LOG, db/client.ts): one line per statement. */
    sqlLog: string;
    /** Where the fake SMTP server keeps this run's messages (read with readMailbox from lib/email/mailbox). */
    mailDir: string;
  }
}

const ROOT = fileURLToPath(new URL("../..", import.meta.url));

async function waitForHealth(url: string, server: ChildProcess, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) throw new Error(`next start exited with code ${server.exitCode}`);
    try {
      const res = await fetch(`${url}/api/health`);
      if (res.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`server at ${url} did not become healthy in ${timeoutMs} ms`);
}

/**
 * Browser tests run against the real production server (`next start`) on a
 * throwaway database loaded with the demo basin. Builds first when no build
 * exists (scripts/test.sh always builds before running the tests).
 */
export default async function setup(project: TestProject) {
  if (!existsSync("/usr/bin/chromium") && !process.env.CHROMIUM_PATH) {
    throw new Error("Chromium is missing: run `npm test` (it installs Debian's chromium) or apt-get install chromium");
  }
  ensureTestCluster();
  const { url, name } = await createThrowawayDatabase("sagline_e2e");
  const db = createDb(url, 2);
  await migrateToLatest(db);
  await seedDemo(db, hashPassword);
  await loadDemoNetwork(db, ROOT);
  await db.destroy();

  if (!existsSync(`${ROOT}.next/BUILD_ID`)) {
    execFileSync("npx", ["next", "build"], { cwd: ROOT, stdio: "inherit", env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1" } });
  }
  const port = Number(process.env.SAGLINE_E2E_PORT ?? 3210);
  const baseUrl = `http://127.0.0.1:${port}`;
  // the local fake SMTP server, keeping this run's messages in a fresh folder
  const smtpPort = Number(process.env.SAGLINE_E2E_SMTP_PORT ?? 2535);
  const mailDir = mkdtempSync(path.join(tmpdir(), "sagline-e2e-mail-"));
  const sqlLog = path.join(mailDir, "..", `${path.basename(mailDir)}-sql.log`);
  const mailEnv = { SMTP_URL: `smtp://127.0.0.1:${smtpPort}`, SAGLINE_MAIL_DIR: mailDir, SAGLINE_DEV_PAGES: "1" };
  const smtp = spawn("npx", ["tsx", "scripts/fake-smtp.ts"], {
    cwd: ROOT,
    env: { ...process.env, ...mailEnv, SAGLINE_SMTP_PORT: String(smtpPort) },
    stdio: ["ignore", "pipe", "pipe"],
    detached: true,
  });
  const server = spawn("npx", ["next", "start", "-H", "127.0.0.1", "-p", String(port)], {
    cwd: ROOT,
    env: {
      ...process.env,
      NODE_ENV: "production",
      NEXT_TELEMETRY_DISABLED: "1",
      DATABASE_URL: url,
      NEXTAUTH_URL: baseUrl,
      NEXTAUTH_SECRET: "e2e-secret-for-sagline-browser-tests",
      // every browser signs in from 127.0.0.1 many times: raise the rate limits (lib/security/rate-limit.ts)
      SAGLINE_RATE_LIMIT_SCALE: process.env.SAGLINE_RATE_LIMIT_SCALE ?? "100",
      // what each request asks of the database, for the test that counts a run page's reads
      SAGLINE_SQL_LOG: sqlLog,
      ...mailEnv,
    },
    stdio: ["ignore", "pipe", "pipe"],
    detached: true,
  });
  let log = "";
  server.stdout?.on("data", (d) => (log += d));
  server.stderr?.on("data", (d) => (log += d));
  smtp.stdout?.on("data", (d) => (log += d));
  smtp.stderr?.on("data", (d) => (log += d));
  // the background worker that takes runs off the job queue, as the start command runs it
  const worker = spawn("npx", ["tsx", "scripts/worker.ts"], {
    cwd: ROOT,
    // links in e-mails point at this server; reviews are checked for their end every 2 s
    env: { ...process.env, DATABASE_URL: url, NEXTAUTH_URL: baseUrl, ...mailEnv, SAGLINE_MAIL_INTERVAL_MS: "1000", SAGLINE_REVIEW_INTERVAL_MS: "2000" },
    stdio: ["ignore", "pipe", "pipe"],
    detached: true,
  });
  worker.stdout?.on("data", (d) => (log += d));
  worker.stderr?.on("data", (d) => (log += d));
  try {
    await waitForHealth(baseUrl, server, 60_000);
  } catch (error) {
    console.error(log);
    throw error;
  }
  project.provide("baseUrl", baseUrl);
  project.provide("e2eDatabaseUrl", url);
  project.provide("mailDir", mailDir);
  project.provide("sqlLog", sqlLog);

  return async () => {
    // stop the server, the worker and the fake SMTP server we started, by their process group ids
    for (const child of [server, worker, smtp]) {
      if (!child.pid) continue;
      try {
        process.kill(-child.pid, "SIGTERM");
      } catch {
        // already gone
      }
    }
    await new Promise((r) => setTimeout(r, 500));
    if (!process.env.SAGLINE_KEEP_TEST_DB) {
      await dropDatabase(name);
      rmSync(mailDir, { recursive: true, force: true });
      rmSync(sqlLog, { force: true });
    }
  };
}
