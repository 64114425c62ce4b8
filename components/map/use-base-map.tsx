"use client";
import { useEffect, useRef, useState, type ReactNode, type RefObject } from "react";
import { addBasemapArchive } from "./basemap-archive";
import { reportPlacedLabels } from "./label-layers";
import { createBaseMap, maplibregl } from "./map-setup";
import { labelFontFaces } from "./map-style";

/**
 * A MapLibre map on Sagline's base style, created once in the returned container.
 * `setUp` runs when the style has loaded (add sources, layers, events) and may return
 * a popup to close on unmount. The scale bar's unit is fixed when the map is made. Returns the map once that has run (null before).
 * Labels draw with the app's own font whatever the base style; a basemap archive that
 * Sagline serves (see basemap-archive.ts) goes under the basin's layers when configured.
 */
export function useBaseMap(setUp: (map: maplibregl.Map) => maplibregl.Popup | void, scaleUnit: "metric" | "imperial" = "metric") {
  const container = useRef<HTMLDivElement>(null);
  const [loaded, setLoaded] = useState<maplibregl.Map | null>(null);
  const setUpRef = useRef(setUp);
  const scaleUnitRef = useRef(scaleUnit);

  useEffect(() => {
    const frame = container.current;
    if (!frame) return;
    const map = createBaseMap(frame, scaleUnitRef.current);
    let popup: maplibregl.Popup | void;
    map.on("load", () => {
      // a basemap style brings its own fonts; the basin's labels keep Sagline's
      map.setFontFaces({ ...(map.getFontFaces() ?? {}), ...labelFontFaces() });
      popup = setUpRef.current(map);
      reportPlacedLabels(map, frame);
      void addBasemapArchive(map);
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

/** The map's frame; `data-ready="true"` once loaded (browser tests wait on it). Children (a legend) sit below it. */
export function MapFrame({
  ref,
  height,
  label,
  testId,
  ready,
  children,
}: {
  ref: RefObject<HTMLDivElement | null>;
  height: number;
  label: string;
  testId: string;
  ready: boolean;
  children?: ReactNode;
}) {
  const frame = (
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
  if (!children) return frame;
  return (
    <div className="space-y-2">
      {frame}
      {children}
    </div>
  );
}
