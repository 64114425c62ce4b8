/**
 * Load benchmark (issue 5): reading a stored run result through the API on
 * loopback at 50 and 200 concurrent connections, with autocannon. Prints
 * figures; never fails on speed. Target: p95 ≤ 50 ms, zero errors.
 *
 *   npm start                      # in another terminal (server + worker, demo data)
 *   npx tsx scripts/bench/read-run.ts [baseUrl=http://127.0.0.1:3000] [seconds=10]
 *
 * Signs in as the demo planner, makes sure the demo basin has a finished
 * model run (creating a scenario and running it when needed), then reads
 * GET /api/basins/:id/runs/:runId as fast as the connections allow.
 */
import autocannon from "autocannon";
import { DEMO_USERS } from "@/db/seed/demo-data";
import { signInOverHttp } from "./sign-in";

const base = process.argv[2] ?? "http://127.0.0.1:3000";
const seconds = Number(process.argv[3] ?? 10);
if (!/^http:\/\/(127\.\d+\.\d+\.\d+|localhost|\[::1\])(:\d+)?$/.test(base)) {
  throw new Error("load tests target loopback only (127.0.0.0/8, localhost or [::1])");
}

async function signIn(): Promise<string> {
  const planner = DEMO_USERS.find((u) => u.key === "planner")!;
  return signInOverHttp(base, planner.email, planner.password).catch((e: Error) => {
    throw new Error(`${e.message}: is the demo loaded (npm start)?`);
  });
}

async function api<T>(cookie: string, path: string, init?: RequestInit): Promise<T> {
  const res = await fetch(`${base}${path}`, { ...init, headers: { cookie, "content-type": "application/json", ...init?.headers } });
  if (!res.ok) throw new Error(`${init?.method ?? "GET"} ${path}: ${res.status} ${await res.text()}`);
  return (await res.json()) as T;
}

async function storedRun(cookie: string): Promise<{ basinId: string; runId: string; bytes: number }> {
  const basins = await api<{ id: string; slug: string }[]>(cookie, "/api/basins");
  const basinId = basins.find((b) => b.slug === "tamsel-river")!.id;
  let runs = await api<{ id: string; status: string; kind: string }[]>(cookie, `/api/basins/${basinId}/runs`);
  let done = runs.find((r) => r.status === "done" && r.kind === "model");
  if (!done) {
    const scenario = await api<{ id: string }>(cookie, `/api/basins/${basinId}/scenarios`, {
      method: "POST",
      body: JSON.stringify({ name: `Benchmark ${Date.now()}`, inputs: { conditions: [{ name: "7Q10" }] } }),
    });
    const run = await api<{ id: string }>(cookie, `/api/basins/${basinId}/scenarios/${scenario.id}/runs`, {
      method: "POST",
      body: JSON.stringify({ kind: "model" }),
    });
    for (let i = 0; i < 120; i++) {
      runs = await api(cookie, `/api/basins/${basinId}/runs`);
      done = runs.find((r) => r.id === run.id && r.status === "done");
      if (done) break;
      await new Promise((r) => setTimeout(r, 500));
    }
    if (!done) throw new Error("the run did not finish: is the worker running (npm start starts it)?");
  }
  const body = await fetch(`${base}/api/basins/${basinId}/runs/${done.id}`, { headers: { cookie } }).then((r) => r.text());
  return { basinId, runId: done.id, bytes: body.length };
}

const cookie = await signIn();
const { basinId, runId, bytes } = await storedRun(cookie);
console.log(`Reading a stored run result (${(bytes / 1024).toFixed(0)} KiB JSON) from ${base}, ${seconds} s per level`);
for (const connections of [50, 200]) {
  const r = await autocannon({
    url: `${base}/api/basins/${basinId}/runs/${runId}`,
    connections,
    duration: seconds,
    headers: { cookie },
  });
  const l = r.latency;
  const errors = r.errors + r.timeouts + r.non2xx;
  console.log(
    `  ${connections} connections: ${r.requests.total} requests, ${r.requests.average.toFixed(0)} req/s; latency ms p50 ${l.p50} · p90 ${l.p90} · p97.5 ${l.p97_5} · p99 ${l.p99} · max ${l.max}; errors ${errors}` +
      ` — target p95 ≤ 50 ms ${l.p90 <= 50 && l.p97_5 <= 50 ? "met" : l.p90 > 50 ? "not met" : "not shown to be met (p95 lies between p90 and p97.5)"}, zero errors ${errors === 0 ? "met" : "not met"}`,
  );
}
