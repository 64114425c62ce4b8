import { beforeAll, describe, expect, it } from "vitest";
import { createRun, getRun, getRunJson, processRun } from "@/lib/services/runs";
import { createScenario } from "@/lib/services/scenarios";
import { scenarioCreateSchema } from "@/lib/validation/scenario";
import { fileDb } from "../support/file-db";
import { commitDemo } from "../support/demo-network";
import { buildWorld, type World } from "../support/world";
import { scoped } from "../support/scoped";

const db = fileDb();
let w: World;
beforeAll(async () => {
  w = await buildWorld(db);
  await commitDemo(db, w.users.planner, w.basinId);
});

describe("reading a stored run as JSON text", () => {
  it("follows the run from queued to done, then serves the finished document unchanged, still checking who asks", async () => {
    const scenario = await scoped(createScenario)(db, w.users.planner, w.basinId, scenarioCreateSchema.parse({ name: "Read me", inputs: { conditions: [{ name: "7Q10" }] } }));
    const run = await scoped(createRun)(db, w.users.planner, w.basinId, scenario.id, "model");
    const queued = await scoped(getRunJson)(db, w.users.planner, w.basinId, run.id);
    expect(JSON.parse(new TextDecoder().decode(queued.bytes))).toMatchObject({ id: run.id, status: "queued", result: null });

    await processRun(db, run.id);
    const first = await scoped(getRunJson)(db, w.users.planner, w.basinId, run.id);
    expect(first.etag).not.toBe(queued.etag);
    // the same document getRun builds by parsing
    expect(JSON.parse(new TextDecoder().decode(first.bytes))).toEqual(JSON.parse(JSON.stringify(await scoped(getRun)(db, w.users.planner, w.basinId, run.id))));
    const again = await scoped(getRunJson)(db, w.users.lead, w.basinId, run.id);
    expect(again).toEqual(first);
    // a kept document is never handed to someone who may not read it
    await expect(scoped(getRunJson)(db, w.users.stakeholder, w.basinId, run.id)).rejects.toMatchObject({ status: 403 });
    await expect(scoped(getRunJson)(db, w.users.outsider, w.basinId, run.id)).rejects.toMatchObject({ status: 403 });
    // nor under another basin's name
    await expect(scoped(getRunJson)(db, w.users.outsider, w.otherBasinId, run.id)).rejects.toMatchObject({ status: 404 });
  });
});
