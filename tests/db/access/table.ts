import { readdirSync, statSync } from "node:fs";
import { join, relative } from "node:path";
import { fileURLToPath } from "node:url";
import { commitDemo, demoForm } from "../../support/demo-network";
import { gaugeForm, uploadDemoGauge } from "../../support/gauge-record";
import { scoped } from "../../support/scoped";
import { surveyForm, uploadDemoSurvey } from "../../support/survey";
import { uploadSurvey } from "@/lib/services/surveys";
import { surveyUploadSchema } from "@/lib/validation/surveys";
import { DEMO_DISCHARGER_MAPPING } from "@/db/seed/demo-gis";
import {
  SCENARIO,
  all,
  basin,
  denied,
  draftOf,
  lead,
  matrix,
  period,
  plan,
  planOf,
  planners,
  runOf,
  scenarioOf,
  signedIn,
  threadOf,
  uniq,
  withAllocationRun,
  withDraft,
  withRun,
  withScenario,
  type Entry,
} from "./kit";

/**
 * Every API route × every kind of caller → the expected status. The first
 * test fails when a route file or an exported method has no entry here, so a
 * new route cannot ship without its access rules being written down.
 * Shared builders (callers, expectations, worlds at a plan stage) are in
 * ./kit.ts. The matrix test (../api-access-matrix.test.ts) and the
 * cross-basin test (tests/security/cross-basin-ids.test.ts) both read it.
 */
const CORE: Record<string, Entry> = {
  "app/api/auth/[...nextauth]/route.ts": {
    load: () => import("@/app/api/auth/[...nextauth]/route"),
    methods: {},
    skip: "next-auth's own sign-in handler; covered by the sign-in tests",
  },
  "app/api/health/route.ts": {
    load: () => import("@/app/api/health/route"),
    methods: { GET: { expect: all(200) } },
  },
  "app/api/health/live/route.ts": {
    load: () => import("@/app/api/health/live/route"),
    methods: { GET: { expect: all(200) } },
  },
  "app/api/me/session/route.ts": {
    load: () => import("@/app/api/me/session/route"),
    methods: { GET: { expect: all(200) } },
  },
  "app/api/me/route.ts": {
    load: () => import("@/app/api/me/route"),
    methods: { GET: { expect: signedIn(200) } },
  },
  "app/api/basins/route.ts": {
    load: () => import("@/app/api/basins/route"),
    methods: {
      GET: { expect: signedIn(200) },
      POST: {
        // outsider leads another basin, so may create one
        expect: denied({ admin: 201, lead: 201, outsider: 201 }),
        body: () => ({ name: "New basin", slug: `new-${uniq()}`, description: "", doCriterionMgL: 5, unitSystem: "SI" }),
      },
    },
  },
  "app/api/basins/[basinId]/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/route"),
    methods: {
      GET: { expect: signedIn(200, { outsider: 403 }), params: basin },
      PATCH: { expect: denied({ admin: 200, lead: 200 }), params: basin, body: () => ({ doCriterionMgL: 4.5 }) },
    },
  },
  "app/api/basins/[basinId]/members/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/members/route"),
    methods: {
      GET: { expect: denied({ admin: 200, lead: 200, planner: 200 }), params: basin },
      POST: {
        expect: denied({ admin: 201, lead: 201 }),
        params: basin,
        body: (w) => ({ email: w.users.spare.email, role: "stakeholder" }),
      },
    },
  },
  "app/api/basins/[basinId]/members/[userId]/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/members/[userId]/route"),
    methods: {
      PATCH: {
        expect: denied({ admin: 200, lead: 200 }),
        params: (w) => ({ basinId: w.basinId, userId: w.users.target.id }),
        body: () => ({ role: "planner" }),
      },
      DELETE: {
        expect: denied({ admin: 204, lead: 204 }),
        params: (w) => ({ basinId: w.basinId, userId: w.users.target.id }),
      },
    },
  },
  "app/api/basins/[basinId]/facilities/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/facilities/route"),
    methods: {
      GET: { expect: denied({ admin: 200, lead: 200, planner: 200, discharger: 200 }), params: basin },
      POST: {
        expect: denied({ admin: 201, lead: 201, planner: 201 }),
        params: basin,
        body: () => ({ name: "Another plant", permitId: `X-${uniq()}` }),
      },
    },
  },
  "app/api/basins/[basinId]/facilities/[facilityId]/users/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/facilities/[facilityId]/users/route"),
    methods: {
      POST: {
        expect: denied({ admin: 201, lead: 201 }),
        params: (w) => ({ basinId: w.basinId, facilityId: w.facilityId }),
        body: (w) => ({ userId: w.users.spareDischarger.id }),
      },
    },
  },
  "app/api/basins/[basinId]/facilities/[facilityId]/users/[userId]/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/facilities/[facilityId]/users/[userId]/route"),
    methods: {
      DELETE: {
        expect: denied({ admin: 204, lead: 204 }),
        params: (w) => ({ basinId: w.basinId, facilityId: w.facilityId, userId: w.users.discharger.id }),
      },
    },
  },
  "app/api/basins/[basinId]/audit/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/audit/route"),
    methods: { GET: { expect: denied({ admin: 200, lead: 200 }), params: basin } },
  },
  "app/api/basins/[basinId]/imports/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/imports/route"),
    methods: {
      GET: { expect: planners(200), params: basin },
      POST: { expect: planners(201), params: basin, body: () => demoForm("reachesGeoJson", "reaches") },
    },
  },
  "app/api/basins/[basinId]/gauges/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/gauges/route"),
    methods: {
      GET: { expect: planners(200), params: basin },
      POST: { expect: planners(201), params: basin, body: () => gaugeForm() },
    },
  },
  "app/api/basins/[basinId]/gauges/[gaugeId]/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/gauges/[gaugeId]/route"),
    methods: {
      GET: {
        expect: planners(200),
        prepare: async (w) => ({ gaugeId: (await uploadDemoGauge(matrix.db, w.users.planner, w.basinId)).id }),
        params: (w, p) => ({ basinId: w.basinId, gaugeId: p.gaugeId }),
      },
    },
  },
  "app/api/basins/[basinId]/temperature-records/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/temperature-records/route"),
    methods: {
      GET: { expect: planners(200), params: basin },
      POST: {
        expect: planners(201),
        params: basin,
        body: () => {
          const f = new FormData();
          f.set("name", "Matrix temperatures");
          f.set("file", new File(["date,temperature\n2025-07-01,21.5\n2025-07-02,22\n"], "t.csv"));
          return f;
        },
      },
    },
  },
  "app/api/basins/[basinId]/surveys/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/surveys/route"),
    methods: {
      GET: { expect: planners(200), params: basin },
      POST: {
        expect: planners(201),
        prepare: async (w) => ({ networkId: (await commitDemo(matrix.db, w.users.planner, w.basinId)).network.id }),
        params: basin,
        body: () => surveyForm(),
      },
    },
  },
  "app/api/basins/[basinId]/surveys/[surveyId]/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/surveys/[surveyId]/route"),
    methods: {
      GET: {
        expect: planners(200),
        prepare: async (w) => {
          await commitDemo(matrix.db, w.users.planner, w.basinId);
          return { surveyId: (await uploadDemoSurvey(matrix.db, w.users.planner, w.basinId)).id };
        },
        params: (w, p) => ({ basinId: w.basinId, surveyId: p.surveyId }),
      },
    },
  },
  "app/api/basins/[basinId]/imports/[importId]/file/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/imports/[importId]/file/route"),
    methods: {
      GET: {
        expect: planners(200),
        prepare: withDraft,
        params: (w, p) => ({ basinId: w.basinId, importId: p.reachImportId }),
      },
    },
  },
  "app/api/basins/[basinId]/networks/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/networks/route"),
    methods: {
      GET: { expect: planners(200), params: basin },
      POST: {
        expect: planners(201),
        prepare: withDraft,
        params: basin,
        body: (_w, p) => ({ draft: draftOf(p), acceptReport: true }),
      },
    },
  },
  "app/api/basins/[basinId]/networks/validate/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/networks/validate/route"),
    methods: { POST: { expect: planners(200), prepare: withDraft, params: basin, body: (_w, p) => draftOf(p) } },
  },
  "app/api/basins/[basinId]/networks/validate/[progressId]/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/networks/validate/[progressId]/route"),
    // progress is shown only to the one who started the validation: anyone else, a planner too, finds none
    methods: { GET: { expect: planners(404), params: (w) => ({ basinId: w.basinId, progressId: "00000000-0000-4000-8000-000000000000" }) } },
  },
  "app/api/basins/[basinId]/networks/[networkId]/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/networks/[networkId]/route"),
    methods: {
      GET: {
        expect: planners(200),
        prepare: async (w) => ({ networkId: (await commitDemo(matrix.db, w.users.planner, w.basinId)).network.id }),
        params: (w, p) => ({ basinId: w.basinId, networkId: p.networkId }),
      },
    },
  },
  "app/api/basins/[basinId]/networks/[networkId]/reaches/[reachId]/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/networks/[networkId]/reaches/[reachId]/route"),
    methods: {
      PATCH: {
        expect: planners(204),
        prepare: async (w) => ({ networkId: (await commitDemo(matrix.db, w.users.planner, w.basinId)).network.id }),
        params: (w, p) => ({ basinId: w.basinId, networkId: p.networkId, reachId: "TR-03" }),
        body: () => ({ depthM: 0.5 }),
      },
    },
  },
  "app/api/basins/[basinId]/networks/[networkId]/reaches/[reachId]/hydraulic-geometry/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/networks/[networkId]/reaches/[reachId]/hydraulic-geometry/route"),
    methods: {
      POST: {
        expect: planners(200),
        prepare: async (w) => {
          const networkId = (await commitDemo(matrix.db, w.users.planner, w.basinId)).network.id;
          const csv = "station,reach,km,flow,velocity,depth\nA,TR-03,0.5,1,0.3,0.5\nB,TR-03,1,2,0.4,0.6\n";
          const survey = await scoped(uploadSurvey)(matrix.db, w.users.planner, w.basinId, { name: "hg.csv", bytes: Buffer.from(csv) }, surveyUploadSchema.parse({ name: "Matrix measurements" }));
          return { networkId, surveyId: survey.id };
        },
        params: (w, p) => ({ basinId: w.basinId, networkId: p.networkId, reachId: "TR-03" }),
        body: (_w, p) => ({ surveyIds: [p.surveyId] }),
      },
    },
  },
  "app/api/basins/[basinId]/networks/[networkId]/outfalls/[facilityId]/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/networks/[networkId]/outfalls/[facilityId]/route"),
    methods: {
      PATCH: {
        expect: planners(204),
        prepare: async (w) => {
          const { network } = await commitDemo(matrix.db, w.users.planner, w.basinId);
          const f = await matrix.db.selectFrom("outfalls").select("facility_id").where("network_id", "=", network.id).executeTakeFirstOrThrow();
          return { networkId: network.id, facilityId: f.facility_id };
        },
        params: (w, p) => ({ basinId: w.basinId, networkId: p.networkId, facilityId: p.facilityId }),
        body: () => ({ effluentBod5MgL: 25 }),
      },
    },
  },
  "app/api/basins/[basinId]/field-mappings/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/field-mappings/route"),
    methods: {
      GET: { expect: planners(200), params: basin },
      POST: {
        expect: planners(201),
        params: basin,
        body: () => ({ layer: "dischargers", name: "Permit file", mapping: DEMO_DISCHARGER_MAPPING }),
      },
    },
  },
  "app/api/basins/[basinId]/scenarios/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/scenarios/route"),
    methods: {
      GET: { expect: planners(200), params: basin },
      POST: {
        expect: planners(201),
        prepare: async (w) => ({ networkId: (await commitDemo(matrix.db, w.users.planner, w.basinId)).network.id }),
        params: basin,
        body: () => SCENARIO,
      },
    },
  },
  "app/api/basins/[basinId]/scenarios/[scenarioId]/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/scenarios/[scenarioId]/route"),
    methods: {
      GET: { expect: planners(200), prepare: withScenario, params: scenarioOf },
      PATCH: { expect: planners(200), prepare: withScenario, params: scenarioOf, body: () => ({ version: 1, description: "edited" }) },
      DELETE: { expect: planners(204), prepare: withScenario, params: scenarioOf },
    },
  },
  "app/api/basins/[basinId]/scenarios/[scenarioId]/duplicate/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/scenarios/[scenarioId]/duplicate/route"),
    methods: { POST: { expect: planners(201), prepare: withScenario, params: scenarioOf, body: () => ({ name: "Copy" }) } },
  },
  "app/api/basins/[basinId]/scenarios/[scenarioId]/runs/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/scenarios/[scenarioId]/runs/route"),
    methods: {
      GET: { expect: planners(200), prepare: withScenario, params: scenarioOf },
      POST: { expect: planners(202), prepare: withScenario, params: scenarioOf, body: () => ({ kind: "model" }) },
    },
  },
  "app/api/basins/[basinId]/scenarios/[scenarioId]/calibrations/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/scenarios/[scenarioId]/calibrations/route"),
    methods: {
      POST: {
        expect: planners(202),
        prepare: async (w) => ({ ...(await withScenario(w)), surveyId: (await uploadDemoSurvey(matrix.db, w.users.planner, w.basinId)).id }),
        params: scenarioOf,
        body: (_w, p) => ({ surveyId: p.surveyId, condition: "7Q10", fit: [{ parameter: "kd20_per_day", reaches: "all", min: 0.05, max: 3, start: 0.3 }] }),
      },
    },
  },
  "app/api/basins/[basinId]/runs/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/runs/route"),
    methods: { GET: { expect: planners(200), params: basin } },
  },
  "app/api/basins/[basinId]/runs/[runId]/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/runs/[runId]/route"),
    methods: { GET: { expect: planners(200), prepare: withRun, params: runOf } },
  },
  "app/api/basins/[basinId]/runs/[runId]/status/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/runs/[runId]/status/route"),
    methods: { GET: { expect: planners(200), prepare: withRun, params: runOf } },
  },
  "app/api/basins/[basinId]/runs/[runId]/model-file/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/runs/[runId]/model-file/route"),
    methods: { GET: { expect: planners(200), prepare: withRun, params: runOf } },
  },
  "app/api/basins/[basinId]/plans/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/plans/route"),
    methods: {
      GET: { expect: all(200), params: basin },
      POST: { expect: planners(201), prepare: withAllocationRun, params: basin, body: (_w, p) => ({ runId: p.runId, title: "Matrix plan" }) },
    },
  },
  "app/api/basins/[basinId]/plans/[planId]/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/plans/[planId]/route"),
    // a draft: planners and leads only
    methods: { GET: { expect: planners(200), prepare: plan("draft"), params: planOf } },
  },
  "app/api/basins/[basinId]/plans/[planId]/review/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/plans/[planId]/review/route"),
    methods: {
      POST: { expect: lead(204), prepare: plan("draft"), params: planOf, body: period },
      PATCH: {
        expect: lead(204),
        prepare: plan("review"),
        params: planOf,
        body: () => ({ endsAt: new Date(Date.now() + 45 * 86_400_000).toISOString(), reason: "More time was asked for" }),
      },
    },
  },
  "app/api/basins/[basinId]/plans/[planId]/publish/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/plans/[planId]/publish/route"),
    methods: { POST: { expect: lead(204), prepare: plan("closed"), params: planOf, body: () => ({}) } },
  },
  "app/api/basins/[basinId]/plans/[planId]/withdraw/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/plans/[planId]/withdraw/route"),
    methods: { POST: { expect: lead(204), prepare: plan("draft"), params: planOf } },
  },
  "app/api/basins/[basinId]/threads/[threadId]/comments/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/threads/[threadId]/comments/route"),
    // during review anyone signed in may comment, members of the public included
    methods: { POST: { expect: signedIn(201), prepare: plan("review"), params: threadOf, body: () => ({ body: "A comment" }) } },
  },
  "app/api/basins/[basinId]/threads/[threadId]/response/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/threads/[threadId]/response/route"),
    methods: { POST: { expect: planners(204), prepare: plan("review"), params: threadOf, body: () => ({ response: "Answered" }) } },
  },
  "app/api/users/route.ts": {
    load: () => import("@/app/api/users/route"),
    methods: {
      GET: { expect: denied({ admin: 200 }) },
      POST: {
        expect: denied({ admin: 201 }),
        body: () => ({ name: "New Person", email: `new-${uniq()}@world.test`, password: "long-enough-pw", isAdmin: false }),
      },
    },
  },
};

export const ROOT = fileURLToPath(new URL("../../..", import.meta.url));
export function routeFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return routeFiles(path);
    return name === "route.ts" ? [relative(ROOT, path)] : [];
  });
}
export const HTTP_METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"];

/**
 * Each area's routes may live in its own table, tests/db/access/routes-*.ts,
 * exporting `routes`; they are merged with the core table here.
 */
const AREA_TABLES = import.meta.glob<{ routes: Record<string, Entry> }>("./routes-*.ts", { eager: true });
export const TABLE: Record<string, Entry> = { ...CORE };
for (const [file, mod] of Object.entries(AREA_TABLES)) {
  for (const [route, entry] of Object.entries(mod.routes)) {
    if (route in TABLE) throw new Error(`${file}: ${route} is listed twice`);
    TABLE[route] = entry;
  }
}

