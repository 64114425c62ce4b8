"use client";
import type { FeatureCollection } from "geojson";
import { useEffect, useMemo, useRef } from "react";
import { escapeHtml as esc, fitToFeatures, maplibregl, wireLayerEvents } from "@/components/map/map-setup";
import { addLabelLayers } from "@/components/map/label-layers";
import { withOutletNode } from "@/lib/map/outlet-point";
import { MAP_COLOURS, SELECTION_HALO_PX } from "@/components/map/map-style";
import { MapFrame, useBaseMap } from "@/components/map/use-base-map";
import type { UnitSystem } from "@/lib/domain";
import { formatIn, unitLabel } from "@/lib/format/quantities";
import type { RunResult } from "@/lib/model/network/run";
import type { ModelFile } from "@/lib/model/types";
import { DO_BAND_COLOURS, formatDo, type DoScaleOptions } from "@/lib/results/do-scale";
import { resultsGeoJson } from "@/lib/results/results-geojson";

/** Observed survey values, on the map as on the charts. */
export const OBSERVED_COLOUR = "#c08a2e";

const EMPTY: FeatureCollection = { type: "FeatureCollection", features: [] };
const NONE = "\u0000";

const isKind = (k: string): maplibregl.ExpressionSpecification => ["==", ["get", "kind"], k];
const pieceWhere = (key: string, value: string | boolean) => ["all", isKind("reach-piece"), ["==", ["get", key], value]] as maplibregl.FilterSpecification;
const reachWhere = (id: string): maplibregl.FilterSpecification => ["all", isKind("reach"), ["==", ["to-string", ["get", "id"]], id]];
/**
 * The network as the map labels it: its outlet (added when the features have no nodes) and
 * its outfalls named by facility; a network given without outfalls (reach lines only) gets
 * the run's dischargers as outfalls labelled with their permit ids.
 */
function labelledNetwork(network: FeatureCollection, results: FeatureCollection): FeatureCollection {
  const full = withOutletNode(network);
  if (full.features.some((f) => f.properties?.kind === "outfall")) return full;
  const outfalls = results.features
    .filter((f) => f.properties?.kind === "discharger")
    .map((f) => ({ ...f, id: `outfall:${f.properties!.id}`, properties: { kind: "outfall", id: f.properties!.id, name: null } }));
  return { ...full, features: [...full.features, ...outfalls] };
}

/** Critical points worth a ring: below the criterion, or the lowest DO of the whole network. */
const ringWhere = (lowestReach: string): maplibregl.FilterSpecification => [
  "all",
  isKind("critical"),
  ["any", ["==", ["get", "below"], true], ["==", ["get", "reach"], lowestReach]],
];

/** MapLibre colour expression for the `band` property written by resultsGeoJson. */
const BAND_COLOUR = ["match", ["get", "band"], ...Object.entries(DO_BAND_COLOURS).flat(), DO_BAND_COLOURS.ample] as unknown as maplibregl.ExpressionSpecification;

function describe(p: Record<string, unknown>, system: UnitSystem): string {
  const where = (km: unknown) => `${formatIn("length", Number(km), system)} ${unitLabel("length", system)}`;
  const dO = (v: unknown) => (Number(v) < 0 ? "anoxic" : `${formatDo(Number(v))} mg/L`);
  if (p.kind === "observed") {
    const residual = p.residual === null || p.residual === undefined ? "not on this run's network" : `${Number(p.residual) > 0 ? "+" : ""}${Number(p.residual).toFixed(2)} mg/L`;
    return `<strong>Station ${esc(p.station)}</strong> (survey)<br>Reach ${esc(p.reach)} at ${where(p.km)}<br>Observed DO ${dO(p.observed)}<br>Modelled ${p.modelled === null || p.modelled === undefined ? "—" : dO(p.modelled)}<br>Residual ${residual}`;
  }
  if (p.kind === "reach-piece") {
    return `<strong>Reach ${esc(p.reach)}</strong><br>${where(p.km_start)} – ${where(p.km_end)} from its head<br>DO ${dO(p.do_start_mg_l)} → ${dO(p.do_end_mg_l)}`;
  }
  if (p.kind === "critical") {
    return `<strong>Critical point of ${esc(p.reach)}</strong><br>DO ${dO(p.do_mg_l)} at ${where(p.km)} from the reach head${p.below === true ? "<br>below the criterion" : ""}`;
  }
  return `<strong>Discharger ${esc(p.id)}</strong><br>Reach ${esc(p.reach)} at ${where(p.km)}`;
}

/**
 * The basin coloured by DO along every reach (bands relative to the criterion, anoxic
 * water drawn dark with a dashed core), reach ids and facility names as labels, the
 * outlet, dischargers as white dots, and a ring on each critical point that matters
 * (a sag below the criterion, the network's lowest DO). The selected reach has a violet
 * halo. A click on a reach reports its id. The key is DoLegend, beside the map.
 */
export function DoMap({
  run,
  model,
  network,
  unitSystem,
  selectedReach,
  onSelectReach,
  scale,
  height = 480,
  observed,
}: {
  run: RunResult;
  model: ModelFile;
  /** The network's map features (reach LineStrings head→mouth with properties.kind "reach" and properties.id). */
  network: FeatureCollection;
  unitSystem: UnitSystem;
  selectedReach?: string | null;
  onSelectReach?: (reachId: string) => void;
  scale?: DoScaleOptions;
  height?: number;
  /** A survey's samples to draw beside the modelled DO: Point features with kind "observed", station, reach, km, observed, modelled, residual. */
  observed?: FeatureCollection | null;
}) {
  const onSelectRef = useRef(onSelectReach);
  const systemRef = useRef(unitSystem);
  useEffect(() => {
    onSelectRef.current = onSelectReach;
    systemRef.current = unitSystem;
  }, [onSelectReach, unitSystem]);
  const data = useMemo(() => resultsGeoJson({ run, model, network, scale }), [run, model, network, scale]);

  const lowestReachRef = useRef(run.minimum.reach);
  const { container, map: loaded } = useBaseMap((map) => {
    map.addSource("results", { type: "geojson", data: EMPTY });
    map.addSource("network", { type: "geojson", data: EMPTY });
    // the selection: a wide violet halo under the reach, a colour no DO band or mark uses
    map.addLayer({
      id: "selected-reach",
      type: "line",
      source: "network",
      filter: reachWhere(NONE),
      layout: { "line-cap": "round", "line-join": "round" },
      paint: { "line-color": MAP_COLOURS.selection, "line-width": SELECTION_HALO_PX, "line-opacity": 0.6 },
    });
    map.addLayer({
      id: "do-pieces",
      type: "line",
      source: "results",
      filter: isKind("reach-piece"),
      layout: { "line-cap": "round", "line-join": "round" },
      paint: { "line-color": BAND_COLOUR, "line-width": 5 },
    });
    map.addLayer({
      id: "anoxic-core",
      type: "line",
      source: "results",
      filter: pieceWhere("anoxic", true),
      paint: { "line-color": "#f7f6f1", "line-width": 1.5, "line-dasharray": [2, 2] },
    });
    map.addLayer({
      id: "outlet",
      type: "circle",
      source: "network",
      filter: ["all", isKind("node"), ["==", ["get", "nodeKind"], "outlet"]],
      paint: { "circle-radius": 7, "circle-color": MAP_COLOURS.outlet, "circle-stroke-color": "#ffffff", "circle-stroke-width": 2 },
    });
    map.addLayer({
      id: "dischargers",
      type: "circle",
      source: "results",
      filter: isKind("discharger"),
      paint: { "circle-radius": 4.5, "circle-color": "#ffffff", "circle-stroke-color": "#1d2a33", "circle-stroke-width": 1.5 },
    });
    // rings only where they mean something: a reach's sag below the criterion, and the network's lowest DO
    map.addLayer({
      id: "criticals",
      type: "circle",
      source: "results",
      filter: ringWhere(lowestReachRef.current),
      paint: {
        "circle-radius": ["case", ["==", ["get", "below"], true], 9, 7],
        "circle-color": "rgba(0,0,0,0)",
        "circle-stroke-color": BAND_COLOUR,
        "circle-stroke-width": 3,
      },
    });
    // a survey's samples, when one is compared: amber dots (the colour the charts give observed values)
    map.addSource("observed", { type: "geojson", data: EMPTY });
    map.addLayer({
      id: "observed",
      type: "circle",
      source: "observed",
      paint: { "circle-radius": 5.5, "circle-color": OBSERVED_COLOUR, "circle-stroke-color": "#ffffff", "circle-stroke-width": 1.5 },
    });
    addLabelLayers(map, "network", { reaches: isKind("reach"), outfalls: isKind("outfall") });
    return wireLayerEvents(
      map,
      ["do-pieces", "criticals", "dischargers", "observed"],
      (p) => describe(p, systemRef.current),
      (p) => {
        const reach = p.kind === "discharger" || p.kind === "critical" || p.kind === "reach-piece" ? p.reach : undefined;
        if (reach !== undefined) onSelectRef.current?.(String(reach));
      },
    );
  }, unitSystem === "US" ? "imperial" : "metric");

  useEffect(() => {
    const map = loaded;
    if (!map) return;
    (map.getSource("results") as maplibregl.GeoJSONSource).setData(data);
    (map.getSource("network") as maplibregl.GeoJSONSource).setData(labelledNetwork(network, data));
    map.setFilter("criticals", ringWhere(run.minimum.reach));
    fitToFeatures(map, data);
  }, [data, network, run, loaded]);

  useEffect(() => {
    const map = loaded;
    if (!map) return;
    map.setFilter("selected-reach", reachWhere(selectedReach ?? NONE));
  }, [selectedReach, loaded]);

  useEffect(() => {
    const map = loaded;
    if (!map) return;
    (map.getSource("observed") as maplibregl.GeoJSONSource).setData(observed ?? EMPTY);
  }, [observed, loaded]);

  return <MapFrame ref={container} height={height} label="Dissolved-oxygen map" testId="do-map" ready={loaded !== null} />;
}
