"use client";
import { useState } from "react";
import type { Control, FieldValues, Path } from "react-hook-form";
import type { UnitSystem } from "@/lib/domain";
import { formatIn, unitLabel } from "@/lib/format/quantities";
import { formKey } from "@/lib/scenarios/form-keys";
import { UnitField } from "./unit-field";

export interface ReachRow {
  id: string;
  name: string | null;
  /** null at the outlet. */
  downstreamId: string | null;
  attributes: Record<string, unknown>;
}

/** Per-reach kinetics overrides (the network value or the scenario default otherwise). */
export const REACH_OVERRIDE_FIELDS = ["kd20PerDay", "ka20PerDay", "ks20PerDay", "sod20GPerM2Day", "kn20PerDay"] as const;
/** Quality of the natural water entering a reach's head. */
export const INFLOW_OVERRIDE_FIELDS = ["cbodUMgL", "doMgL"] as const;

const n = (v: unknown) => (typeof v === "number" ? v : undefined);

/**
 * Design flow per reach for each condition (a low-flow statistic entered per
 * reach) and per-reach rate overrides. Blank keeps the network's value (shown
 * greyed) scaled by the condition's flow scale, or the scenario's default rate.
 */
export function ReachInputs<T extends FieldValues>({
  control,
  reaches,
  conditions,
  system,
  defaults,
}: {
  control: Control<T>;
  reaches: ReachRow[];
  conditions: { name: string; flowScale: number }[];
  system: UnitSystem;
  /** Scenario-wide values shown where a reach has none of its own. */
  defaults: { kn20PerDay: number; cbodUMgL: number; doMgL: number | null };
}) {
  const [open, setOpen] = useState(false);
  const path = (p: string) => p as Path<T>;
  return (
    <section className="card space-y-3">
      <div className="flex items-center justify-between">
        <h2>Reach by reach</h2>
        <button type="button" className="text-sm text-tarn-700 underline" aria-expanded={open} onClick={() => setOpen((o) => !o)}>
          {open ? "Hide" : "Show"} per-reach design flows and rates
        </button>
      </div>
      <p className="text-sm text-ink-soft">
        Enter a design flow for a reach to use a low-flow statistic of its own under a condition, a rate to override the
        network&apos;s value, or the quality of the headwater or tributary water entering the reach. Blank fields keep
        the value shown in grey.
      </p>
      {open && (
        <div className="overflow-x-auto">
          <table className="data-table" data-testid="reach-inputs">
            <thead>
              <tr>
                <th>Reach</th>
                {conditions.map((c, i) => (
                  <th key={i} className="num">
                    {c.name || `Condition ${i + 1}`}: design flow ({unitLabel("flow", system)})
                  </th>
                ))}
                <th className="num">k_d (1/d)</th>
                <th className="num">k_a (1/d)</th>
                <th className="num">k_s (1/d)</th>
                <th className="num">SOD (g/m²/d)</th>
                <th className="num">k_n (1/d)</th>
                <th className="num">Inflow CBODu (mg/L)</th>
                <th className="num">Inflow DO (mg/L)</th>
              </tr>
            </thead>
            <tbody>
              {reaches.map((r) => (
                <tr key={r.id}>
                  <td>
                    <span className="font-mono text-xs">{r.id}</span>
                    {r.name && <span className="block text-xs text-ink-faint">{r.name}</span>}
                  </td>
                  {conditions.map((c, i) => {
                    const q = n(r.attributes.designFlowM3s);
                    return (
                      <td key={i} className="num">
                        <UnitField
                          control={control}
                          name={path(`inputs.conditions.${i}.reachFlowsM3s.${formKey(r.id)}`)}
                          label={`Design flow of ${r.id} under ${c.name}`}
                          kind="flow"
                          system={system}
                          nullable
                          compact
                          placeholder={q === undefined ? "" : formatIn("flow", q * (c.flowScale || 1), system)}
                        />
                      </td>
                    );
                  })}
                  {(
                    [
                      ["kd20PerDay", "k_d", n(r.attributes.deoxygenationRatePerDay)],
                      ["ka20PerDay", "k_a", n(r.attributes.reaerationRatePerDay)],
                      ["ks20PerDay", "k_s", n(r.attributes.settlingRatePerDay)],
                      ["sod20GPerM2Day", "SOD", n(r.attributes.sodGPerM2PerDay)],
                      ["kn20PerDay", "k_n", defaults.kn20PerDay],
                    ] as const
                  ).map(([key, label, network]) => (
                    <td key={key} className="num">
                      <UnitField
                        control={control}
                        name={path(`inputs.reachOverrides.${formKey(r.id)}.${key}`)}
                        label={`${label} of ${r.id}`}
                        system={system}
                        nullable
                        compact
                        placeholder={network === undefined ? "" : String(network)}
                      />
                    </td>
                  ))}
                  {(
                    [
                      ["cbodUMgL", "Inflow CBODu", defaults.cbodUMgL],
                      ["doMgL", "Inflow DO", defaults.doMgL],
                    ] as const
                  ).map(([key, label, fallback]) => (
                    <td key={key} className="num">
                      <UnitField
                        control={control}
                        name={path(`inputs.inflowOverrides.${formKey(r.id)}.${key}`)}
                        label={`${label} of ${r.id}`}
                        system={system}
                        nullable
                        compact
                        placeholder={fallback === null ? "90 % sat." : String(fallback)}
                      />
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
