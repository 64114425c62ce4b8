import { route } from "@/lib/api/route";
import { basemapArchiveResponse } from "@/lib/map/basemap-archive";

export const dynamic = "force-dynamic";

/** Byte ranges of the configured PMTiles archive, as the map's pmtiles protocol asks for them. */
export const GET = route({ access: { public: true } }, async ({ req }) => basemapArchiveResponse(req.headers.get("range")));
