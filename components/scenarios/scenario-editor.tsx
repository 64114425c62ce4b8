"use client";
import { SCENARIO_FIELD_LABELS as LABELS } from "@/lib/format/labels";
import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useState } from "react";
import { useFieldArray, useForm, useWatch, type Resolver } from "react-hook-form";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { ApiError } from "@/lib/queries/fetcher";
import { ALLOCATION_OBJECTIVES, OBJECTIVE_NAMES, REAERATION_NAMES, THETA_RULE_NAMES, THETA_RULES, type KaMethod, type UnitSystem } from "@/lib/domain";
import { formatIn, unitLabel } from "@/lib/format/quantities";
import { DEFAULT_HEADWATER_DO_TEXT, defaultHeadwaterDoMgL, networkOutletFlowM3s } from "@/lib/scenarios/design-defaults";
import { fromFormKeys, toFormKeys } from "@/lib/scenarios/form-keys";
import { useNetworksQuery } from "@/lib/queries/networks";
import { useScenarioQuery, useStartRunMutation, useUpdateScenarioMutation } from "@/lib/queries/scenarios";
import type { CalibrationChoice } from "@/lib/services/runs";
import type { ScenarioDto } from "@/lib/services/scenarios";
import { fittedKineticsText } from "@/lib/results/fitted-kinetics";
import { formatDay } from "@/lib/format/zoned-time";
import { useBasinZone } from "@/components/layout/basin-zone";
import { scenarioInputsSchema, type ScenarioInputs } from "@/lib/validation/scenario";
import { DischargerInputs, type OutfallRow } from "./discharger-inputs";
import { INFLOW_OVERRIDE_FIELDS, REACH_OVERRIDE_FIELDS, ReachInputs, type ReachRow } from "./reach-inputs";
import { RunStarter } from "./run-starter";
import { UnitField } from "./unit-field";

const formSchema = z.object({
  name: z.string().trim().min(1, "Give the scenario a name").max(120),
  description: z.string().trim().max(2000),
  inputs: scenarioInputsSchema,
});
type FormValues = z.infer<typeof formSchema>;
type GaugeStatistic = NonNullable<ScenarioInputs["conditions"][number]["gaugeFlow"]>["statistic"];

const DISCHARGER_FIELDS = ["designFlowM3s", "bod5MgL", "cbodUMgL", "bottleKPerDay", "doMgL", "temperatureC"] as const;

/**
 * Give every discharger's fields a value (null = keep the network's) so the
 * form's saved state and its registered fields match, and "unsaved changes"
 * means what it says.
 */
function formValues(s: ScenarioDto, outfalls: OutfallRow[], reaches: ReachRow[]): FormValues {
  const slots = <K extends string>(keys: readonly K[]) => Object.fromEntries(keys.map((k) => [k, null]));
  const dischargers = { ...s.inputs.dischargers };
  for (const o of outfalls) dischargers[o.permitId] = { ...slots(DISCHARGER_FIELDS), ...dischargers[o.permitId] };
  const reachOverrides = { ...s.inputs.reachOverrides };
  for (const r of reaches) reachOverrides[r.id] = { ...slots(REACH_OVERRIDE_FIELDS), ...reachOverrides[r.id] };
  const inflowOverrides = { ...s.inputs.inflowOverrides };
  for (const r of reaches) inflowOverrides[r.id] = { ...slots(INFLOW_OVERRIDE_FIELDS), ...inflowOverrides[r.id] };
  const conditions = s.inputs.conditions.map((c) => ({
    ...c,
    reachFlowsM3s: toFormKeys({ ...Object.fromEntries(reaches.map((r) => [r.id, null])), ...c.reachFlowsM3s }),
  }));
  // ids are keyed by form keys inside the form (lib/scenarios/form-keys.ts)
  return {
    name: s.name,
    description: s.description,
    inputs: {
      ...s.inputs,
      dischargers: toFormKeys(dischargers),
      reachOverrides: toFormKeys(reachOverrides),
      inflowOverrides: toFormKeys(inflowOverrides),
      conditions,
    },
  };
}

/** The form's values as the API takes them: records keyed by ids again. */
function fromFormValues(v: FormValues): FormValues {
  return {
    ...v,
    inputs: {
      ...v.inputs,
      dischargers: fromFormKeys(v.inputs.dischargers),
      reachOverrides: fromFormKeys(v.inputs.reachOverrides),
      inflowOverrides: fromFormKeys(v.inputs.inflowOverrides),
      conditions: v.inputs.conditions.map((c) => ({ ...c, reachFlowsM3s: fromFormKeys(c.reachFlowsM3s) })),
    },
  };
}

/** The reaeration choices the editor offers, in the names' order ("given" rates come per reach, not from this list). */
const KA_CHOICES = (Object.entries(REAERATION_NAMES) as [KaMethod, string][])
  .filter(([k]) => k !== "given")
  .map(([k, v]) => [k, k === "tsivoglou-neal" ? `${v} (needs slope)` : v] as const);

/** A gauge record a condition may take its design flow from: its reach and its statistics' values (m³/s). */
export interface GaugeChoice {
  id: string;
  name: string;
  reachId: string | null;
  designFlows: { name: string; value: number | null }[];
}

export function ScenarioEditor({
  basinId,
  scenario: initial,
  unitSystem,
  basinCriterion,
  canEdit,
  outfalls,
  reaches,
  gauges = [],
  calibrations = [],
  temperatureRecords = [],
}: {
  basinId: string;
  scenario: ScenarioDto;
  unitSystem: UnitSystem;
  basinCriterion: number;
  canEdit: boolean;
  outfalls: OutfallRow[];
  reaches: ReachRow[];
  /** Gauge records placed on a reach, whose statistics a condition may take. */
  gauges?: GaugeChoice[];
  /** Finished calibrations whose fitted coefficients the scenario may use. */
  calibrations?: CalibrationChoice[];
  /** Water-temperature records a condition's design temperature may come from, with their default-rule value (°C). */
  temperatureRecords?: { id: string; name: string; summerC: number | null }[];
}) {
  const query = useScenarioQuery(basinId, initial.id);
  const scenario = query.data ?? initial;
  const update = useUpdateScenarioMutation(basinId, initial.id);
  const networks = useNetworksQuery(basinId);
  const newest = networks.data?.reduce((v, n) => Math.max(v, n.version), 0) ?? 0;
  const start = useStartRunMutation(basinId);
  const [notice, setNotice] = useState<{ tone: "success" | "error"; text: string; stale?: boolean } | null>(null);
  const form = useForm<FormValues>({
    resolver: zodResolver(formSchema) as Resolver<FormValues>,
    defaultValues: formValues(scenario, outfalls, reaches),
  });
  const { register, control, handleSubmit, formState, reset, setValue } = form;
  const conditions = useFieldArray({ control, name: "inputs.conditions" });
  const errors = formState.errors;
  const criterionOverride = useWatch({ control, name: "inputs.criterionDoMgL" });
  const watchedConditions = useWatch({ control, name: "inputs.conditions" });
  const headwaterTemperature = useWatch({ control, name: "inputs.headwater.temperatureC" });
  const fittedKinetics = useWatch({ control, name: "inputs.fittedKinetics" });
  const zone = useBasinZone();
  const outletFlow = networkOutletFlowM3s(reaches);
  const gaugeOptions = gauges.flatMap((g) =>
    g.reachId === null
      ? []
      : g.designFlows
          .filter((d) => d.value !== null && d.value > 0)
          .map((d) => ({ key: `${g.id}|${d.name}`, gaugeId: g.id, statistic: d.name, reachId: g.reachId!, value: d.value!, label: `${d.name} at ${g.name} (${formatIn("flow", d.value, unitSystem)} ${unitLabel("flow", unitSystem)})` })),
  );
  /** The factor on the network's design flows a condition gives (what the model file will use). */
  const effectiveScale = (c: FormValues["inputs"]["conditions"][number] | undefined): number | null => {
    if (!c) return null;
    if (c.gaugeFlow) {
      const option = gaugeOptions.find((o) => o.gaugeId === c.gaugeFlow!.gaugeId && o.statistic === c.gaugeFlow!.statistic);
      const own = reaches.find((r) => r.id === option?.reachId)?.attributes.designFlowM3s;
      return option && typeof own === "number" && own > 0 ? option.value / own : null;
    }
    if (c.outletFlowM3s != null) return outletFlow ? c.outletFlowM3s / outletFlow : null;
    return c.flowScale;
  };
  // the default at the first condition's temperature, or the headwater's own when the condition sets none
  const exampleT = watchedConditions?.[0]?.temperatureC ?? headwaterTemperature;
  const headwaterDoExample =
    typeof exampleT === "number" && Number.isFinite(exampleT)
      ? `${defaultHeadwaterDoMgL(exampleT).toFixed(2)} mg/L at ${formatIn("temperature", exampleT, unitSystem)} ${unitLabel("temperature", unitSystem)} at sea level`
      : null;

  const save = handleSubmit(async (values) => {
    setNotice(null);
    try {
      const saved = await update.mutateAsync({ version: scenario.version, ...fromFormValues(values) });
      reset(formValues(saved, outfalls, reaches));
      setNotice({ tone: "success", text: `Saved (version ${saved.version}).` });
    } catch (e) {
      if (e instanceof ApiError && e.status === 409) setNotice({ tone: "error", text: e.message, stale: true });
      else setNotice({ tone: "error", text: e instanceof Error ? e.message : String(e) });
    }
  });

  const reload = async () => {
    const fresh = await query.refetch();
    if (fresh.data) reset(formValues(fresh.data, outfalls, reaches));
    setNotice(null);
  };

  const num = (label: string, name: Parameters<typeof register>[0], unit?: string, hint?: string) => (
    <UnitField control={control} name={name} label={label} system={unitSystem} plainUnit={unit} hint={hint} />
  );

  return (
    <form onSubmit={save} noValidate className="space-y-6" aria-label="Scenario">
      {newest > scenario.networkVersion && (
        <Notice tone="info">
          <span data-testid="newer-network">
            This scenario uses network version {scenario.networkVersion}; version {newest} is newer. Runs of this scenario keep
            using version {scenario.networkVersion}. To model the newer network, create a scenario on it from{" "}
            <Link href={`/basins/${basinId}/scenarios`}>All scenarios and runs</Link>.
          </span>
        </Notice>
      )}
      {notice && (
        <Notice tone={notice.tone}>
          {notice.text}
          {notice.stale && (
            <Button variant="secondary" className="ml-3 px-2 py-1" onClick={reload}>
              Reload the saved version
            </Button>
          )}
        </Notice>
      )}
      <fieldset disabled={!canEdit} className="space-y-6">
        <section className="card grid gap-4 md:grid-cols-2">
          <Field label={LABELS.scenarioName} error={errors.name?.message} {...register("name")} />
          <Field label="Description" error={errors.description?.message} {...register("description")} />
          <div>
            <span className="field-label">DO criterion</span>
            <label className="mb-2 flex items-center gap-2 text-sm">
              <input
                type="checkbox"
                checked={criterionOverride === null}
                onChange={(e) => setValue("inputs.criterionDoMgL", e.target.checked ? null : basinCriterion, { shouldDirty: true })}
              />
              Use the basin&apos;s criterion ({basinCriterion.toFixed(1)} mg/L)
            </label>
            {criterionOverride !== null && num(LABELS.criterion, "inputs.criterionDoMgL", "mg/L")}
          </div>
          <UnitField control={control} name="inputs.stepKm" label={LABELS.stepKm} kind="length" system={unitSystem} />
        </section>

        <section className="card space-y-3">
          <div className="flex items-center justify-between">
            <h2>Critical conditions</h2>
            <Button
              variant="secondary"
              onClick={() =>
                conditions.append({
                  name: `Condition ${conditions.fields.length + 1}`,
                  flowScale: 1,
                  outletFlowM3s: null,
                  gaugeFlow: null,
                  reachFlowsM3s: toFormKeys(Object.fromEntries(reaches.map((r) => [r.id, null]))),
                  temperatureC: null,
                  temperatureFrom: null,
                })
              }
              disabled={conditions.fields.length >= 6}
            >
              Add a condition
            </Button>
          </div>
          <p className="text-sm text-ink-soft">
            Design flows come from the network&apos;s reach table (its low-flow statistic, e.g. 7Q10). Scale them here, or
            enter the design flow at the outlet, or take a gauge&apos;s statistic (its reach gets that flow), and every reach is scaled to match; a flow for one reach goes in{" "}
            <em>Reach by reach</em> below. A blank temperature keeps each reach&apos;s own. An allocation keeps DO above the
            criterion under every condition at once.
          </p>
          {errors.inputs?.conditions?.message && <p className="field-error">{errors.inputs.conditions.message}</p>}
          {conditions.fields.map((c, i) => (
            <div key={c.id} className="grid items-end gap-3 border-t border-rule pt-3 md:grid-cols-[2fr_1fr_1fr_1.6fr_1fr_auto]">
              <Field label="Name" error={errors.inputs?.conditions?.[i]?.name?.message} {...register(`inputs.conditions.${i}.name`)} />
              {watchedConditions?.[i]?.gaugeFlow || watchedConditions?.[i]?.outletFlowM3s != null ? (
                <div>
                  <span className="field-label">Flow scale</span>
                  <p className="py-2 text-sm" data-testid={`effective-scale-${i}`}>
                    {(() => {
                      const scale = effectiveScale(watchedConditions[i]);
                      const from = watchedConditions[i].gaugeFlow ? "from the gauge" : "from the outlet flow";
                      return scale !== null ? `× ${scale.toFixed(3)} (${from})` : `set ${from}`;
                    })()}
                  </p>
                </div>
              ) : (
                num(LABELS.flowScale, `inputs.conditions.${i}.flowScale`, "× design flow")
              )}
              <UnitField
                control={control}
                name={`inputs.conditions.${i}.outletFlowM3s`}
                label="or design flow at the outlet"
                kind="flow"
                system={unitSystem}
                nullable
                placeholder={outletFlow !== undefined ? `network: ${formatIn("flow", outletFlow, unitSystem)}` : "none in the network"}
              />
              <div>
                <label htmlFor={`gauge-flow-${i}`} className="field-label">
                  or from a gauge
                </label>
                <select
                  id={`gauge-flow-${i}`}
                  className="field-input"
                  disabled={!canEdit}
                  value={watchedConditions?.[i]?.gaugeFlow ? `${watchedConditions[i].gaugeFlow!.gaugeId}|${watchedConditions[i].gaugeFlow!.statistic}` : ""}
                  onChange={(e) => {
                    const option = gaugeOptions.find((o) => o.key === e.target.value);
                    const was = watchedConditions?.[i]?.gaugeFlow;
                    setValue(
                      `inputs.conditions.${i}.gaugeFlow`,
                      option ? { gaugeId: option.gaugeId, statistic: option.statistic as GaugeStatistic, headwaters: was?.headwaters ?? "scaled", areaExponent: was?.areaExponent ?? 1 } : null,
                      { shouldDirty: true },
                    );
                    if (option) setValue(`inputs.conditions.${i}.outletFlowM3s`, null, { shouldDirty: true });
                  }}
                >
                  <option value="">{gaugeOptions.length ? "No gauge" : "No gauge record on a reach"}</option>
                  {gaugeOptions.map((o) => (
                    <option key={o.key} value={o.key}>
                      {o.label}
                    </option>
                  ))}
                </select>
                {errors.inputs?.conditions?.[i]?.gaugeFlow?.message && <p className="field-error">{errors.inputs.conditions[i].gaugeFlow.message}</p>}
                {watchedConditions?.[i]?.gaugeFlow && (
                  <div className="mt-2 space-y-2">
                    <label htmlFor={`gauge-headwaters-${i}`} className="field-label">
                      Headwaters get
                    </label>
                    <select id={`gauge-headwaters-${i}`} className="field-input" disabled={!canEdit} {...register(`inputs.conditions.${i}.gaugeFlow.headwaters`)}>
                      <option value="scaled">their design flow, scaled like every reach</option>
                      <option value="drainage-area">the gauge&apos;s value by drainage-area ratio</option>
                    </select>
                    {watchedConditions[i].gaugeFlow!.headwaters === "drainage-area" && (
                      <Field
                        label="Drainage-area exponent"
                        hint="Q = Q_gauge × (A / A_gauge)^exponent; 1 is common practice without a regional study. Headwaters without a drainage area are scaled."
                        inputMode="decimal"
                        disabled={!canEdit}
                        error={errors.inputs?.conditions?.[i]?.gaugeFlow?.areaExponent?.message}
                        {...register(`inputs.conditions.${i}.gaugeFlow.areaExponent`, { valueAsNumber: true })}
                        id={`gauge-exponent-${i}`}
                      />
                    )}
                  </div>
                )}
              </div>
              <div>
                <UnitField
                  control={control}
                  name={`inputs.conditions.${i}.temperatureC`}
                  label={LABELS.designTemperature}
                  kind="temperature"
                  system={unitSystem}
                  nullable
                />
                <label htmlFor={`temperature-from-${i}`} className="field-label mt-2">
                  or from a temperature record
                </label>
                <select
                  id={`temperature-from-${i}`}
                  className="field-input"
                  disabled={!canEdit}
                  value={watchedConditions?.[i]?.temperatureFrom?.recordId ?? ""}
                  onChange={(e) => {
                    const was = watchedConditions?.[i]?.temperatureFrom;
                    setValue(
                      `inputs.conditions.${i}.temperatureFrom`,
                      e.target.value ? { recordId: e.target.value, percentile: was?.percentile ?? 90, months: was?.months ?? [6, 7, 8, 9] } : null,
                      { shouldDirty: true },
                    );
                  }}
                >
                  <option value="">{temperatureRecords.length ? "No record" : "No temperature record in this basin"}</option>
                  {temperatureRecords.map((t) => (
                    <option key={t.id} value={t.id}>
                      {t.name}
                      {t.summerC !== null ? ` (June–September 90th percentile ${formatIn("temperature", t.summerC, unitSystem)} ${unitLabel("temperature", unitSystem)})` : ""}
                    </option>
                  ))}
                </select>
                {watchedConditions?.[i]?.temperatureFrom && (
                  <Field
                    label="Percentile of the daily means (June–September)"
                    hint="The condition's temperature is worked out from the record by this rule when the scenario is saved."
                    inputMode="decimal"
                    disabled={!canEdit}
                    error={errors.inputs?.conditions?.[i]?.temperatureFrom?.percentile?.message}
                    {...register(`inputs.conditions.${i}.temperatureFrom.percentile`, { valueAsNumber: true })}
                    id={`temperature-percentile-${i}`}
                  />
                )}
                {watchedConditions?.[i]?.temperatureFrom?.source && (
                  <p className="mt-1 text-xs text-ink-faint" data-testid={`temperature-source-${i}`}>
                    From {watchedConditions[i].temperatureFrom!.source!.recordName}: {watchedConditions[i].temperatureFrom!.source!.rule}
                  </p>
                )}
              </div>
              <Button variant="quiet" disabled={conditions.fields.length === 1} onClick={() => conditions.remove(i)}>
                Remove
              </Button>
            </div>
          ))}
        </section>

        <section className="card grid gap-4 md:grid-cols-3">
          <h2 className="md:col-span-3">Kinetics (at 20 °C, base e)</h2>
          {num("Deoxygenation k_d where the network gives none", "inputs.kinetics.kd20PerDay", "1/d")}
          <div>
            <label htmlFor="ka-method" className="field-label">
              Reaeration where the network gives no k_a
            </label>
            <select id="ka-method" className="field-input" {...register("inputs.kinetics.kaMethod")}>
              {KA_CHOICES.map(([v, l]) => (
                <option key={v} value={v}>
                  {l}
                </option>
              ))}
            </select>
            <label className="mt-2 flex items-center gap-2 text-sm">
              <input type="checkbox" {...register("inputs.kinetics.kaFloor")} /> Never below 0.6/H
            </label>
          </div>
          <div>
            <label htmlFor="theta-rule" className="field-label">
              Temperature correction of k_d
            </label>
            <select id="theta-rule" className="field-input" {...register("inputs.kinetics.thetaRule")}>
              {THETA_RULES.map((r) => (
                <option key={r} value={r}>
                  {THETA_RULE_NAMES[r]}
                  {r === "constant" ? " (1.047)" : ""}
                </option>
              ))}
            </select>
          </div>
          {num(LABELS.ks, "inputs.kinetics.ks20PerDay", "1/d")}
          {num(LABELS.sod, "inputs.kinetics.sod20GPerM2Day", "g O₂/m²/d")}
          {num(LABELS.kn, "inputs.kinetics.kn20PerDay", "1/d")}
          <div className="md:col-span-3">
            <label htmlFor="fitted-kinetics" className="field-label">
              Coefficients fitted to a survey
            </label>
            <select
              id="fitted-kinetics"
              className="field-input"
              disabled={!canEdit}
              value={fittedKinetics?.runId ?? ""}
              onChange={(e) => setValue("inputs.fittedKinetics", e.target.value ? { runId: e.target.value } : null, { shouldDirty: true })}
            >
              <option value="">{calibrations.length ? "None: the values above and the network's" : "None (no finished calibration in this basin)"}</option>
              {calibrations.map((c) => (
                <option key={c.runId} value={c.runId}>
                  {c.name ? `${c.name}: ` : ""}
                  {c.surveyName} on “{c.condition}” ({c.scenarioName}; RMSE {c.rmseMgL.toFixed(2)} mg/L; {formatDay(new Date(c.finishedAt), zone)})
                </option>
              ))}
            </select>
            <p className="mt-1 text-xs text-ink-faint" data-testid="fitted-kinetics-source">
              {fittedKinetics?.source && fittedKinetics.runId === scenario.inputs.fittedKinetics?.runId
                ? `In use: ${fittedKineticsText(fittedKinetics.source)}.`
                : fittedKinetics
                  ? "The fitted values replace these coefficients on the reaches they were fitted over; saved with where they came from."
                  : "A calibration's fitted values replace these coefficients on the reaches they were fitted over."}
            </p>
            {errors.inputs?.fittedKinetics?.runId?.message && <p className="field-error">{errors.inputs.fittedKinetics.runId.message}</p>}
          </div>
        </section>

        <section className="card grid gap-4 md:grid-cols-4">
          <h2 className="md:col-span-4">Headwater and tributary water</h2>
          {num("CBODu", "inputs.headwater.cbodUMgL", "mg/L")}
          {num("NBODu", "inputs.headwater.nbodUMgL", "mg/L")}
          <UnitField
            control={control}
            name="inputs.headwater.doMgL"
            label="DO"
            plainUnit="mg/L"
            system={unitSystem}
            nullable
            hint={`Blank: ${DEFAULT_HEADWATER_DO_TEXT}${headwaterDoExample ? `, e.g. ${headwaterDoExample}` : ""}.`}
          />
          <UnitField control={control} name="inputs.headwater.temperatureC" label="Temperature if none set" kind="temperature" system={unitSystem} />
        </section>

        <ReachInputs
          control={control}
          reaches={reaches}
          conditions={(watchedConditions ?? []).map((c) => ({
            name: c.name,
            flowScale: effectiveScale(c) ?? c.flowScale,
          }))}
          system={unitSystem}
          defaults={{ kn20PerDay: scenario.inputs.kinetics.kn20PerDay, cbodUMgL: scenario.inputs.headwater.cbodUMgL, doMgL: scenario.inputs.headwater.doMgL }}
        />

        <DischargerInputs control={control} outfalls={outfalls} system={unitSystem} />

        <section className="card grid gap-4 md:grid-cols-3">
          <h2 className="md:col-span-3">Allocation</h2>
          <div>
            <label htmlFor="objective" className="field-label">
              Objective
            </label>
            <select id="objective" className="field-input" {...register("inputs.allocation.objective")}>
              {ALLOCATION_OBJECTIVES.map((o) => (
                <option key={o} value={o}>
                  {OBJECTIVE_NAMES[o]}
                </option>
              ))}
            </select>
          </div>
          <UnitField
            control={control}
            name="inputs.allocation.floorBod5MgL"
            label={LABELS.floorBod5}
            plainUnit="mg/L"
            system={unitSystem}
            nullable
            hint="e.g. 30 mg/L for secondary treatment; blank for none. Today's load is the ceiling."
          />
          {num(LABELS.mosDo, "inputs.allocation.mosDoMgL", "mg/L")}
          {num(LABELS.mosFraction, "inputs.allocation.mosFraction", "0–0.9")}
          {num(LABELS.reserveFraction, "inputs.allocation.reserveFraction", "0–0.9")}
        </section>
      </fieldset>

      <div className="flex flex-wrap items-center gap-3">
        {canEdit && (
          <Button type="submit" disabled={update.isPending}>
            {update.isPending ? "Saving…" : formState.isDirty ? "Save changes" : "Save"}
          </Button>
        )}
        <span className="text-sm text-ink-faint">
          Version {scenario.version} · network v{scenario.networkVersion}
          {scenario.updatedBy ? ` · last saved by ${scenario.updatedBy}` : ""}
        </span>
        <Link href={`/basins/${basinId}/scenarios`} className="ml-auto text-sm">
          All scenarios and runs
        </Link>
      </div>
      {canEdit && (
        <RunStarter basinId={basinId} scenarioId={scenario.id} dirty={formState.isDirty} start={start} />
      )}
    </form>
  );
}

export type { ScenarioInputs };
