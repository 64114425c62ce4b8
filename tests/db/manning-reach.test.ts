import { beforeAll, describe, expect, it } from "vitest";
import * as reachRoute from "@/app/api/basins/[basinId]/networks/[networkId]/reaches/[reachId]/route";
import * as runRoute from "@/app/api/basins/[basinId]/runs/[runId]/route";
import * as scenarioRunsRoute from "@/app/api/basins/[basinId]/scenarios/[scenarioId]/runs/route";
import * as scenariosRoute from "@/app/api/basins/[basinId]/scenarios/route";
import { runModel } from "@/lib/model";
import { processRun, type RunDto, type RunSummaryDto } from "@/lib/services/runs";
import type { ScenarioDto } from "@/lib/services/scenarios";
import { callRoute } from "../support/call-route";
import { commitDemo } from "../support/demo-network";
import { err } from "../support/errors";
import { fileDb } from "../support/file-db";
import { buildWorld, type World } from "../support/world";

/**
 * A reach given a Manning channel in the network table has its velocity and depth found at
 * each condition's flow, through the real routes and the run service; the stored run says so
 * per segment and reproduces from its model files.
 */
const db = fileDb();
let w: World;
let networkId: string;
beforeAll(async () => {
  w = await buildWorld(db);
  networkId = (await commitDemo(db, w.users.planner, w.basinId)).network.id;
});

const planner = () => w.users.planner.id;
const editReach = (reachId: string, body: unknown) =>
  callRoute(reachRoute.PATCH, "PATCH", { userId: planner(), params: { basinId: w.basinId, networkId, reachId }, body });
async function scenario(name: string): Promise<ScenarioDto> {
  const res = await callRoute(scenariosRoute.POST, "POST", {
    userId: planner(),
    params: { basinId: w.basinId },
    body: { name, inputs: { conditions: [{ name: "design flow", temperatureC: 26 }, { name: "half flow", flowScale: 0.5, temperatureC: 26 }] } },
  });
  expect(res.status, JSON.stringify(res.json)).toBe(201);
  return res.json as ScenarioDto;
}
const queueModel = (scenarioId: string) => callRoute(scenarioRunsRoute.POST, "POST", { userId: planner(), params: { basinId: w.basinId, scenarioId }, body: { kind: "model" } });

describe("a Manning channel typed into the network table", () => {
  it("makes that reach's velocity and depth follow each condition's flow, recorded per segment", async () => {
    // TR-03 has a slope in the demo network; n and a bottom width are typed in (invented, for the test only)
    const edit = await editReach("TR-03", { manningN: 0.04, bottomWidthM: 7, sideSlope: 2 });
    expect(edit.status, JSON.stringify(edit.json)).toBe(204);
    const s = await scenario("Manning on TR-03");
    const queued = await queueModel(s.id);
    expect(queued.status, JSON.stringify(queued.json)).toBe(202);
    const id = (queued.json as RunSummaryDto).id;
    await processRun(db, id);
    const run = (await callRoute(runRoute.GET, "GET", { userId: planner(), params: { basinId: w.basinId, runId: id } })).json as RunDto;
    expect(run.status).toBe("done");
    const [design, half] = run.result!.conditions.map((c) => c.run.reaches.find((r) => r.id === "TR-03")!.segments[0]);
    expect(design.hydraulics).toBe("manning");
    expect(half.hydraulics).toBe("manning");
    expect(half.flow_m3_s).toBeLessThan(design.flow_m3_s);
    expect(half.velocity_m_s).toBeLessThan(design.velocity_m_s);
    expect(half.depth_m).toBeLessThan(design.depth_m);
    // the other reaches keep the velocity and depth entered at design flow, at any flow
    const other = run.result!.conditions.map((c) => c.run.reaches.find((r) => r.id === "TR-04")!.segments[0]);
    expect(other[0].hydraulics).toBe("given");
    expect(other[1].velocity_m_s).toBe(other[0].velocity_m_s);
    // the stored model file carries the channel and reproduces the stored run
    const file = run.modelFiles[0].file;
    expect(file.reaches.find((r) => r.id === "TR-03")!.manning).toEqual({ n: 0.04, bottom_width_m: 7, side_slope: 2 });
    expect(runModel(file)).toEqual(run.result!.conditions[0].run);
  });

  it("a channel with a part missing is refused when the run is asked for, naming the reach and what to add", async () => {
    const edit = await editReach("TR-05", { manningN: 0.03, slope: null });
    expect(edit.status).toBe(204);
    const s = await scenario("Half a channel on TR-05");
    const res = await queueModel(s.id);
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
    expect(err(res.json).message).toMatch(/Reach TR-05 has part of a Manning channel: add a bottom width and a slope/);
  });

  it("refuses a roughness of zero or a negative side slope at the edit, naming the field", async () => {
    const zero = await editReach("TR-06", { manningN: 0 });
    expect(zero.status).toBe(422);
    expect(JSON.stringify(zero.json)).toMatch(/manningN/);
    const negative = await editReach("TR-06", { sideSlope: -1 });
    expect(negative.status).toBe(422);
    expect(JSON.stringify(negative.json)).toMatch(/sideSlope/);
  });
});

describe("hydraulic-geometry coefficients typed into the network table", () => {
  it("make that reach's velocity and depth U = a·Q^b, H = c·Q^f at each condition's flow (exact), recorded per segment", async () => {
    // the half channel left on TR-05 above is cleared; TR-07's coefficients are invented for the test only
    expect((await editReach("TR-05", { manningN: null })).status).toBe(204);
    const edit = await editReach("TR-07", { hgVelocityCoef: 0.3, hgVelocityExp: 0.4, hgDepthCoef: 0.5, hgDepthExp: 0.35 });
    expect(edit.status, JSON.stringify(edit.json)).toBe(204);
    const s = await scenario("Hydraulic geometry on TR-07");
    const queued = await queueModel(s.id);
    expect(queued.status, JSON.stringify(queued.json)).toBe(202);
    const id = (queued.json as RunSummaryDto).id;
    await processRun(db, id);
    const run = (await callRoute(runRoute.GET, "GET", { userId: planner(), params: { basinId: w.basinId, runId: id } })).json as RunDto;
    expect(run.status).toBe("done");
    for (const c of run.result!.conditions) {
      for (const seg of c.run.reaches.find((r) => r.id === "TR-07")!.segments) {
        expect(seg.hydraulics).toBe("hydraulic-geometry");
        // exact: the power laws at the segment's own flow
        expect(seg.velocity_m_s).toBeCloseTo(0.3 * seg.flow_m3_s ** 0.4, 12);
        expect(seg.depth_m).toBeCloseTo(0.5 * seg.flow_m3_s ** 0.35, 12);
      }
    }
    expect(run.modelFiles[0].file.reaches.find((r) => r.id === "TR-07")!.hydraulic_geometry).toEqual({ a: 0.3, b: 0.4, c: 0.5, f: 0.35 });
  });

  it("a geometry with a part missing, or beside a Manning channel, is refused naming the reach", async () => {
    expect((await editReach("TR-08", { hgVelocityCoef: 0.3, hgVelocityExp: 0.4 })).status).toBe(204);
    const s = await scenario("Half a geometry on TR-08");
    const res = await queueModel(s.id);
    expect(err(res.json).message).toMatch(/Reach TR-08 has part of a hydraulic geometry: add the depth coefficient c, the depth exponent f/);
    expect((await editReach("TR-08", { hgVelocityCoef: null, hgVelocityExp: null })).status).toBe(204);
    expect((await editReach("TR-03", { hgVelocityCoef: 0.3, hgVelocityExp: 0.4, hgDepthCoef: 0.5, hgDepthExp: 0.35 })).status).toBe(204);
    const both = await queueModel((await scenario("Both on TR-03")).id);
    expect(err(both.json).message).toMatch(/Reach TR-03 has both a hydraulic geometry and a Manning channel/);
  });
});
