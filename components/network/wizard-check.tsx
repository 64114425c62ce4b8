"use client";
import { useMemo, useState } from "react";
import { useFormContext, useWatch, type FieldPath } from "react-hook-form";
import { BasinMapLazy } from "@/components/map/basin-map-lazy";
import { Button } from "@/components/ui/button";
import type { Problem } from "@/geo";
import { networkPreview } from "@/geo/preview";
import type { DraftResultDto } from "@/lib/queries/networks";
import type { ImportFormValues } from "@/lib/validation/import-form";
import { ReportView } from "./report-view";
import type { ValidationProgress } from "./use-validation";

/**
 * Step 3: the topology options and the outlet, the check (with its progress), then the
 * report beside the map and where each discharger was placed (reassignable).
 */
export function WizardCheck({
  result,
  checked,
  pending,
  progress,
  onCheck,
}: {
  result: DraftResultDto | null;
  /** Counts the checks, so a new report starts with nothing shown on the map. */
  checked: number;
  pending: boolean;
  progress: ValidationProgress | null;
  onCheck: () => void;
}) {
  const { register } = useFormContext<ImportFormValues>();
  const reachIds = useMemo(() => result?.report.network.reaches.map((r) => r.id).sort() ?? [], [result]);
  return (
    <section className="card space-y-4">
      <h2>3. Check the network</h2>
      <div className="grid gap-4 sm:grid-cols-4">
        <NumberOption label="Join line ends within (m)" name="options.toleranceM" />
        <NumberOption label="Snap dischargers within (m)" name="options.maxSnapDistanceM" />
        <NumberOption label="Flag reaches longer than (km)" name="options.maxReachLengthKm" />
        <div>
          <label htmlFor="outlet" className="field-label">
            Outlet
          </label>
          <select id="outlet" className="field-input" {...register("outletReach")}>
            <option value="">Suggested</option>
            {reachIds.map((id) => (
              <option key={id} value={id}>
                downstream end of {id}
              </option>
            ))}
          </select>
        </div>
      </div>
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" {...register("options.allowMultipleOutlets")} />
        The basin has several separate outlets (treat separate parts as independent trees)
      </label>
      <Button onClick={onCheck} disabled={pending}>
        {pending ? "Checking…" : result ? "Check again" : "Check the network"}
      </Button>
      {progress && (
        <div role="status" aria-live="polite" data-testid="validation-progress" className="max-w-md text-sm text-ink-soft">
          <div className="mb-1">
            Checking: {progress.stage} ({progress.percent} %)
          </div>
          <progress className="w-full" max={100} value={progress.percent} aria-label="Validation progress" />
        </div>
      )}
      {result && <WizardReport key={checked} result={result} />}
      {result && result.report.network.dischargers.length > 0 && <SnappedDischargers result={result} reachIds={reachIds} />}
    </section>
  );
}

/** The report beside the map; a problem clicked in the report is shown on the map. */
function WizardReport({ result }: { result: DraftResultDto }) {
  const [shown, setShown] = useState<Problem | null>(null);
  const preview = useMemo(() => networkPreview(result.report.network), [result]);
  return (
    <div className="grid gap-4 lg:grid-cols-[3fr_2fr]">
      <BasinMapLazy data={preview} highlight={shown?.geometry ? [shown.geometry] : []} height={520} />
      <div className="max-h-[520px] overflow-y-auto">
        <ReportView report={result.report} shown={shown} onShow={setShown} />
      </div>
    </div>
  );
}

/** Where each discharger was placed; a different reach chosen here is sent with the next check. */
function SnappedDischargers({ result, reachIds }: { result: DraftResultDto; reachIds: string[] }) {
  const { control, setValue } = useFormContext<ImportFormValues>();
  const reassign = useWatch({ control, name: "reassign" });
  const choose = (permit: string, nearest: string | undefined, reach: string) => {
    const next = { ...reassign };
    if (reach && reach !== nearest) next[permit] = reach;
    else delete next[permit];
    // the whole record at once: permit ids are keys, not form paths
    setValue("reassign", next, { shouldDirty: true });
  };
  return (
    <>
      <div className="overflow-x-auto">
        <table className="data-table" data-testid="snapped-dischargers">
          <thead>
            <tr>
              <th>Discharger</th>
              <th>Permit id</th>
              <th>Facility</th>
              <th className="num">Snapped (m)</th>
              <th>Reach</th>
              <th className="num">From reach head (km)</th>
            </tr>
          </thead>
          <tbody>
            {result.report.network.dischargers.map((d) => (
              <tr key={d.id}>
                <td>{d.attributes.name}</td>
                <td className="font-mono text-xs">{d.id}</td>
                <td>{result.knownPermits.includes(d.id) ? "existing facility" : "new facility"}</td>
                <td className="num">{d.snapDistanceM === undefined ? "—" : d.snapDistanceM.toFixed(0)}</td>
                <td>
                  <select
                    aria-label={`Reach of ${d.attributes.name}`}
                    className="rounded border border-rule-strong bg-paper-raised px-2 py-1 text-sm"
                    value={reassign[d.id] ?? d.reachId ?? ""}
                    onChange={(e) => choose(d.id, d.reachId, e.target.value)}
                  >
                    {!d.reachId && <option value="">(not placed)</option>}
                    {reachIds.map((id) => (
                      <option key={id} value={id}>
                        {id}
                        {id === d.reachId && d.assignment === "nearest" ? " (nearest)" : ""}
                      </option>
                    ))}
                  </select>
                </td>
                <td className="num">{d.chainageKm === undefined ? "—" : d.chainageKm.toFixed(3)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {Object.keys(reassign).length > 0 && <p className="text-sm text-ochre-700">Reassignments take effect when you check again.</p>}
    </>
  );
}

type NumberField = Extract<FieldPath<ImportFormValues>, `options.${"toleranceM" | "maxSnapDistanceM" | "maxReachLengthKm"}`>;

/** A topology option in metres or kilometres; its message is the API's own rule (lib/validation/network.ts). */
function NumberOption({ label, name }: { label: string; name: NumberField }) {
  const {
    register,
    formState: { errors },
  } = useFormContext<ImportFormValues>();
  const id = label.replace(/\W+/g, "-").replace(/^-|-$/g, "").toLowerCase();
  const error = errors.options?.[name.slice("options.".length) as "toleranceM"]?.message;
  return (
    <div>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      <input
        id={id}
        type="number"
        min={0}
        step="any"
        className="field-input"
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        {...register(name, { valueAsNumber: true })}
      />
      {error && (
        <p className="field-error" id={`${id}-error`}>
          {error}
        </p>
      )}
    </div>
  );
}
