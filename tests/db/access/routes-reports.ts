import { all, plan, planOf, planners, signedIn, type Entry } from "./kit";

/**
 * A plan's downloads (PDF report, allocation CSV, reaches GeoJSON): readable as the
 * plan is — published by anyone, in review by anyone signed in, drafts by planners
 * and leads. Each route is checked at a different stage so all three rules are covered.
 */
export const routes: Record<string, Entry> = {
  "app/api/basins/[basinId]/plans/[planId]/report/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/plans/[planId]/report/route"),
    methods: { GET: { expect: planners(200), prepare: plan("draft"), params: planOf } },
  },
  "app/api/basins/[basinId]/plans/[planId]/csv/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/plans/[planId]/csv/route"),
    methods: { GET: { expect: signedIn(200), prepare: plan("review"), params: planOf } },
  },
  "app/api/basins/[basinId]/plans/[planId]/geojson/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/plans/[planId]/geojson/route"),
    methods: { GET: { expect: all(200), prepare: plan("published"), params: planOf } },
  },
};
