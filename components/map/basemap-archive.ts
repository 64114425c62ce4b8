import { layers as protomapsLayers, namedFlavor } from "@protomaps/basemaps";
import { PMTiles, Protocol, TileType } from "pmtiles";
import { maplibregl } from "./map-setup";

/** What /api/map/basemap answers: the archive's address when the server has one configured. */
export interface BasemapInfo {
  pmtiles: string | null;
}

let info: Promise<BasemapInfo> | null = null;
let protocol: Protocol | null = null;

/** The server's basemap configuration, asked once per page load; none when the question fails. */
function basemapInfo(): Promise<BasemapInfo> {
  info ??= fetch("/api/map/basemap", { headers: { accept: "application/json" } })
    .then((r) => (r.ok ? (r.json() as Promise<BasemapInfo>) : { pmtiles: null }))
    .catch(() => ({ pmtiles: null }));
  return info;
}

/** The first layer drawn from the basin's own data: the basemap goes beneath it. */
function firstBasinLayer(map: maplibregl.Map): string | undefined {
  return map.getStyle().layers.find((l) => l.type !== "background")?.id;
}

/**
 * When Sagline serves a PMTiles archive (SAGLINE_BASEMAP_PMTILES on the server), draws it
 * under the basin's layers: a raster archive as it is, a vector archive in the Protomaps
 * schema with that package's light layers (its place labels left out, so they neither
 * fetch another font nor crowd the basin's own labels). Without one the map is unchanged;
 * a basemap style URL, when configured, takes its place.
 */
export async function addBasemapArchive(map: maplibregl.Map): Promise<void> {
  if (process.env.NEXT_PUBLIC_SAGLINE_BASEMAP_STYLE) return; // a basemap style, when named, is the basemap
  const { pmtiles } = await basemapInfo();
  if (!pmtiles) return;
  const url = new URL(pmtiles, window.location.origin).href;
  if (!protocol) {
    protocol = new Protocol();
    maplibregl.addProtocol("pmtiles", protocol.tile);
  }
  const archive = protocol.get(url) ?? new PMTiles(url);
  protocol.add(archive);
  const header = await archive.getHeader();
  if (!map.getStyle()) return; // the map went away while the header loaded
  const before = firstBasinLayer(map);
  if (header.tileType === TileType.Mvt) {
    map.addSource("basemap", { type: "vector", url: `pmtiles://${url}`, attribution: "" });
    for (const layer of protomapsLayers("basemap", namedFlavor("light"), { lang: "en" })) {
      if (layer.type === "symbol" || layer.type === "background") continue;
      map.addLayer(layer, before);
    }
  } else {
    map.addSource("basemap", { type: "raster", url: `pmtiles://${url}`, tileSize: 256 });
    map.addLayer({ id: "basemap-raster", type: "raster", source: "basemap", paint: { "raster-opacity": 0.85 } }, before);
  }
}
