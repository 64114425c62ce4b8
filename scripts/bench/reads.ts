/**
 * Reads that scale (issue 14): the framework's own trivial route against the reads that
 * matter, on a real production server, and a bare node:http server handing out the same
 * run JSON bytes. Prints figures and ratios; never fails on speed.
 *
 * Starts `next start` from the existing build (skipped, saying so, when there is none or it
 * predates /api/health/live: run `npm run build`; the bench never builds) on a free loopback
 * port against a throwaway database on the test cluster, seeded with the demo. Takes a plan
 * of the demo allocation to publication through the services (tests/support/plan-fixture,
 * which also commits the demo network once more as the basin's next version), signs in as
 * the demo planner over HTTP, then runs autocannon for `seconds` at 20 and 50 connections
 * against each of:
 *   live       GET /api/health/live, signed out (no database)
 *   run        the stored allocation run, signed in (GET /api/basins/:id/runs/:runId, 200)
 *   run 304    the same with If-None-Match (304)
 *   page       the published plan's public page, signed out (served from the page store
 *              after the first request: lib/cache/next-cache-handler.cjs)
 *   csv, pdf   the published plan's allocation CSV and report, signed out
 *   bare       node:http in a worker thread of this process, the run's JSON bytes
 * Goal: the stored-run read costs at most 1.5× the trivial route (live req/s ÷ run req/s ≤ 1.5).
 *
 *   npx tsx scripts/bench/reads.ts [seconds=5]     (also part of `npm run bench`; `--no-db` skips it)
 */
import { spawn, type ChildProcess } from "node:child_process";
import { existsSync } from "node:fs";
import { createServer } from "node:net";
import { fileURLToPath } from "node:url";
import { Worker } from "node:worker_threads";
import autocannon from "autocannon";
import { createDb } from "../../db/client";
import { migrateToLatest } from "../../db/migrate";
import { seedDemo } from "../../db/seed/demo";
import { DEMO_USERS } from "../../db/seed/demo-data";
import type { Actor } from "../../lib/auth/guard";
import { stopBoss } from "../../lib/jobs/queue";
import { loadDemoNetwork } from "../../lib/services/demo";
import { hashPassword } from "../../lib/services/users";
import { planAt } from "../../tests/support/plan-fixture";
import { createThrowawayDatabase, dropDatabase, ensureTestCluster } from "../../tests/support/test-db";
import type { World, WorldUserKey } from "../../tests/support/world";
import { signInOverHttp } from "./sign-in";

const ROOT = fileURLToPath(new URL("../..", import.meta.url));
const GOAL = 1.5;

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once("error", reject);
    s.listen(0, "127.0.0.1", () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });
}

async function waitUntilLive(base: string, server: ChildProcess, log: () => string): Promise<void> {
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) throw new Error(`next start exited with code ${server.exitCode}:\n${log()}`);
    try {
      if ((await fetch(`${base}/api/health/live`)).ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`next start did not answer in 60 s:\n${log()}`);
}

/** Stop the server we started: its process group (its PID), SIGTERM, then SIGKILL after 5 s. */
async function stop(child: ChildProcess): Promise<void> {
  if (!child.pid || child.exitCode !== null) return;
  const exited = new Promise<void>((r) => child.once("exit", () => r()));
  try {
    process.kill(-child.pid, "SIGTERM");
  } catch {
    return;
  }
  const timer = setTimeout(() => {
    try {
      process.kill(-child.pid!, "SIGKILL");
    } catch {
      // gone
    }
  }, 5000);
  await exited;
  clearTimeout(timer);
}

/** node:http on its own event loop (a worker thread of this process), answering every request with `bytes`. */
function bareServer(bytes: Buffer, etag: string): Promise<{ port: number; worker: Worker }> {
  const code = `
    const { parentPort, workerData } = require("node:worker_threads");
    const http = require("node:http");
    const body = Buffer.from(workerData.bytes);
    const server = http.createServer((req, res) => {
      res.writeHead(200, { "content-type": "application/json", "content-length": body.length, etag: workerData.etag, "cache-control": "private, no-cache" });
      res.end(body);
    });
    server.listen(0, "127.0.0.1", () => parentPort.postMessage(server.address().port));`;
  const worker = new Worker(code, { eval: true, workerData: { bytes, etag } });
  return new Promise((resolve, reject) => {
    worker.once("message", (port: number) => resolve({ port, worker }));
    worker.once("error", reject);
  });
}

interface Figure {
  rps: number;
  p50: number;
  p95: number;
  requests: number;
  /** Responses whose status was not the one expected, plus connection errors and timeouts. */
  wrong: number;
}

const quantile = (sorted: number[], q: number) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))] : NaN);

async function load(url: string, connections: number, seconds: number, headers: Record<string, string>, expect: number): Promise<Figure> {
  const times: number[] = [];
  let wrong = 0;
  const r = await new Promise<autocannon.Result>((resolve, reject) => {
    const instance = autocannon({ url, connections, duration: seconds, headers }, (error, result) => (error ? reject(error) : resolve(result)));
    instance.on("response", (_client, status, _bytes, ms) => {
      times.push(ms);
      if (status !== expect) wrong++;
    });
  });
  times.sort((a, b) => a - b);
  return { rps: r.requests.average, p50: quantile(times, 0.5), p95: quantile(times, 0.95), requests: r.requests.total, wrong: wrong + r.errors + r.timeouts };
}

export async function readsBench(seconds = 5): Promise<void> {
  if (!existsSync(`${ROOT}.next/BUILD_ID`)) {
    console.log("reads: skipped — the reads bench needs a production build (npm run build); it does not build by itself");
    return;
  }
  if (!existsSync(`${ROOT}.next/server/app/api/health/live`)) {
    console.log("reads: skipped — the production build predates /api/health/live; run npm run build");
    return;
  }
  ensureTestCluster();
  const { url, name } = await createThrowawayDatabase("sagline_bench_reads");
  // the services (and the job queue processRun's runs go through) read DATABASE_URL
  process.env.DATABASE_URL = url;
  const db = createDb(url, 4);
  let server: ChildProcess | null = null;
  let bare: Worker | null = null;
  try {
    await migrateToLatest(db);
    await seedDemo(db, hashPassword);
    await loadDemoNetwork(db, ROOT);
    const basin = await db.selectFrom("basins").select("id").where("slug", "=", "tamsel-river").executeTakeFirstOrThrow();
    const actors = {} as Record<WorldUserKey, Actor>;
    for (const key of ["planner", "lead"] as const) {
      const u = await db.selectFrom("users").select(["id", "email", "name", "is_admin"]).where("email", "=", DEMO_USERS.find((d) => d.key === key)!.email).executeTakeFirstOrThrow();
      actors[key] = { id: u.id, email: u.email, name: u.name, isAdmin: u.is_admin };
    }
    // the fixture needs the basin and its planner and lead only
    const world: World = { basinId: basin.id, otherBasinId: basin.id, facilityId: "", users: actors };
    const { planId, runId } = await planAt(db, world, "published");

    const port = await freePort();
    const base = `http://127.0.0.1:${port}`;
    server = spawn(process.execPath, [`${ROOT}node_modules/next/dist/bin/next`, "start", "-H", "127.0.0.1", "-p", String(port)], {
      cwd: ROOT,
      env: {
        ...process.env,
        NODE_ENV: "production",
        NEXT_TELEMETRY_DISABLED: "1",
        DATABASE_URL: url,
        NEXTAUTH_URL: base,
        NEXTAUTH_SECRET: `bench-${Math.random().toString(36).slice(2)}`,
      },
      stdio: ["ignore", "pipe", "pipe"],
      detached: true,
    });
    let log = "";
    server.stdout?.on("data", (d) => (log += d));
    server.stderr?.on("data", (d) => (log += d));
    await waitUntilLive(base, server, () => log);

    const planner = DEMO_USERS.find((u) => u.key === "planner")!;
    const cookie = await signInOverHttp(base, planner.email, planner.password);
    const runUrl = `${base}/api/basins/${basin.id}/runs/${runId}`;
    const runRes = await fetch(runUrl, { headers: { cookie } });
    if (!runRes.ok) throw new Error(`GET run: ${runRes.status}`);
    const etag = runRes.headers.get("etag")!;
    const runBytes = Buffer.from(await runRes.arrayBuffer());
    const b = await bareServer(runBytes, etag);
    bare = b.worker;

    const targets: { name: string; url: string; headers: Record<string, string>; expect: number }[] = [
      { name: "live (trivial route)", url: `${base}/api/health/live`, headers: {}, expect: 200 },
      { name: "stored run, signed in", url: runUrl, headers: { cookie }, expect: 200 },
      { name: "stored run, If-None-Match", url: runUrl, headers: { cookie, "if-none-match": etag }, expect: 304 },
      { name: "published page", url: `${base}/published/${basin.id}/${planId}`, headers: {}, expect: 200 },
      { name: "published CSV", url: `${base}/api/basins/${basin.id}/plans/${planId}/csv`, headers: {}, expect: 200 },
      { name: "published PDF", url: `${base}/api/basins/${basin.id}/plans/${planId}/report`, headers: {}, expect: 200 },
      { name: "bare node:http, same bytes", url: `http://127.0.0.1:${b.port}/`, headers: {}, expect: 200 },
    ];
    // one request each first: the server loads each route's code and fills its caches
    for (const t of targets) {
      const res = await fetch(t.url, { headers: t.headers });
      await res.arrayBuffer();
      if (res.status !== t.expect) throw new Error(`${t.name}: ${res.status}, expected ${t.expect}`);
    }
    const pdfHead = await fetch(targets[5].url, { method: "GET" });
    const pdfBytes = (await pdfHead.arrayBuffer()).byteLength;
    const pageHead = await fetch(targets[3].url);
    const pageBytes = (await pageHead.arrayBuffer()).byteLength;
    console.log(
      `reads on next start (production build) at ${base}, ${seconds} s per target and level; stored run ${(runBytes.length / 1024).toFixed(0)} KiB JSON, ` +
        `published PDF ${(pdfBytes / 1024).toFixed(0)} KiB (Cache-Control ${pdfHead.headers.get("cache-control")}); ` +
        `published page ${(pageBytes / 1024).toFixed(0)} KiB HTML (stored page: ${pageHead.headers.get("x-nextjs-cache") ?? "not stored"}, Cache-Control ${pageHead.headers.get("cache-control")}). ` +
        `Server and load generator share this machine's cores with whatever else runs: figures, not pass/fail.`,
    );
    for (const connections of [20, 50]) {
      const figures = new Map<string, Figure>();
      for (const t of targets) figures.set(t.name, await load(t.url, connections, seconds, t.headers, t.expect));
      const live = figures.get(targets[0].name)!;
      const run = figures.get(targets[1].name)!;
      const bareFig = figures.get(targets[6].name)!;
      console.log(`  ${connections} connections:`);
      for (const t of targets) {
        const f = figures.get(t.name)!;
        const cost = t === targets[0] || t === targets[6] ? "" : ` · cost ${(live.rps / f.rps).toFixed(2)}× the trivial route`;
        console.log(
          `    ${t.name.padEnd(28)} ${f.rps.toFixed(0).padStart(6)} req/s · p50 ${f.p50.toFixed(1).padStart(6)} ms · p95 ${f.p95.toFixed(1).padStart(6)} ms${cost}` +
            (f.wrong ? ` · ${f.wrong} of ${f.requests} not ${t.expect} or failed` : ""),
        );
      }
      const ratio = live.rps / run.rps;
      console.log(
        `    stored-run read: ${ratio.toFixed(2)}× the trivial route's cost — goal ≤ ${GOAL}× ${ratio <= GOAL ? "met" : "not met"}; ` +
          `bare node:http does ${(bareFig.rps / run.rps).toFixed(1)}× the run read's req/s (run ÷ bare ${(run.rps / bareFig.rps).toFixed(2)})`,
      );
    }
  } finally {
    if (server) await stop(server);
    if (bare) await bare.terminate();
    await stopBoss();
    await db.destroy();
    await dropDatabase(name);
  }
}

if (process.argv[1]?.endsWith("reads.ts")) {
  await readsBench(Number(process.argv[2] ?? 5));
  process.exit(0);
}
