"use client";
import type { Feature, FeatureCollection, Geometry } from "geojson";
import { useEffect, useMemo, useRef } from "react";
import { escapeHtml as esc, fitToFeatures, maplibregl, wireLayerEvents } from "./map-setup";
import { MapFrame, useBaseMap } from "./use-base-map";
import { withOutletNode } from "@/lib/map/outlet-point";
import { addLabelLayers } from "./label-layers";
import { BasinLegend } from "./map-legend";
import { arrowImage, MAP_COLOURS, SELECTION_HALO_PX } from "./map-style";

export interface MapSelection {
  kind: "reach" | "node" | "outfall";
  id: string;
  properties: Record<string, unknown>;
}

const EMPTY: FeatureCollection = { type: "FeatureCollection", features: [] };

function describe(p: Record<string, unknown>): string {
  if (p.kind === "reach") {
    return `<strong>Reach ${esc(p.id)}</strong>${p.name ? `<br>${esc(p.name)}` : ""}<br>${Number(p.lengthKm).toFixed(2)} km${
      p.downstreamId ? ` → ${esc(p.downstreamId)}` : " → outlet"
    }`;
  }
  if (p.kind === "outfall") {
    return `<strong>${esc(p.name)}</strong><br>Permit ${esc(p.id)}<br>Reach ${esc(p.reachId)} at ${Number(p.chainageKm).toFixed(2)} km<br>Snapped ${Number(p.snapDistanceM).toFixed(0)} m`;
  }
  return `<strong>${esc(p.nodeKind)} node</strong><br>${esc(p.id)}`;
}

/**
 * The basin on a plain background (or the configured basemap): reaches with
 * flow-direction chevrons and their ids (names too when zoomed in), nodes, outfalls
 * labelled with the facility's name, and (optionally) problem geometries to
 * highlight; a legend below. Hover shows details; a click reports the feature.
 */
export function BasinMap({
  data,
  highlight,
  selectedId,
  onSelect,
  height = 480,
}: {
  data: FeatureCollection;
  highlight?: Geometry[];
  selectedId?: string | null;
  onSelect?: (s: MapSelection) => void;
  height?: number;
}) {
  const onSelectRef = useRef(onSelect);
  useEffect(() => {
    onSelectRef.current = onSelect;
  }, [onSelect]);

  // a network given without its nodes still shows where it drains
  const full = useMemo(() => withOutletNode(data), [data]);
  const shown = useMemo(() => {
    const kinds = new Set<string>();
    for (const f of full.features) kinds.add(f.properties?.kind === "node" ? String(f.properties.nodeKind) : String(f.properties?.kind));
    return kinds;
  }, [full]);

  const { container, map: loaded } = useBaseMap((map) => {
    map.addImage("flow-arrow", arrowImage());
    map.addSource("basin", { type: "geojson", data: EMPTY, promoteId: "fid" });
    map.addSource("problems", { type: "geojson", data: EMPTY });
    map.addLayer({
      id: "problem-lines",
      type: "line",
      source: "problems",
      filter: ["!=", ["geometry-type"], "Point"],
      paint: { "line-color": MAP_COLOURS.problem, "line-width": 9, "line-opacity": 0.35 },
    });
    // the selection: a wide violet halo under the line, a colour nothing else on the map uses
    map.addLayer({
      id: "selected-halo",
      type: "line",
      source: "basin",
      filter: ["==", ["get", "kind"], "reach"],
      layout: { "line-cap": "round", "line-join": "round" },
      paint: {
        "line-color": MAP_COLOURS.selection,
        "line-width": SELECTION_HALO_PX,
        "line-opacity": ["case", ["boolean", ["feature-state", "selected"], false], 0.6, 0],
      },
    });
    map.addLayer({
      id: "reaches",
      type: "line",
      source: "basin",
      filter: ["==", ["get", "kind"], "reach"],
      layout: { "line-cap": "round", "line-join": "round" },
      paint: { "line-color": MAP_COLOURS.reach, "line-width": 3 },
    });
    map.addLayer({
      id: "reach-direction",
      type: "symbol",
      source: "basin",
      filter: ["==", ["get", "kind"], "reach"],
      layout: { "symbol-placement": "line", "symbol-spacing": 90, "icon-image": "flow-arrow", "icon-allow-overlap": true },
    });
    map.addLayer({
      id: "nodes",
      type: "circle",
      source: "basin",
      filter: ["==", ["get", "kind"], "node"],
      paint: {
        "circle-radius": ["match", ["get", "nodeKind"], "outlet", 7, 3.5],
        "circle-color": ["match", ["get", "nodeKind"], "outlet", MAP_COLOURS.outlet, "headwater", MAP_COLOURS.headwater, MAP_COLOURS.node],
        "circle-stroke-color": "#ffffff",
        "circle-stroke-width": 1.5,
      },
    });
    map.addLayer({
      id: "problem-points",
      type: "circle",
      source: "problems",
      filter: ["==", ["geometry-type"], "Point"],
      paint: { "circle-radius": 11, "circle-color": MAP_COLOURS.problem, "circle-opacity": 0.35 },
    });
    map.addLayer({
      id: "outfalls",
      type: "circle",
      source: "basin",
      filter: ["==", ["get", "kind"], "outfall"],
      paint: {
        "circle-radius": 6.5,
        "circle-color": MAP_COLOURS.outfall,
        "circle-stroke-color": ["case", ["boolean", ["feature-state", "selected"], false], MAP_COLOURS.selection, "#ffffff"],
        "circle-stroke-width": ["case", ["boolean", ["feature-state", "selected"], false], 5, 2],
      },
    });
    addLabelLayers(map, "basin", { reaches: ["==", ["get", "kind"], "reach"], outfalls: ["==", ["get", "kind"], "outfall"] });
    return wireLayerEvents(map, ["reaches", "nodes", "outfalls"], describe, (p) =>
      onSelectRef.current?.({ kind: p.kind as MapSelection["kind"], id: String(p.id), properties: p }),
    );
  });

  useEffect(() => {
    const map = loaded;
    if (!map) return;
    // feature-state needs an id MapLibre can use: promote the feature id into a property
    const withIds: FeatureCollection = {
      ...full,
      features: full.features.map((f) => ({ ...f, properties: { ...f.properties, fid: String(f.id ?? "") } })),
    };
    (map.getSource("basin") as maplibregl.GeoJSONSource).setData(withIds);
    fitToFeatures(map, data);
  }, [data, full, loaded]);

  useEffect(() => {
    const map = loaded;
    if (!map) return;
    const features: Feature[] = (highlight ?? []).map((geometry) => ({ type: "Feature", geometry, properties: {} }));
    (map.getSource("problems") as maplibregl.GeoJSONSource).setData({ type: "FeatureCollection", features });
  }, [highlight, loaded]);

  useEffect(() => {
    const map = loaded;
    if (!map) return;
    map.removeFeatureState({ source: "basin" });
    if (selectedId) map.setFeatureState({ source: "basin", id: selectedId }, { selected: true });
  }, [selectedId, loaded, data]);

  return (
    <MapFrame ref={container} height={height} label="Basin map" testId="basin-map" ready={loaded !== null}>
      <BasinLegend shown={shown} problems={(highlight?.length ?? 0) > 0} />
    </MapFrame>
  );
}
