"use client";
import type { ColumnDef } from "@tanstack/react-table";
import type { UnitSystem } from "@/db/schema";
import { formatIn, unitLabel } from "@/lib/format/quantities";
import type { OutfallDto, ReachDto } from "@/lib/services/networks";
import type { CsvColumn } from "@/components/tables/sortable-table";

const num = (v: unknown): number | undefined => (typeof v === "number" && Number.isFinite(v) ? v : undefined);
const attr = (r: { attributes: Record<string, unknown> }, key: string) => num(r.attributes[key]);

/** Reach columns in the basin's units; the same list feeds the table and its CSV export. */
export function reachColumns(system: UnitSystem) {
  const defs: { id: string; header: string; value: (r: ReachDto) => string | number | undefined; kind?: Parameters<typeof formatIn>[0]; text?: boolean }[] = [
    { id: "id", header: "Reach", value: (r) => r.id, text: true },
    { id: "name", header: "Name", value: (r) => r.name ?? "", text: true },
    { id: "downstream", header: "Flows into", value: (r) => r.downstreamId ?? "outlet", text: true },
    { id: "length", header: `Length (${unitLabel("length", system)})`, value: (r) => r.lengthKm, kind: "length" },
    { id: "flow", header: `Design flow (${unitLabel("flow", system)})`, value: (r) => attr(r, "designFlowM3s"), kind: "flow" },
    { id: "velocity", header: `Velocity (${unitLabel("velocity", system)})`, value: (r) => attr(r, "velocityMps"), kind: "velocity" },
    { id: "depth", header: `Depth (${unitLabel("depth", system)})`, value: (r) => attr(r, "depthM"), kind: "depth" },
    { id: "temperature", header: `Temperature (${unitLabel("temperature", system)})`, value: (r) => attr(r, "temperatureC"), kind: "temperature" },
    { id: "kd", header: "k_d at 20 °C (1/d)", value: (r) => attr(r, "deoxygenationRatePerDay") },
  ];
  const columns: ColumnDef<ReachDto, unknown>[] = defs.map((d) => ({
    id: d.id,
    header: d.header,
    accessorFn: d.value,
    meta: { numeric: !d.text },
    cell: (c) => {
      const v = c.getValue();
      if (d.text) return <span className={d.id === "id" ? "font-mono text-xs" : undefined}>{String(v ?? "")}</span>;
      if (d.kind) return formatIn(d.kind, v as number | undefined, system);
      return typeof v === "number" ? v.toFixed(3) : "—";
    },
  }));
  const csv: CsvColumn<ReachDto>[] = defs.map((d) => ({
    header: d.header,
    value: (r) => {
      const v = d.value(r);
      return d.kind && typeof v === "number" ? formatIn(d.kind, v, system) : v;
    },
  }));
  return { columns, csv };
}

export function outfallColumns(system: UnitSystem) {
  const defs: { id: string; header: string; value: (o: OutfallDto) => string | number | undefined; kind?: Parameters<typeof formatIn>[0]; text?: boolean; digits?: number }[] = [
    { id: "facility", header: "Facility", value: (o) => o.facilityName, text: true },
    { id: "permit", header: "Permit id", value: (o) => o.permitId, text: true },
    { id: "reach", header: "Reach", value: (o) => o.reachId, text: true },
    { id: "chainage", header: `From reach head (${unitLabel("length", system)})`, value: (o) => o.chainageKm, kind: "length" },
    { id: "snap", header: `Snapped (${unitLabel("distance", system)})`, value: (o) => o.snapDistanceM, kind: "distance" },
    { id: "flow", header: `Design flow (${unitLabel("flow", system)})`, value: (o) => attr(o, "designFlowM3s"), kind: "flow" },
    { id: "bod5", header: "Effluent BOD5 (mg/L)", value: (o) => attr(o, "effluentBod5MgL"), digits: 1 },
    { id: "cbodu", header: "Effluent CBODu (mg/L)", value: (o) => attr(o, "effluentCbodUMgL"), digits: 1 },
    { id: "do", header: "Effluent DO (mg/L)", value: (o) => attr(o, "dissolvedOxygenMgL"), digits: 1 },
    { id: "temperature", header: `Temperature (${unitLabel("temperature", system)})`, value: (o) => attr(o, "temperatureC"), kind: "temperature" },
  ];
  const columns: ColumnDef<OutfallDto, unknown>[] = defs.map((d) => ({
    id: d.id,
    header: d.header,
    accessorFn: d.value,
    meta: { numeric: !d.text },
    cell: (c) => {
      const v = c.getValue();
      if (d.text) return <span className={d.id === "permit" || d.id === "reach" ? "whitespace-nowrap font-mono text-xs" : undefined}>{String(v ?? "")}</span>;
      if (d.kind) return formatIn(d.kind, v as number | undefined, system);
      return typeof v === "number" ? v.toFixed(d.digits ?? 2) : "—";
    },
  }));
  const csv: CsvColumn<OutfallDto>[] = defs.map((d) => ({
    header: d.header,
    value: (o) => {
      const v = d.value(o);
      return d.kind && typeof v === "number" ? formatIn(d.kind, v, system) : v;
    },
  }));
  return { columns, csv };
}
