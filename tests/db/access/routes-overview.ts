import { basin, planners, withRun, type Entry } from "./kit";

/** The runs list's outcome column: planners and leads, like the runs list itself. */
export const routes: Record<string, Entry> = {
  "app/api/basins/[basinId]/runs/outcomes/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/runs/outcomes/route"),
    methods: { GET: { expect: planners(200), prepare: withRun, params: basin } },
  },
};
