import { route } from "@/lib/api/route";
import { basemapInfo } from "@/lib/map/basemap-archive";

export const dynamic = "force-dynamic";

/** Whether this server has a basemap archive for the maps (public: published plans have maps). */
export const GET = route({ access: { public: true } }, async () => basemapInfo());
