import { all, type Entry } from "./kit";

/**
 * The maps' basemap: public, since published plans have maps for anyone. The test
 * server has no archive configured, so the archive route is a 404 for everyone and
 * the question route says so with a 200.
 */
export const routes: Record<string, Entry> = {
  "app/api/map/basemap/route.ts": {
    load: () => import("@/app/api/map/basemap/route"),
    methods: { GET: { expect: all(200) } },
  },
  "app/api/map/basemap/archive/route.ts": {
    load: () => import("@/app/api/map/basemap/archive/route"),
    methods: { GET: { expect: all(404) } },
  },
};
