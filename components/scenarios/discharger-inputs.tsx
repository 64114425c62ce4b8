"use client";
import { SCENARIO_FIELD_LABELS as LABELS } from "@/lib/format/labels";
import type { Control, FieldValues, Path } from "react-hook-form";
import type { UnitSystem } from "@/lib/domain";
import { formatIn, unitLabel } from "@/lib/format/quantities";
import { formKey } from "@/lib/scenarios/form-keys";
import { UnitField } from "./unit-field";

export interface OutfallRow {
  permitId: string;
  facilityName: string;
  reachId: string;
  attributes: Record<string, unknown>;
}

const n = (v: unknown) => (typeof v === "number" ? v : undefined);

/**
 * Each discharger's design flow and effluent for this scenario. A blank field
 * keeps the value imported with the network (shown beneath it).
 */
export function DischargerInputs<T extends FieldValues>({
  control,
  outfalls,
  system,
}: {
  control: Control<T>;
  outfalls: OutfallRow[];
  system: UnitSystem;
}) {
  if (outfalls.length === 0) return null;
  const field = (permitId: string, key: string) => `inputs.dischargers.${formKey(permitId)}.${key}` as Path<T>;
  return (
    <section className="card space-y-3">
      <h2>Dischargers</h2>
      <p className="text-sm text-ink-soft">
        Design flow and today&apos;s effluent of each discharger. Leave a field blank to use the value imported with the
        network (shown under it). Today&apos;s load is the allocation&apos;s ceiling.
      </p>
      {outfalls.map((o) => (
        <div key={o.permitId} className="grid grid-cols-2 gap-3 border-t border-rule pt-3 md:grid-cols-[2fr_repeat(6,1fr)]" data-testid={`discharger-${o.permitId}`}>
          <div className="col-span-2 md:col-span-1">
            <p className="font-medium">{o.facilityName}</p>
            <p className="font-mono text-xs text-ink-faint">
              {o.permitId} · reach {o.reachId}
            </p>
          </div>
          <div className="flex flex-col">
            <UnitField control={control} name={field(o.permitId, "designFlowM3s")} label={LABELS.designFlow} kind="flow" system={system} nullable alignBottom />
            <p className="mt-1 text-xs text-ink-faint">
              network: {formatIn("flow", n(o.attributes.designFlowM3s), system)} {unitLabel("flow", system)}
            </p>
          </div>
          <div className="flex flex-col">
            <UnitField control={control} name={field(o.permitId, "bod5MgL")} label={LABELS.effluentBod5} plainUnit="mg/L" system={system} nullable alignBottom />
            <p className="mt-1 text-xs text-ink-faint">network: {n(o.attributes.effluentBod5MgL)?.toFixed(1) ?? "—"} mg/L</p>
          </div>
          <div className="flex flex-col">
            <UnitField control={control} name={field(o.permitId, "cbodUMgL")} label="or CBODu" plainUnit="mg/L" system={system} nullable alignBottom />
            <p className="mt-1 text-xs text-ink-faint">network: {n(o.attributes.effluentCbodUMgL)?.toFixed(1) ?? "—"} mg/L</p>
          </div>
          <div className="flex flex-col">
            <UnitField control={control} name={field(o.permitId, "bottleKPerDay")} label={LABELS.bottleRate} plainUnit="1/d" system={system} nullable alignBottom />
            <p className="mt-1 text-xs text-ink-faint">network: {n(o.attributes.bottleRatePerDay)?.toFixed(2) ?? "0.23 (default)"} 1/d</p>
          </div>
          <div className="flex flex-col">
            <UnitField control={control} name={field(o.permitId, "doMgL")} label={LABELS.effluentDo} plainUnit="mg/L" system={system} nullable alignBottom />
            <p className="mt-1 text-xs text-ink-faint">network: {n(o.attributes.dissolvedOxygenMgL)?.toFixed(1) ?? "—"} mg/L</p>
          </div>
          <div className="flex flex-col">
            <UnitField control={control} name={field(o.permitId, "temperatureC")} label={LABELS.effluentTemperature} kind="temperature" system={system} nullable alignBottom />
            <p className="mt-1 text-xs text-ink-faint">
              network: {formatIn("temperature", n(o.attributes.temperatureC), system)} {unitLabel("temperature", system)}
            </p>
          </div>
        </div>
      ))}
    </section>
  );
}
