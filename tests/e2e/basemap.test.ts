import { spawn, type ChildProcess } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { PNG } from "pngjs";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { MAP_COLOURS } from "@/components/map/map-style";
import { createDb, type Db } from "@/db/client";
import { stopBoss } from "@/lib/jobs/queue";
import { launchBrowser } from "./support/browser";
import { planAt } from "../support/plan-fixture";
import { buildWorld } from "../support/world";

// A second production server, started with SAGLINE_BASEMAP_PMTILES naming a raster PMTiles
// archive (one blue z0 tile, written here by the PMTiles v3 layout): the maps draw it under
// the basin through the pmtiles protocol, reading byte ranges from Sagline's own route,
// with no CSP violation and no console error.
const PORT = Number(process.env.SAGLINE_E2E_BASEMAP_PORT ?? 3217);
const baseUrl = `http://127.0.0.1:${PORT}`;
const TILE = [0, 0, 255] as const;
let server: ChildProcess;
let browser: Browser;
let db: Db;
let dir: string;
let publishedUrl: string;

const varint = (n: number): number[] => {
  const out: number[] = [];
  while (n > 127) {
    out.push((n & 127) | 128);
    n >>>= 7;
  }
  return [...out, n];
};

/** A PMTiles v3 archive holding one PNG tile at z0 (tile id 0), nothing compressed. */
function rasterArchive(): Buffer {
  const png = new PNG({ width: 256, height: 256 });
  for (let i = 0; i < png.data.length; i += 4) [png.data[i], png.data[i + 1], png.data[i + 2], png.data[i + 3]] = [...TILE, 255];
  const tile = PNG.sync.write(png);
  // root directory: 1 entry; tile id delta 0; run length 1; length; offset + 1 (offset 0 in the tile data)
  const dirBytes = Buffer.from([...varint(1), ...varint(0), ...varint(1), ...varint(tile.length), ...varint(1)]);
  const meta = Buffer.from("{}");
  const header = Buffer.alloc(127);
  header.write("PMTiles", 0, "latin1");
  header.writeUInt8(3, 7);
  const rootAt = 127;
  const metaAt = rootAt + dirBytes.length;
  const tilesAt = metaAt + meta.length;
  [rootAt, dirBytes.length, metaAt, meta.length, tilesAt, 0, tilesAt, tile.length, 1, 1, 1].forEach((v, i) => header.writeBigUInt64LE(BigInt(v), 8 + 8 * i));
  header.writeUInt8(1, 96); // clustered
  header.writeUInt8(1, 97); // internal compression: none
  header.writeUInt8(1, 98); // tile compression: none
  header.writeUInt8(2, 99); // png
  header.writeUInt8(0, 100);
  header.writeUInt8(0, 101);
  [-1800000000, -850000000, 1800000000, 850000000].forEach((v, i) => header.writeInt32LE(v, 102 + 4 * i));
  return Buffer.concat([header, dirBytes, meta, tile]);
}

async function waitForHealth(): Promise<void> {
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) throw new Error(`next start exited with ${server.exitCode}`);
    if (await fetch(`${baseUrl}/api/health`).then((r) => r.ok, () => false)) return;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error("the basemap server did not start");
}

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), "sagline-basemap-"));
  const archive = join(dir, "world.pmtiles");
  writeFileSync(archive, rasterArchive());
  process.env.DATABASE_URL = inject("e2eDatabaseUrl");
  db = createDb(inject("e2eDatabaseUrl"), 2);
  const w = await buildWorld(db);
  const { planId } = await planAt(db, w, "published");
  publishedUrl = `${baseUrl}/published/${w.basinId}/${planId}`;
  server = spawn("npx", ["next", "start", "-H", "127.0.0.1", "-p", String(PORT)], {
    env: {
      ...process.env,
      NODE_ENV: "production",
      NEXT_TELEMETRY_DISABLED: "1",
      DATABASE_URL: inject("e2eDatabaseUrl"),
      NEXTAUTH_URL: baseUrl,
      NEXTAUTH_SECRET: "e2e-secret-for-sagline-browser-tests",
      SAGLINE_BASEMAP_PMTILES: archive,
    },
    stdio: "ignore",
    detached: true,
  });
  await waitForHealth();
  browser = await launchBrowser();
}, 120_000);
afterAll(async () => {
  await browser?.close();
  if (server?.pid) {
    try {
      process.kill(-server.pid, "SIGTERM");
    } catch {
      // already gone
    }
  }
  await stopBoss();
  await db?.destroy();
  rmSync(dir, { recursive: true, force: true });
});

describe("a PMTiles basemap served by Sagline", () => {
  it("answers the map's question and serves byte ranges", async () => {
    expect(await (await fetch(`${baseUrl}/api/map/basemap`)).json()).toEqual({ pmtiles: "/api/map/basemap/archive" });
    const res = await fetch(`${baseUrl}/api/map/basemap/archive`, { headers: { range: "bytes=0-6" } });
    expect(res.status).toBe(206);
    expect(Buffer.from(await res.arrayBuffer()).toString("latin1")).toBe("PMTiles");
  });

  it("draws under the published plan's DO map, the basin's layers and labels on top, with no CSP violation", async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
    const problems: string[] = [];
    await page.exposeFunction("__cspViolation", (s: string) => problems.push(`violation: ${s}`));
    await page.addInitScript(() => {
      document.addEventListener("securitypolicyviolation", (e) => (window as unknown as { __cspViolation: (s: string) => void }).__cspViolation(`${e.violatedDirective} ${e.blockedURI}`));
    });
    page.on("console", (m) => {
      if (m.type() === "error") problems.push(`console: ${m.text()}`);
    });
    page.on("pageerror", (e) => problems.push(`pageerror: ${e.message}`));
    await page.goto(publishedUrl);
    const frame = '[aria-label="Map of dissolved oxygen"] [data-testid="do-map"]';
    await page.locator(`${frame}[data-ready="true"]`).waitFor({ timeout: 30_000 });
    await page.waitForFunction((sel) => (document.querySelector(sel) as HTMLElement | null)?.dataset.labels, frame, { timeout: 30_000 });
    await page.waitForTimeout(1500);
    const png = PNG.sync.read(await page.locator(frame).screenshot({ path: "test-results/screens/maps-basemap-1440.png" }));
    // the tile at raster-opacity 0.85 over the plain background
    const bg = [1, 3, 5].map((i) => parseInt(MAP_COLOURS.background.slice(i, i + 2), 16));
    const want = TILE.map((c, i) => 0.85 * c + 0.15 * bg[i]);
    let n = 0;
    for (let i = 0; i < png.data.length; i += 4) if (Math.abs(png.data[i] - want[0]) + Math.abs(png.data[i + 1] - want[1]) + Math.abs(png.data[i + 2] - want[2]) < 30) n++;
    // most of the frame is basemap: everything but the basin's lines, labels and controls
    expect(n).toBeGreaterThan((png.width * png.height) / 2);
    expect(problems).toEqual([]);
    await page.close();
  });
});
