import { createHash } from "node:crypto";
import { iter } from "but-unzip";
import fc from "fast-check";
import { beforeAll, describe, expect, it } from "vitest";
import * as fileRoute from "@/app/api/basins/[basinId]/imports/[importId]/file/route";
import * as importsRoute from "@/app/api/basins/[basinId]/imports/route";
import * as networkRoute from "@/app/api/basins/[basinId]/networks/[networkId]/route";
import * as networksRoute from "@/app/api/basins/[basinId]/networks/route";
import * as validateRoute from "@/app/api/basins/[basinId]/networks/validate/route";
import * as mappingsRoute from "@/app/api/basins/[basinId]/field-mappings/route";
import { DEMO_DISCHARGER_MAPPING, DEMO_REACH_MAPPING } from "@/db/seed/demo-gis";
import { writeZip } from "@/scripts/lib/zip-writer";
import type { NetworkDto, NetworkSummaryDto } from "@/lib/services/networks";
import type { ImportDto } from "@/lib/services/imports";
import { fileDb } from "../support/file-db";
import { callRoute } from "../support/call-route";
import { err } from "../support/errors";
import { demoFile, demoForm, uploadDemo } from "../support/demo-network";
import { buildWorld, type World } from "../support/world";

const db = fileDb();
let w: World;
beforeAll(async () => {
  w = await buildWorld(db);
});

const count = async (table: "imports" | "networks" | "reaches" | "outfalls" | "facilities") =>
  Number((await db.selectFrom(table).select((e) => e.fn.countAll<string>().as("n")).executeTakeFirstOrThrow()).n);
const upload = (form: FormData, userId = w.users.planner.id) =>
  callRoute(importsRoute.POST, "POST", { userId, params: { basinId: w.basinId }, body: form });

async function zipEntries(bytes: Uint8Array) {
  const out: { name: string; data: Uint8Array }[] = [];
  for (const e of iter(bytes)) out.push({ name: e.filename, data: await e.read() });
  return out;
}
async function demoZipWithout(ext: string) {
  const entries = await zipEntries(demoFile("reaches").bytes);
  return writeZip(entries.filter((e) => !e.name.endsWith(ext)));
}

describe("uploads", () => {
  it("keep the original file with its SHA-256, the uploader and the detected fields", async () => {
    const res = await upload(demoForm("reaches", "reaches"));
    expect(res.status).toBe(201);
    const dto = res.json as ImportDto;
    expect(dto.format).toBe("shapefile");
    expect(dto.featureCount).toBe(17);
    expect(dto.sha256).toBe(createHash("sha256").update(demoFile("reaches").bytes).digest("hex"));
    expect(dto.fields.map((f) => f.name)).toEqual(expect.arrayContaining(["REACH_ID", "DOWN_ID", "FLOW_CFS"]));
    expect(dto.crs).toMatchObject({ source: "prj" });
    const download = await callRoute(fileRoute.GET, "GET", {
      userId: w.users.lead.id,
      params: { basinId: w.basinId, importId: dto.id },
    });
    expect(download.status).toBe(200);
    expect(download.headers.get("x-content-sha256")).toBe(dto.sha256);
  });

  it("read a discharger CSV with latitude/longitude columns", async () => {
    const res = await upload(demoForm("dischargers", "dischargers"));
    expect(res.status).toBe(201);
    expect((res.json as ImportDto).featureCount).toBe(5);
  });

  const bad: [string, () => Promise<FormData>, string, RegExp][] = [
    ["not a zip", async () => demoForm("reaches", "reaches", new TextEncoder().encode("hello, not a zip"), "reaches.zip"), "not_a_zip", /zip/i],
    [
      "a corrupted zip",
      async () => {
        const b = new Uint8Array(demoFile("reaches").bytes);
        b.fill(0x41, 200, 1200);
        return demoForm("reaches", "reaches", b);
      },
      "",
      /./,
    ],
    ["a zip without .shp", async () => demoForm("reaches", "reaches", await demoZipWithout(".shp")), "shp_missing", /\.shp/],
    ["a zip without .dbf", async () => demoForm("reaches", "reaches", await demoZipWithout(".dbf")), "dbf_missing", /\.dbf/],
    ["a zip without .prj", async () => demoForm("reaches", "reaches", await demoZipWithout(".prj")), "prj_missing", /\.prj|CRS|EPSG/i],
    ["a CSV offered as reaches", async () => demoForm("dischargers", "reaches"), "wrong_format", /lines/],
    [
      "points offered as reaches",
      async () =>
        demoForm(
          "reachesGeoJson",
          "reaches",
          new TextEncoder().encode(JSON.stringify({ type: "FeatureCollection", features: [{ type: "Feature", properties: {}, geometry: { type: "Point", coordinates: [1, 2] } }] })),
          "points.geojson",
        ),
      "wrong_geometry_type",
      /Point.*lines/,
    ],
    [
      "an empty layer",
      async () => demoForm("reachesGeoJson", "reaches", new TextEncoder().encode('{"type":"FeatureCollection","features":[]}'), "empty.geojson"),
      "empty_layer",
      /no features/,
    ],
    ["a GeoJSON that is not JSON", async () => demoForm("reachesGeoJson", "reaches", new TextEncoder().encode("{ nope"), "bad.geojson"), "geojson_invalid", /./],
    [
      "a CSV without coordinate columns",
      async () => demoForm("dischargers", "dischargers", new TextEncoder().encode("facility,permit_id\nA,1\n"), "plants.csv"),
      "csv_missing_column",
      /latitude.*choose the columns under "Where each row is"/,
    ],
  ];
  for (const [what, form, code, message] of bad) {
    it(`refuse ${what} with a clear 422 and save nothing`, async () => {
      const before = await count("imports");
      const res = await upload(await form());
      expect(res.status).toBe(422);
      const e = err(res.json);
      expect(e.message).toMatch(message);
      expect(e.details?.[0].path).toBe("file");
      if (code) expect(e.details?.[0].code).toBe(code);
      expect(await count("imports")).toBe(before);
    });
  }

  it("refuse a file over the size limit with 413", async () => {
    const before = await count("imports");
    process.env.SAGLINE_UPLOAD_LIMIT_MB = "0.001";
    try {
      const res = await upload(demoForm("reaches", "reaches"));
      expect(res.status).toBe(413);
      expect(err(res.json).message).toMatch(/upload limit/);
    } finally {
      delete process.env.SAGLINE_UPLOAD_LIMIT_MB;
    }
    expect(await count("imports")).toBe(before);
  });

  it("refuse an upload whose declared length is over the limit before reading it", async () => {
    process.env.SAGLINE_UPLOAD_LIMIT_MB = "0.001";
    try {
      // not even multipart: reading it would fail differently, so a 413 shows nothing was read
      const res = await callRoute(importsRoute.POST, "POST", {
        userId: w.users.planner.id,
        params: { basinId: w.basinId },
        body: "x".repeat(200_000),
        headers: { "content-type": "multipart/form-data; boundary=none", "content-length": "200000" },
      });
      expect(res.status).toBe(413);
      expect(err(res.json).details?.[0].path).toBe("file");
    } finally {
      delete process.env.SAGLINE_UPLOAD_LIMIT_MB;
    }
  });

  it("refuse a request without a file, naming the field", async () => {
    const form = new FormData();
    form.set("layer", "reaches");
    const res = await upload(form);
    expect(res.status).toBe(422);
    expect(err(res.json).details?.[0].path).toBe("file");
  });

  it("refuse an unknown layer, naming the field", async () => {
    const form = demoForm("reaches", "reaches");
    form.set("layer", "rivers");
    const res = await upload(form);
    expect(res.status).toBe(422);
    expect(err(res.json).details?.[0].path).toBe("layer");
  });

  it("randomly corrupted shapefile uploads never cause a 500 or a partial write", async () => {
    const original = demoFile("reaches").bytes;
    const networksBefore = await count("networks");
    await fc.assert(
      fc.asyncProperty(
        fc.array(fc.tuple(fc.nat(original.length - 1), fc.integer({ min: 0, max: 255 })), { minLength: 1, maxLength: 40 }),
        fc.option(fc.nat(original.length), { nil: undefined }),
        async (flips, cut) => {
          const bytes = new Uint8Array(original);
          for (const [at, value] of flips) bytes[at] = value;
          const before = await count("imports");
          const res = await upload(demoForm("reaches", "reaches", cut === undefined ? bytes : bytes.slice(0, cut)));
          expect([201, 422]).toContain(res.status);
          if (res.status === 422) expect(await count("imports")).toBe(before);
          else expect(await count("imports")).toBe(before + 1);
        },
      ),
      { numRuns: 60, seed: 20261201 },
    );
    expect(await count("networks")).toBe(networksBefore);
  });
});

describe("validating and committing a network", () => {
  it("validates without saving: no errors, one reversed reach, facilities not yet known", async () => {
    const draft = await uploadDemo(db, w.users.planner, w.basinId);
    const before = await count("networks");
    const res = await callRoute(validateRoute.POST, "POST", { userId: w.users.planner.id, params: { basinId: w.basinId }, body: draft });
    expect(res.status).toBe(200);
    const { report, knownPermits } = res.json as { report: { errors: unknown[]; warnings: { code: string; features: string[] }[]; network: { reaches: unknown[]; dischargers: { reachId: string; snapDistanceM: number }[] } }; knownPermits: string[] };
    expect(report.errors).toEqual([]);
    expect(report.warnings.map((x) => [x.code, x.features])).toEqual([["reach_reversed", ["HC-01"]]]);
    expect(report.network.reaches).toHaveLength(17);
    expect(report.network.dischargers.map((d) => d.reachId).sort()).toEqual(["BB-03", "HC-02", "OC-03", "TR-03", "TR-06"]);
    expect(knownPermits).toEqual([]);
    expect(await count("networks")).toBe(before);
  });

  it("commits versions in one transaction; facilities keep their identity by permit id", async () => {
    const facilitiesBefore = await count("facilities");
    const draft1 = await uploadDemo(db, w.users.planner, w.basinId);
    const first = await callRoute(networksRoute.POST, "POST", {
      userId: w.users.planner.id,
      params: { basinId: w.basinId },
      body: { draft: draft1, note: "first", acceptReport: true },
    });
    expect(first.status).toBe(201);
    const v1 = first.json as NetworkSummaryDto;
    expect(v1).toMatchObject({ version: 1, reachCount: 17, outfallCount: 5 });
    expect(await count("facilities")).toBe(facilitiesBefore + 5);

    const draft2 = await uploadDemo(db, w.users.planner, w.basinId);
    // validated again, each discharger's permit now names a facility of the basin, listed in file order
    const revalidated = await callRoute(validateRoute.POST, "POST", { userId: w.users.planner.id, params: { basinId: w.basinId }, body: draft2 });
    const again = revalidated.json as { report: { network: { dischargers: { attributes: { permitId: string } }[] } }; knownPermits: string[] };
    expect(again.knownPermits).toHaveLength(5);
    expect(again.knownPermits).toEqual(again.report.network.dischargers.map((d) => d.attributes.permitId));
    const second = await callRoute(networksRoute.POST, "POST", {
      userId: w.users.lead.id,
      params: { basinId: w.basinId },
      body: { draft: draft2, acceptReport: true },
    });
    expect(second.status).toBe(201);
    expect((second.json as NetworkSummaryDto).version).toBe(2);
    expect(await count("facilities")).toBe(facilitiesBefore + 5);

    const get = (networkId: string) =>
      callRoute(networkRoute.GET, "GET", { userId: w.users.planner.id, params: { basinId: w.basinId, networkId } });
    const latest = (await get("latest")).json as NetworkDto;
    expect(latest.version).toBe(2);
    const old = (await get(v1.id)).json as NetworkDto;
    expect(old.version).toBe(1);
    expect(old.outfalls.map((o) => o.facilityId).sort()).toEqual(latest.outfalls.map((o) => o.facilityId).sort());
    const tr03 = old.outfalls.find((o) => o.permitId === "DP-1001")!;
    expect(tr03.reachId).toBe("TR-03");
    expect(tr03.snapDistanceM).toBeGreaterThanOrEqual(0);
    expect(old.geojson.features.filter((f) => f.properties?.kind === "reach")).toHaveLength(17);
    const hc01 = old.reaches.find((r) => r.id === "HC-01")!;
    expect(hc01.flipped).toBe(true);
    // 77 °F in the shapefile → 25 °C stored (exact conversion)
    expect(old.reaches.find((r) => r.id === "TR-01")!.attributes.temperatureC).toBeCloseTo(25, 9);

    const imports = await db.selectFrom("imports").select("status").where("id", "in", [draft1.reachImportId, draft2.reachImportId]).execute();
    expect(imports.map((i) => i.status)).toEqual(["committed", "committed"]);
  });

  it("refuses to commit a draft whose report has errors, and writes nothing", async () => {
    const draft = await uploadDemo(db, w.users.planner, w.basinId);
    const before = await Promise.all([count("networks"), count("reaches"), count("outfalls"), count("facilities")]);
    const res = await callRoute(networksRoute.POST, "POST", {
      userId: w.users.planner.id,
      params: { basinId: w.basinId },
      body: { draft: { ...draft, options: { ...draft.options, maxSnapDistanceM: 1 } }, acceptReport: true },
    });
    expect(res.status).toBe(422);
    expect(err(res.json).message).toMatch(/nothing was saved/);
    expect(err(res.json).details!.length).toBeGreaterThan(0);
    expect(await Promise.all([count("networks"), count("reaches"), count("outfalls"), count("facilities")])).toEqual(before);
  });

  it("needs the report accepted, and a known upload of the right layer", async () => {
    const draft = await uploadDemo(db, w.users.planner, w.basinId);
    const notAccepted = await callRoute(networksRoute.POST, "POST", {
      userId: w.users.planner.id,
      params: { basinId: w.basinId },
      body: { draft },
    });
    expect(notAccepted.status).toBe(422);
    expect(err(notAccepted.json).details![0].path).toBe("acceptReport");
    const swapped = await callRoute(validateRoute.POST, "POST", {
      userId: w.users.planner.id,
      params: { basinId: w.basinId },
      body: { ...draft, reachImportId: draft.dischargerImportId },
    });
    expect(swapped.status).toBe(422);
    expect(err(swapped.json).details![0].path).toBe("reachImportId");
    const badMapping = await callRoute(validateRoute.POST, "POST", {
      userId: w.users.planner.id,
      params: { basinId: w.basinId },
      body: { ...draft, reachMapping: { ...DEMO_REACH_MAPPING, designFlow: { source: "FLOW_CFS", unit: "gallons" } } },
    });
    expect(badMapping.status).toBe(422);
    expect(err(badMapping.json).details![0].path).toBe("reachMapping.designFlow.unit");
  });

  it("uploads from another basin cannot be used", async () => {
    const other = await buildWorld(db);
    const draft = await uploadDemo(db, other.users.planner, other.basinId);
    const res = await callRoute(validateRoute.POST, "POST", { userId: w.users.planner.id, params: { basinId: w.basinId }, body: draft });
    expect(res.status).toBe(422);
    expect(err(res.json).message).toMatch(/no such upload in this basin/);
  });
});

describe("saved field mappings", () => {
  it("are saved per basin and replaced by name", async () => {
    const save = (mapping: unknown) =>
      callRoute(mappingsRoute.POST, "POST", {
        userId: w.users.planner.id,
        params: { basinId: w.basinId },
        body: { layer: "dischargers", name: "County permit file", mapping },
      });
    expect((await save(DEMO_DISCHARGER_MAPPING)).status).toBe(201);
    expect((await save({ ...DEMO_DISCHARGER_MAPPING, contactEmail: undefined })).status).toBe(201);
    const list = await callRoute(mappingsRoute.GET, "GET", { userId: w.users.planner.id, params: { basinId: w.basinId } });
    const named = (list.json as { name: string; mapping: Record<string, unknown> }[]).filter((m) => m.name === "County permit file");
    expect(named).toHaveLength(1);
    expect(named[0].mapping.contactEmail).toBeUndefined();
  });
});

describe("inline edits of the newest network version", () => {
  it("change the stored SI value, are audited, and leave earlier versions as saved", async () => {
    const world = await buildWorld(db);
    const { commitDemo } = await import("../support/demo-network");
    const v1 = (await commitDemo(db, world.users.planner, world.basinId)).network;
    const patch = (await import("@/app/api/basins/[basinId]/networks/[networkId]/reaches/[reachId]/route")).PATCH;
    const edit = (networkId: string, reachId: string, body: unknown) =>
      callRoute(patch, "PATCH", { userId: world.users.planner.id, params: { basinId: world.basinId, networkId, reachId }, body });

    expect((await edit(v1.id, "TR-03", { depthM: 0.75, name: "Tamsel River (edited)" })).status).toBe(204);
    const row = await db.selectFrom("reaches").selectAll().where("network_id", "=", v1.id).where("reach_key", "=", "TR-03").executeTakeFirstOrThrow();
    expect(row.attributes.depthM).toBe(0.75);
    expect(row.name).toBe("Tamsel River (edited)");
    const audit = await db.selectFrom("audit_events").selectAll().where("basin_id", "=", world.basinId).where("action", "=", "network.reach_edited").execute();
    expect(audit).toHaveLength(1);

    // clearing a value with null
    expect((await edit(v1.id, "TR-03", { velocityMps: null })).status).toBe(204);
    const cleared = await db.selectFrom("reaches").select("attributes").where("network_id", "=", v1.id).where("reach_key", "=", "TR-03").executeTakeFirstOrThrow();
    expect(cleared.attributes).not.toHaveProperty("velocityMps");

    const bad = await edit(v1.id, "TR-03", { depthM: -1 });
    expect(bad.status).toBe(422);
    expect(err(bad.json).details![0]).toMatchObject({ path: "depthM", message: "Depth (m) must be above zero" });
    expect((await edit(v1.id, "TR-03", { colour: "blue" })).status).toBe(422);
    expect((await edit(v1.id, "XX-99", { depthM: 1 })).status).toBe(404);

    await commitDemo(db, world.users.planner, world.basinId);
    const old = await edit(v1.id, "TR-03", { depthM: 0.9 });
    expect(old.status).toBe(409);
    expect(err(old.json).message).toMatch(/not the newest version/);
  });
});
