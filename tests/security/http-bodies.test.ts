import { encode } from "next-auth/jwt";
import { NextRequest } from "next/server";
import { beforeAll, describe, expect, it } from "vitest";
import * as registerRoute from "@/app/api/account/register/route";
import * as scenariosRoute from "@/app/api/basins/[basinId]/scenarios/route";
import * as importsRoute from "@/app/api/basins/[basinId]/imports/route";
import * as scenarioRoute from "@/app/api/basins/[basinId]/scenarios/[scenarioId]/route";
import { DEFAULT_MAX_JSON_BYTES, LARGE_JSON_BYTES } from "@/lib/api/route";
import { callRoute } from "../support/call-route";
import { err } from "../support/errors";
import { fileDb } from "../support/file-db";
import { buildWorld, type World } from "../support/world";

// Hostile bodies: oversized (declared or chunked with no length), the wrong
// content type, NUL characters PostgreSQL cannot store. Each gets a clear 4xx.
const db = fileDb();
let w: World;
beforeAll(async () => {
  w = await buildWorld(db);
});

type Handler = (req: NextRequest, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;
async function send(handler: Handler, body: BodyInit, headers: Record<string, string>, params: Record<string, string> = {}) {
  const init = { method: "POST", headers, body, duplex: "half" } as ConstructorParameters<typeof NextRequest>[1];
  const req = new NextRequest("http://127.0.0.1/api/test", init);
  const res = await handler(req, { params: Promise.resolve(params) });
  return { status: res.status, json: await res.json() };
}

/** A body streamed in 64 KiB chunks with no Content-Length; counts what the server pulled. */
function chunked(totalBytes: number) {
  let sent = 0;
  const chunk = new Uint8Array(65536).fill(0x20);
  const stream = new ReadableStream<Uint8Array>({
    pull(c) {
      if (sent >= totalBytes) return c.close();
      sent += chunk.byteLength;
      c.enqueue(chunk);
    },
  });
  return { stream, pulled: () => sent };
}

describe("request bodies", () => {
  it("refuses a JSON body over the limit by its Content-Length, before reading it (413)", async () => {
    const res = await send(registerRoute.POST, "{}", { "content-type": "application/json", "content-length": String(DEFAULT_MAX_JSON_BYTES + 1) });
    expect(res.status).toBe(413);
    expect(err(res.json).code).toBe("too_large");
  });

  it("refuses a chunked JSON body with no Content-Length once it passes the limit, without reading the rest (413)", async () => {
    const body = chunked(300 * 1024 * 1024);
    const res = await send(registerRoute.POST, body.stream, { "content-type": "application/json" });
    expect(res.status).toBe(413);
    expect(body.pulled()).toBeLessThan(DEFAULT_MAX_JSON_BYTES + 4 * 65536);
  });

  it("caps each route at its own size: 256 KB by default, more where a route holds per-reach values", async () => {
    const padded = (bytes: number) => JSON.stringify({ name: "x", description: "d".repeat(bytes) });
    // 300 KB is over the default: a signed-out registration is refused unread
    const reg = await callRoute(registerRoute.POST, "POST", { body: padded(300 * 1024) });
    expect(reg.status).toBe(413);
    expect(err(reg.json).message).toMatch(/256 KB/);
    // the same 300 KB is within a scenario's cap: it reaches validation (a description over 2000 characters)
    const scenario = await callRoute(scenariosRoute.POST, "POST", { userId: w.users.planner.id, params: { basinId: w.basinId }, body: padded(300 * 1024) });
    expect(scenario.status).toBe(422);
    expect(err(scenario.json).details!.map((d) => d.path)).toContain("description");
    // and past the scenario cap it is a 413 too, on the update route as well
    const huge = await callRoute(scenarioRoute.PATCH, "PATCH", {
      userId: w.users.planner.id,
      params: { basinId: w.basinId, scenarioId: "00000000-0000-4000-8000-000000000000" },
      body: padded(LARGE_JSON_BYTES + 1),
    });
    expect(huge.status).toBe(413);
  });

  it("refuses a chunked multipart upload past the upload cap without reading the rest (413)", async () => {
    process.env.SAGLINE_UPLOAD_LIMIT_MB = "0.001";
    try {
      const body = chunked(64 * 1024 * 1024);
      const token = await encode({ token: { sub: w.users.planner.id }, secret: process.env.NEXTAUTH_SECRET! });
      const res = await send(
        importsRoute.POST,
        body.stream,
        { "content-type": "multipart/form-data; boundary=x", cookie: `next-auth.session-token=${token}` },
        { basinId: w.basinId },
      );
      expect(res.status).toBe(413);
      expect(err(res.json).details![0].path).toBe("file");
      expect(body.pulled()).toBeLessThan(1024 * 1024);
    } finally {
      delete process.env.SAGLINE_UPLOAD_LIMIT_MB;
    }
  });

  it("refuses a NUL character in an upload's form field with 422 naming it", async () => {
    const form = new FormData();
    form.set("layer", "reaches\u0000");
    form.set("file", new File(["{}"], "r.geojson"));
    const res = await callRoute(importsRoute.POST, "POST", { userId: w.users.planner.id, params: { basinId: w.basinId }, body: form });
    expect(res.status).toBe(422);
    expect(err(res.json).details![0].path).toBe("layer");
  });

  it("requires application/json for JSON bodies (415): text/plain and form bodies are refused", async () => {
    for (const type of ["text/plain", "application/x-www-form-urlencoded", ""]) {
      const headers: Record<string, string> = type ? { "content-type": type } : {};
      const res = await send(registerRoute.POST, JSON.stringify({ email: "a@b.test" }), headers);
      expect(res.status, type).toBe(415);
      expect(err(res.json).details![0].path).toBe("Content-Type");
    }
    // multipart only where the route takes a file
    const form = new FormData();
    form.set("email", "a@b.test");
    const multi = await send(registerRoute.POST, form, {});
    expect(multi.status).toBe(415);
    // and a file route wants multipart, not JSON
    const json = await callRoute(importsRoute.POST, "POST", { userId: w.users.planner.id, params: { basinId: w.basinId }, body: { layer: "reaches" } });
    expect(json.status).toBe(415);
  });

  it("refuses NUL characters in text with 422 naming the field, nested too", async () => {
    const res = await callRoute(scenariosRoute.POST, "POST", {
      userId: w.users.planner.id,
      params: { basinId: w.basinId },
      body: { name: "ok", inputs: { conditions: [{ name: "bad\u0000name" }] } },
    });
    expect(res.status).toBe(422);
    expect(err(res.json).details![0].path).toBe("inputs.conditions.0.name");
    const q = await callRoute(scenariosRoute.GET, "GET", { userId: w.users.planner.id, params: { basinId: w.basinId }, query: { x: "a\u0000" } });
    expect(q.status).toBe(422);
  });
});
