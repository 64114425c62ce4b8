import type { FeatureCollection } from "geojson";
import * as maplibregl from "maplibre-gl";
import "maplibre-gl/dist/maplibre-gl.css";
import { baseStyle } from "./map-style";

// The worker URL breaks after bundling unless it is given explicitly (STACK.md).
maplibregl.setWorkerUrl(new URL("../../node_modules/maplibre-gl/dist/maplibre-gl-worker.mjs", import.meta.url).href);

/** A map on Sagline's plain base style with zoom buttons and a scale bar; nothing fetched from outside. */
export function createBaseMap(container: HTMLElement, scaleUnit: "metric" | "imperial" = "metric"): maplibregl.Map {
  const map = new maplibregl.Map({
    container,
    style: baseStyle(),
    center: [0, 0],
    zoom: 1,
    attributionControl: false,
  });
  map.addControl(new maplibregl.NavigationControl({ showCompass: false }), "top-right");
  map.addControl(new maplibregl.ScaleControl({ unit: scaleUnit }), "bottom-left");
  return map;
}

/** The box around every coordinate of a collection, or null when it has none. */
export function featureBounds(fc: FeatureCollection): maplibregl.LngLatBounds | null {
  const b = new maplibregl.LngLatBounds();
  let any = false;
  const visit = (c: unknown): void => {
    if (Array.isArray(c) && typeof c[0] === "number") {
      b.extend([c[0] as number, c[1] as number]);
      any = true;
    } else if (Array.isArray(c)) c.forEach(visit);
  };
  for (const f of fc.features) if (f.geometry && "coordinates" in f.geometry) visit(f.geometry.coordinates);
  return any ? b : null;
}

/**
 * Fits the view to a collection (no animation), leaving room at the sides for the
 * labels of points near the edge (on a phone a facility's name is a fifth of the width).
 */
export function fitToFeatures(map: maplibregl.Map, fc: FeatureCollection): void {
  const b = featureBounds(fc);
  const width = map.getContainer().clientWidth;
  const side = width < 640 ? Math.round(width * 0.2) : 60;
  if (b) map.fitBounds(b, { padding: { top: 40, bottom: 40, left: side, right: side }, duration: 0 });
}

/** Text safe to put into popup HTML. */
export const escapeHtml = (v: unknown): string => String(v ?? "").replace(/[&<>"]/g, (c) => `&#${c.charCodeAt(0)};`);

/**
 * Hover popups and clicks on some layers: `describe` gives a feature's popup HTML
 * (already escaped), `onClick` receives its properties.
 */
export function wireLayerEvents(
  map: maplibregl.Map,
  layers: string[],
  describe: (p: Record<string, unknown>) => string,
  onClick: (p: Record<string, unknown>) => void,
): maplibregl.Popup {
  const popup = new maplibregl.Popup({ closeButton: false, closeOnClick: false, offset: 8 });
  for (const layer of layers) {
    map.on("mousemove", layer, (e) => {
      const f = e.features?.[0];
      if (!f) return;
      map.getCanvas().style.cursor = "pointer";
      popup.setLngLat(e.lngLat).setHTML(describe(f.properties as Record<string, unknown>)).addTo(map);
    });
    map.on("mouseleave", layer, () => {
      map.getCanvas().style.cursor = "";
      popup.remove();
    });
    map.on("click", layer, (e) => {
      const f = e.features?.[0];
      if (f) onClick(f.properties as Record<string, unknown>);
    });
  }
  return popup;
}

export { maplibregl };
