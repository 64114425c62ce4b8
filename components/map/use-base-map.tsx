"use client";
import { useEffect, useRef, useState, type RefObject } from "react";
import { createBaseMap, maplibregl } from "./map-setup";

/**
 * A MapLibre map on Sagline's base style, created once in the returned container.
 * `setUp` runs when the style has loaded (add sources, layers, events) and may return
 * a popup to close on unmount. The scale bar's unit is fixed when the map is made. Returns the map once that has run (null before).
 */
export function useBaseMap(setUp: (map: maplibregl.Map) => maplibregl.Popup | void, scaleUnit: "metric" | "imperial" = "metric") {
  const container = useRef<HTMLDivElement>(null);
  const [loaded, setLoaded] = useState<maplibregl.Map | null>(null);
  const setUpRef = useRef(setUp);
  const scaleUnitRef = useRef(scaleUnit);

  useEffect(() => {
    if (!container.current) return;
    const map = createBaseMap(container.current, scaleUnitRef.current);
    let popup: maplibregl.Popup | void;
    map.on("load", () => {
      popup = setUpRef.current(map);
      setLoaded(map);
    });
    return () => {
      popup?.remove();
      map.remove();
      setLoaded(null);
    };
  }, []);

  return { container, map: loaded };
}

/** The map's frame; `data-ready="true"` once loaded (browser tests wait on it). */
export function MapFrame({
  ref,
  height,
  label,
  testId,
  ready,
}: {
  ref: RefObject<HTMLDivElement | null>;
  height: number;
  label: string;
  testId: string;
  ready: boolean;
}) {
  return (
    <div
      ref={ref}
      className="w-full overflow-hidden rounded-card border border-rule"
      style={{ height }}
      role="region"
      aria-label={label}
      data-testid={testId}
      data-ready={ready ? "true" : "false"}
    />
  );
}
