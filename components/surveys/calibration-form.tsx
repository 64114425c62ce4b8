"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { FIT_DEFAULTS, FIT_PARAMETER_NAMES, FIT_PARAMETERS, type FitParameter } from "@/lib/domain";
import { ApiError } from "@/lib/queries/fetcher";
import { useStartCalibrationMutation } from "@/lib/queries/surveys";
import { calibrationRunSchema } from "@/lib/validation/calibration";

export interface CalibrationScenarioChoice {
  id: string;
  name: string;
  networkVersion: number;
  conditions: string[];
}

interface Row {
  on: boolean;
  scope: "all" | "some";
  reaches: string;
  min: string;
  max: string;
  start: string;
}

const initialRows = (): Record<FitParameter, Row> =>
  Object.fromEntries(
    FIT_PARAMETERS.map((p) => [p, { on: p === "kd20_per_day", scope: "all", reaches: "", min: String(FIT_DEFAULTS[p].min), max: String(FIT_DEFAULTS[p].max), start: String(FIT_DEFAULTS[p].start) }]),
  ) as Record<FitParameter, Row>;

/**
 * Calibrate a scenario to this survey: the scenario and the condition that stands for the
 * survey's day (its flows and temperatures), and each coefficient to fit over all reaches or
 * named ones, with bounds and a start (wide defaults: common practice). Checked by the
 * request's own schema, then queued as a run; its page shows the progress and the report.
 */
export function CalibrationForm({
  basinId,
  surveyId,
  surveyNetworkVersion,
  scenarios,
  otherSurveys,
  stations = [],
}: {
  basinId: string;
  surveyId: string;
  surveyNetworkVersion: number;
  scenarios: CalibrationScenarioChoice[];
  /** Surveys the fit may be checked against (not this one). */
  otherSurveys: { id: string; name: string }[];
  /** The survey's stations with DO, and the weight the file gives each (1 when none). */
  stations?: { station: string; weight: number }[];
}) {
  const router = useRouter();
  const start = useStartCalibrationMutation(basinId);
  const [scenarioId, setScenarioId] = useState(scenarios[0]?.id ?? "");
  const scenario = scenarios.find((s) => s.id === scenarioId);
  const [condition, setCondition] = useState(scenarios[0]?.conditions[0] ?? "");
  const [rows, setRows] = useState(initialRows);
  const [validationSurveyId, setValidationSurveyId] = useState("");
  const [setName, setSetName] = useState("");
  const [weights, setWeights] = useState<Record<string, string>>({});
  const [problems, setProblems] = useState<string[]>([]);
  const set = (p: FitParameter, patch: Partial<Row>) => setRows((r) => ({ ...r, [p]: { ...r[p], ...patch } }));

  if (scenarios.length === 0) return <Notice tone="info" title="Calibrate the model to this survey">Create a scenario first: a calibration fits a scenario&apos;s coefficients.</Notice>;

  const submit = async (e: React.FormEvent) => {
    e.preventDefault();
    setProblems([]);
    const chosen = FIT_PARAMETERS.filter((p) => rows[p].on);
    const request = {
      ...(setName.trim() ? { name: setName.trim() } : {}),
      surveyId,
      ...(validationSurveyId ? { validationSurveyId } : {}),
      ...(Object.keys(weights).length ? { weights: Object.fromEntries(Object.entries(weights).map(([k, v]) => [k, Number(v)])) } : {}),
      condition,
      fit: chosen.map((p) => ({
        parameter: p,
        reaches: rows[p].scope === "all" ? "all" : rows[p].reaches.split(/[\s,;]+/).filter(Boolean),
        min: Number(rows[p].min),
        max: Number(rows[p].max),
        start: Number(rows[p].start),
      })),
    };
    const parsed = calibrationRunSchema.safeParse(request);
    if (!parsed.success) {
      setProblems(parsed.error.issues.map((i) => (i.path[0] === "fit" && typeof i.path[1] === "number" ? `${FIT_PARAMETER_NAMES[chosen[i.path[1]]]}: ${i.message}` : i.message)));
      return;
    }
    try {
      const run = await start.mutateAsync({ scenarioId, request: parsed.data });
      router.push(`/basins/${basinId}/runs/${run.id}`);
    } catch (error) {
      if (error instanceof ApiError) setProblems([error.message, ...(error.details ?? []).map((d) => `${d.path}: ${d.message}`)]);
      else setProblems([error instanceof Error ? error.message : "Something went wrong"]);
    }
  };

  return (
    <form onSubmit={submit} className="card space-y-4" noValidate aria-label="Calibrate the model to this survey">
      <h2>Calibrate the model to this survey</h2>
      <p className="text-sm text-ink-soft">
        Sagline fits the coefficients you tick to the survey&apos;s DO by bounded least squares, on the scenario condition that stands for the survey&apos;s
        day — set its flows and temperature to that day&apos;s in the scenario first. Each sample counts with its weight (1 unless the file gives one).
      </p>
      <div className="grid gap-4 sm:grid-cols-2">
        <div>
          <label htmlFor="cal-scenario" className="field-label">
            Scenario
          </label>
          <select
            id="cal-scenario"
            className="field-input"
            value={scenarioId}
            onChange={(e) => {
              setScenarioId(e.target.value);
              setCondition(scenarios.find((s) => s.id === e.target.value)?.conditions[0] ?? "");
            }}
          >
            {scenarios.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name} (network version {s.networkVersion})
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="cal-condition" className="field-label">
            Condition of the survey&apos;s day
          </label>
          <select id="cal-condition" className="field-input" value={condition} onChange={(e) => setCondition(e.target.value)}>
            {scenario?.conditions.map((c) => (
              <option key={c} value={c}>
                {c}
              </option>
            ))}
          </select>
        </div>
      </div>
      <div>
        <label htmlFor="cal-name" className="field-label">
          Name of the fitted set (optional)
        </label>
        <input id="cal-name" className="field-input" value={setName} maxLength={120} placeholder="e.g. August 2026 fit, main stem" onChange={(e) => setSetName(e.target.value)} />
        <p className="mt-1 text-xs text-ink-faint">What a scenario chooses it by and a plan records it as; without one it is named by its survey and condition.</p>
      </div>
      <div>
        <label htmlFor="cal-validation" className="field-label">
          Check the fit against a second survey (optional)
        </label>
        <select id="cal-validation" className="field-input" value={validationSurveyId} onChange={(e) => setValidationSurveyId(e.target.value)}>
          <option value="">No second survey</option>
          {otherSurveys.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name}
            </option>
          ))}
        </select>
        <p className="mt-1 text-xs text-ink-faint">The fitted model is compared with it on the same condition, nothing refitted: the same statistics, for a survey the fit never saw.</p>
      </div>
      {scenario && scenario.networkVersion !== surveyNetworkVersion && (
        <Notice tone="warning">
          The survey&apos;s stations were placed on network version {surveyNetworkVersion}; this scenario uses version {scenario.networkVersion}. Reach ids are
          matched by name.
        </Notice>
      )}
      <fieldset className="space-y-3">
        <legend className="field-label">Coefficients to fit</legend>
        {FIT_PARAMETERS.map((p) => {
          const r = rows[p];
          return (
            <div key={p} className="rounded-md border border-rule p-3" data-testid={`fit-${p}`}>
              <label className="flex items-center gap-2 text-sm font-medium">
                <input type="checkbox" checked={r.on} onChange={(e) => set(p, { on: e.target.checked })} /> {FIT_PARAMETER_NAMES[p]}
              </label>
              {r.on && (
                <div className="mt-3 grid gap-3 sm:grid-cols-[minmax(0,2fr)_repeat(3,minmax(0,1fr))]">
                  <div className="space-y-1 text-sm">
                    <label className="flex items-center gap-2">
                      <input type="radio" name={`${p}-scope`} checked={r.scope === "all"} onChange={() => set(p, { scope: "all" })} /> one value for every reach
                    </label>
                    <label className="flex items-center gap-2">
                      <input type="radio" name={`${p}-scope`} checked={r.scope === "some"} onChange={() => set(p, { scope: "some" })} /> one value for these reaches:
                    </label>
                    {r.scope === "some" && (
                      <input aria-label={`Reaches for ${FIT_PARAMETER_NAMES[p]}`} className="field-input" placeholder="TR-03, TR-04" value={r.reaches} onChange={(e) => set(p, { reaches: e.target.value })} />
                    )}
                  </div>
                  {(["min", "max", "start"] as const).map((k) => (
                    <div key={k}>
                      <label className="field-label" htmlFor={`${p}-${k}`}>
                        {k === "min" ? "Lowest" : k === "max" ? "Highest" : "Start"}
                      </label>
                      <input id={`${p}-${k}`} className="field-input" inputMode="decimal" value={r[k]} onChange={(e) => set(p, { [k]: e.target.value })} />
                    </div>
                  ))}
                </div>
              )}
            </div>
          );
        })}
      </fieldset>
      {stations.length > 0 && (
        <details className="rounded-md border border-rule p-3">
          <summary className="cursor-pointer text-sm font-medium">Weights of the stations ({stations.length})</summary>
          <p className="mt-2 text-xs text-ink-faint">
            Each station&apos;s squared residual counts this many times in the fit (the file&apos;s weight column, else 1). Give a less trusted reading less weight.
          </p>
          <div className="mt-3 grid grid-cols-2 gap-3 sm:grid-cols-4">
            {stations.map((st) => (
              <div key={st.station}>
                <label htmlFor={`cal-weight-${st.station}`} className="field-label">
                  {st.station}
                </label>
                <input
                  id={`cal-weight-${st.station}`}
                  className="field-input"
                  inputMode="decimal"
                  value={weights[st.station] ?? String(st.weight)}
                  onChange={(e) => setWeights((w) => ({ ...w, [st.station]: e.target.value }))}
                />
              </div>
            ))}
          </div>
        </details>
      )}
      {problems.length > 0 && (
        <Notice tone="error" title="The calibration was not started">
          <ul className="list-disc pl-5" data-testid="calibration-problems">
            {problems.map((m, i) => (
              <li key={i}>{m}</li>
            ))}
          </ul>
        </Notice>
      )}
      <Button type="submit" disabled={start.isPending}>
        {start.isPending ? "Starting…" : "Start the calibration"}
      </Button>
    </form>
  );
}
