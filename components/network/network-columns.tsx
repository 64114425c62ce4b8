"use client";
import type { ColumnDef } from "@tanstack/react-table";
import type { z } from "zod";
import type { CsvColumn } from "@/components/tables/sortable-table";
import type { UnitSystem } from "@/lib/domain";
import { formatIn, quantity, toSi, unitLabel, type QuantityKind } from "@/lib/format/quantities";
import type { OutfallDto, ReachDto } from "@/lib/services/networks";
import { outfallEditSchema, reachEditSchema } from "@/lib/validation/network";
import { EditableCell } from "./editable-cell";

const num = (v: unknown): number | undefined => (typeof v === "number" && Number.isFinite(v) ? v : undefined);
const attr = (r: { attributes: Record<string, unknown> }, key: string) => num(r.attributes[key]);

/** Saves one field (SI value, or null to clear); resolves to an error message or null. */
export type SaveField = (rowId: string, field: string, value: number | string | null) => Promise<string | null>;

interface Def<T> {
  id: string;
  header: string;
  value: (row: T) => string | number | undefined;
  kind?: QuantityKind;
  text?: boolean;
  digits?: number;
  /** The edit-schema field this column edits, when it can be edited inline. */
  edit?: string;
  mono?: boolean;
}

function shown<T>(d: Def<T>, v: unknown, system: UnitSystem): string {
  if (d.text) return String(v ?? "");
  if (d.kind) return formatIn(d.kind, v as number | undefined, system);
  return typeof v === "number" ? v.toFixed(d.digits ?? 3) : "—";
}

/** Parse what the planner typed (in the basin's unit), check it with the edit schema, convert to SI. */
function parseEdit<T>(d: Def<T>, text: string, system: UnitSystem, schema: z.ZodType): { value: number | string | null } | { error: string } {
  const t = text.trim();
  let value: number | string | null;
  if (t === "") value = null;
  else if (d.text) value = t;
  else {
    const n = Number(t.replace(",", "."));
    if (!Number.isFinite(n)) return { error: "Enter a number" };
    value = d.kind ? toSi(d.kind, n, system) : n;
  }
  const r = schema.safeParse({ [d.edit!]: value });
  return r.success ? { value } : { error: r.error.issues[0].message };
}

function build<T>(defs: Def<T>[], system: UnitSystem, rowId: (row: T) => string, schema: z.ZodType, save?: SaveField) {
  const columns: ColumnDef<T, unknown>[] = defs.map((d) => ({
    id: d.id,
    header: d.header,
    accessorFn: d.value,
    meta: { numeric: !d.text },
    cell: (c) => {
      const v = c.getValue();
      const text = shown(d, v, system);
      if (save && d.edit) {
        const initial = v === undefined || v === null ? "" : d.text ? String(v) : d.kind ? String(+quantity(d.kind, v as number, system).value.toFixed(6)) : String(v);
        return (
          <EditableCell
            display={text}
            initial={initial}
            numeric={!d.text}
            label={`${d.header} of ${rowId(c.row.original)}`}
            onSave={async (typed) => {
              const parsed = parseEdit(d, typed, system, schema);
              if ("error" in parsed) return parsed.error;
              return save(rowId(c.row.original), d.edit!, parsed.value);
            }}
          />
        );
      }
      return d.mono ? <span className="whitespace-nowrap font-mono text-xs">{text}</span> : text;
    },
  }));
  const csv: CsvColumn<T>[] = defs.map((d) => ({
    header: d.header,
    value: (r) => {
      const v = d.value(r);
      return d.kind && typeof v === "number" ? formatIn(d.kind, v, system) : v;
    },
  }));
  return { columns, csv };
}

/** Reach columns in the basin's units; the same list feeds the table and its CSV export. */
export function reachColumns(system: UnitSystem, save?: SaveField) {
  const defs: Def<ReachDto>[] = [
    { id: "id", header: "Reach", value: (r) => r.id, text: true, mono: true },
    { id: "name", header: "Name", value: (r) => r.name ?? "", text: true, edit: "name" },
    { id: "downstream", header: "Flows into", value: (r) => r.downstreamId ?? "outlet", text: true, mono: true },
    { id: "length", header: `Length (${unitLabel("length", system)})`, value: (r) => r.lengthKm, kind: "length", edit: "lengthKm" },
    { id: "flow", header: `Design flow (${unitLabel("flow", system)})`, value: (r) => attr(r, "designFlowM3s"), kind: "flow", edit: "designFlowM3s" },
    { id: "area", header: `Drainage area (${unitLabel("area", system)})`, value: (r) => attr(r, "drainageAreaKm2"), kind: "area", edit: "drainageAreaKm2" },
    { id: "velocity", header: `Velocity (${unitLabel("velocity", system)})`, value: (r) => attr(r, "velocityMps"), kind: "velocity", edit: "velocityMps" },
    { id: "depth", header: `Depth (${unitLabel("depth", system)})`, value: (r) => attr(r, "depthM"), kind: "depth", edit: "depthM" },
    { id: "slope", header: "Slope (m/m)", value: (r) => attr(r, "slope"), digits: 5, edit: "slope" },
    { id: "manning", header: "Manning's n", value: (r) => attr(r, "manningN"), digits: 3, edit: "manningN" },
    { id: "width", header: `Bottom width (${unitLabel("depth", system)})`, value: (r) => attr(r, "bottomWidthM"), kind: "depth", edit: "bottomWidthM" },
    { id: "side", header: "Side slope (H:V)", value: (r) => attr(r, "sideSlope"), digits: 2, edit: "sideSlope" },
    { id: "hga", header: "U = a·Q^b: a (SI)", value: (r) => attr(r, "hgVelocityCoef"), digits: 4, edit: "hgVelocityCoef" },
    { id: "hgb", header: "b", value: (r) => attr(r, "hgVelocityExp"), digits: 3, edit: "hgVelocityExp" },
    { id: "hgc", header: "H = c·Q^f: c (SI)", value: (r) => attr(r, "hgDepthCoef"), digits: 4, edit: "hgDepthCoef" },
    { id: "hgf", header: "f", value: (r) => attr(r, "hgDepthExp"), digits: 3, edit: "hgDepthExp" },
    {
      id: "temperature",
      header: `Temperature (${unitLabel("temperature", system)})`,
      value: (r) => attr(r, "temperatureC"),
      kind: "temperature",
      edit: "temperatureC",
    },
    { id: "kd", header: "k_d at 20 °C (1/d)", value: (r) => attr(r, "deoxygenationRatePerDay"), edit: "deoxygenationRatePerDay" },
    { id: "sod", header: "SOD (g/m²/d)", value: (r) => attr(r, "sodGPerM2PerDay"), digits: 2, edit: "sodGPerM2PerDay" },
  ];
  return build(defs, system, (r) => r.id, reachEditSchema, save);
}

export function outfallColumns(system: UnitSystem, save?: SaveField) {
  const defs: Def<OutfallDto>[] = [
    { id: "facility", header: "Facility", value: (o) => o.facilityName, text: true },
    { id: "permit", header: "Permit id", value: (o) => o.permitId, text: true, mono: true },
    { id: "reach", header: "Reach", value: (o) => o.reachId, text: true, mono: true },
    { id: "chainage", header: `From reach head (${unitLabel("length", system)})`, value: (o) => o.chainageKm, kind: "length" },
    { id: "snap", header: `Snapped (${unitLabel("distance", system)})`, value: (o) => o.snapDistanceM, kind: "distance" },
    { id: "flow", header: `Design flow (${unitLabel("flow", system)})`, value: (o) => attr(o, "designFlowM3s"), kind: "flow", edit: "designFlowM3s" },
    { id: "bod5", header: "Effluent BOD5 (mg/L)", value: (o) => attr(o, "effluentBod5MgL"), digits: 1, edit: "effluentBod5MgL" },
    { id: "cbodu", header: "Effluent CBODu (mg/L)", value: (o) => attr(o, "effluentCbodUMgL"), digits: 1, edit: "effluentCbodUMgL" },
    { id: "k1", header: "Bottle rate (1/d)", value: (o) => attr(o, "bottleRatePerDay"), digits: 2, edit: "bottleRatePerDay" },
    { id: "do", header: "Effluent DO (mg/L)", value: (o) => attr(o, "dissolvedOxygenMgL"), digits: 1, edit: "dissolvedOxygenMgL" },
    {
      id: "temperature",
      header: `Temperature (${unitLabel("temperature", system)})`,
      value: (o) => attr(o, "temperatureC"),
      kind: "temperature",
      edit: "temperatureC",
    },
  ];
  return build(defs, system, (o) => o.facilityId, outfallEditSchema, save);
}
