import type { ExpressionSpecification, FilterSpecification, Map as MapLibreMap } from "maplibre-gl";
import { LABEL_FONT, MAP_COLOURS } from "./map-style";

/** Zoom from which a reach label adds the reach's name to its id. */
export const REACH_NAME_ZOOM = 11;
/** Zoom below which no labels are drawn (the whole basin is then a few pixels wide). */
export const LABEL_MIN_ZOOM = 6;

const hasName: ExpressionSpecification = ["to-boolean", ["coalesce", ["get", "name"], ""]];

/** A reach's label: its id, and from REACH_NAME_ZOOM on its name too. */
export const REACH_LABEL: ExpressionSpecification = [
  "step",
  ["zoom"],
  ["to-string", ["get", "id"]],
  REACH_NAME_ZOOM,
  ["case", hasName, ["concat", ["to-string", ["get", "id"]], " · ", ["get", "name"]], ["to-string", ["get", "id"]]],
];

/** An outfall's label: the facility's name, or its permit id when it has none. */
export const OUTFALL_LABEL: ExpressionSpecification = ["case", hasName, ["get", "name"], ["to-string", ["get", "id"]]];

/** The two label layers' ids, reach labels first (drawn below, placed after outfall labels). */
export const LABEL_LAYERS = { reaches: "reach-labels", outfalls: "outfall-labels" } as const;

/**
 * Labels along reaches (`symbol-placement: line`) and beside outfalls, collision-aware
 * (`text-allow-overlap: false`: MapLibre drops a label that would overlap one already
 * placed, outfalls first since their layer is on top) and only from LABEL_MIN_ZOOM on.
 * Add them after the layers they describe.
 */
export function addLabelLayers(map: MapLibreMap, source: string, filters: { reaches: FilterSpecification; outfalls: FilterSpecification }): void {
  const halo = { "text-color": MAP_COLOURS.label, "text-halo-color": MAP_COLOURS.labelHalo, "text-halo-width": 1.6 };
  map.addLayer({
    id: LABEL_LAYERS.reaches,
    type: "symbol",
    source,
    minzoom: LABEL_MIN_ZOOM,
    filter: filters.reaches,
    layout: {
      "symbol-placement": "line",
      "symbol-spacing": 320,
      "text-field": REACH_LABEL,
      "text-font": LABEL_FONT,
      "text-size": 12,
      "text-offset": [0, -0.9],
      "text-max-angle": 35,
      "text-allow-overlap": false,
      "text-padding": 4,
    },
    paint: halo,
  });
  map.addLayer({
    id: LABEL_LAYERS.outfalls,
    type: "symbol",
    source,
    minzoom: LABEL_MIN_ZOOM,
    filter: filters.outfalls,
    layout: {
      "text-field": OUTFALL_LABEL,
      "text-font": LABEL_FONT,
      "text-size": 12,
      "text-variable-anchor": ["left", "right", "top", "bottom"],
      "text-radial-offset": 0.9,
      "text-justify": "auto",
      "text-max-width": 12,
      "text-allow-overlap": false,
      "text-padding": 3,
    },
    paint: { ...halo, "text-color": "#6b4a12" },
  });
}

/**
 * After each render settles, writes the labels MapLibre actually placed into the
 * frame's `data-labels` attribute (" | "-separated, sorted): what is on screen, for
 * assistive checks and browser tests, since the canvas itself has no text.
 */
export function reportPlacedLabels(map: MapLibreMap, frame: HTMLElement): void {
  map.on("idle", () => {
    const layers = Object.values(LABEL_LAYERS).filter((id) => map.getLayer(id));
    const shown = new Set<string>();
    for (const f of map.queryRenderedFeatures({ layers })) {
      const p = f.properties ?? {};
      shown.add(f.layer.id === LABEL_LAYERS.outfalls ? String(p.name || p.id) : String(p.id));
    }
    frame.dataset.labels = [...shown].sort().join(" | ");
  });
}
