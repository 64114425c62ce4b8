import { NextRequest } from "next/server";
import { beforeAll, describe, expect, it } from "vitest";
import * as registerRoute from "@/app/api/account/register/route";
import * as scenariosRoute from "@/app/api/basins/[basinId]/scenarios/route";
import { DEFAULT_MAX_JSON_BYTES } from "@/lib/api/route";
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
async function send(handler: Handler, body: BodyInit, headers: Record<string, string>) {
  const init = { method: "POST", headers, body, duplex: "half" } as ConstructorParameters<typeof NextRequest>[1];
  const req = new NextRequest("http://127.0.0.1/api/test", init);
  const res = await handler(req, { params: Promise.resolve({}) });
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

  it("requires application/json for JSON bodies (415): text/plain and form bodies are refused", async () => {
    for (const type of ["text/plain", "application/x-www-form-urlencoded", ""]) {
      const headers: Record<string, string> = type ? { "content-type": type } : {};
      const res = await send(registerRoute.POST, JSON.stringify({ email: "a@b.test" }), headers);
      expect(res.status, type).toBe(415);
      expect(err(res.json).details![0].path).toBe("Content-Type");
    }
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
