"use client";
import type { FeatureCollection } from "geojson";
import { useState } from "react";
import { BasinMapLazy } from "@/components/map/basin-map-lazy";
import type { MapSelection } from "@/components/map/basin-map";

/**
 * The facilities a plan allocates to, as outfalls on the reach network its run was computed
 * on (flow direction shown on each reach). Choosing an outfall on the map or in the list
 * takes the reader to that facility's comment thread.
 */
export function FacilitiesMap({ network, threadIds }: { network: FeatureCollection; threadIds: Record<string, string> }) {
  const [selected, setSelected] = useState<string | null>(null);
  const outfalls = network.features
    .filter((f) => f.properties?.kind === "outfall")
    .map((f) => ({ id: String(f.properties!.id), name: String(f.properties!.name), reach: String(f.properties!.reachId) }))
    .sort((a, b) => a.name.localeCompare(b.name));
  const go = (permitId: string) => {
    setSelected(`outfall:${permitId}`);
    const thread = threadIds[permitId];
    if (thread) document.getElementById(`thread-${thread}`)?.scrollIntoView({ behavior: "smooth", block: "start" });
  };
  const onSelect = (s: MapSelection) => {
    if (s.kind === "outfall") go(s.id);
  };
  return (
    <section className="card space-y-3" aria-label="Map of the facilities">
      <h2>Facilities on the river</h2>
      <div className="grid gap-4 lg:grid-cols-[3fr_1fr]">
        <BasinMapLazy data={network} selectedId={selected} onSelect={onSelect} height={420} />
        <div className="space-y-2 text-sm">
          <p className="text-ink-soft">The facilities in this plan, each at its outfall on the map (the key is under the map).</p>
          <ul className="space-y-1" data-testid="map-facilities">
            {outfalls.map((o) => (
              <li key={o.id}>
                <button type="button" className="text-left text-tarn-700 underline-offset-2 hover:underline" onClick={() => go(o.id)}>
                  {o.name}
                </button>{" "}
                <span className="font-mono text-xs text-ink-faint">{o.id}</span> <span className="text-xs text-ink-faint">reach {o.reach}</span>
              </li>
            ))}
          </ul>
          <p className="text-xs text-ink-faint">Choose a facility to go to its comments.</p>
        </div>
      </div>
    </section>
  );
}
