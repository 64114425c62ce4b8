"use client";
import { CartesianGrid, ComposedChart, Line, ResponsiveContainer, Scatter, Tooltip, XAxis, YAxis } from "recharts";
import { Notice } from "@/components/ui/notice";
import type { CalibrationRecord } from "@/lib/calibration/payload";
import { FIT_PARAMETER_NAMES, type UnitSystem } from "@/lib/domain";
import { formatIn, unitLabel } from "@/lib/format/quantities";
import { surveyPeriod } from "@/lib/format/survey";

const POINT = "#c08a2e";
const LINE = "#245659";
const RULE = "#d9d6cc";

const num = (v: number | null | undefined, digits = 3) => (v === null || v === undefined || !Number.isFinite(v) ? "—" : v.toFixed(digits));
/** A coefficient's value with as many digits as its standard error warrants (two significant figures of the error). */
function valueText(value: number, se: number | null): string {
  if (se === null || !(se > 0)) return value.toPrecision(4);
  const digits = Math.max(0, Math.min(6, 1 - Math.floor(Math.log10(se))));
  return value.toFixed(digits);
}

/** Observed against modelled DO at every sample, with the 1:1 line. */
function ObservedModelledChart({ residuals }: { residuals: CalibrationRecord["residuals"] }) {
  const all = residuals.flatMap((r) => [r.observed_mg_l, r.modelled_mg_l]);
  const lo = Math.floor(Math.min(...all) - 0.5);
  const hi = Math.ceil(Math.max(...all) + 0.5);
  const points = residuals.map((r) => ({ modelled: r.modelled_mg_l, observed: r.observed_mg_l, station: r.station ?? r.reach }));
  return (
    <figure className="space-y-2">
      <div className="w-full" style={{ height: 300 }} role="img" aria-label="Observed against modelled DO at each sample, with the line of equality">
        <ResponsiveContainer width="100%" height="100%">
          <ComposedChart margin={{ top: 12, right: 20, bottom: 24, left: 8 }}>
            <CartesianGrid stroke={RULE} />
            <XAxis dataKey="modelled" type="number" domain={[lo, hi]} allowDataOverflow label={{ value: "Modelled DO (mg/L)", position: "insideBottom", offset: -12 }} />
            <YAxis dataKey="observed" type="number" domain={[lo, hi]} allowDataOverflow width={48} label={{ value: "Observed (mg/L)", angle: -90, position: "insideLeft" }} />
            <Tooltip formatter={(v) => `${Number(v).toFixed(2)} mg/L`} />
            <Line data={[{ modelled: lo, observed: lo }, { modelled: hi, observed: hi }]} dataKey="observed" name="equal" stroke={LINE} strokeDasharray="4 4" dot={false} isAnimationActive={false} tooltipType="none" />
            <Scatter data={points} dataKey="observed" name="sample" fill={POINT} isAnimationActive={false} />
          </ComposedChart>
        </ResponsiveContainer>
      </div>
      <figcaption className="text-xs text-ink-soft">Each dot is one sample: its observed DO against the fitted model&apos;s at the same reach and km. Dots on the dashed line agree exactly.</figcaption>
    </figure>
  );
}

function ResidualTable({ residuals, unitSystem, testId, caption }: { residuals: CalibrationRecord["residuals"]; unitSystem: UnitSystem; testId: string; caption: string }) {
  const km = unitLabel("length", unitSystem);
  return (
    <div className="overflow-x-auto">
      <table className="data-table" data-testid={testId}>
        <caption className="mb-1 text-left text-sm text-ink-soft">{caption}</caption>
        <thead>
          <tr>
            <th>Station</th>
            <th>Reach</th>
            <th className="num">At ({km})</th>
            <th className="num">Observed (mg/L)</th>
            <th className="num">Modelled (mg/L)</th>
            <th className="num">Residual (mg/L)</th>
          </tr>
        </thead>
        <tbody>
          {residuals.map((r, i) => (
            <tr key={i}>
              <td>{r.station ?? "—"}</td>
              <td className="font-mono text-xs">{r.reach}</td>
              <td className="num">{formatIn("length", r.km, unitSystem)}</td>
              <td className="num">{num(r.observed_mg_l, 2)}</td>
              <td className="num">{num(r.modelled_mg_l, 2)}</td>
              <td className="num">{num(r.residual_mg_l, 2)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function Statistics({ s, n, extra, testId }: { s: { rmse_mg_l: number; bias_mg_l: number; nse: number | null }; n: number; extra: React.ReactNode; testId: string }) {
  return (
    <dl className="grid grid-cols-2 gap-3 text-sm sm:grid-cols-4" data-testid={testId}>
      <div>
        <dt className="text-ink-soft">RMSE</dt>
        <dd className="font-medium">{num(s.rmse_mg_l, 3)} mg/L</dd>
      </div>
      <div>
        <dt className="text-ink-soft">Mean error (modelled − observed)</dt>
        <dd className="font-medium">{num(s.bias_mg_l, 3)} mg/L</dd>
      </div>
      <div>
        <dt className="text-ink-soft">Nash–Sutcliffe efficiency</dt>
        <dd className="font-medium">{num(s.nse, 3)}</dd>
      </div>
      <div>
        <dt className="text-ink-soft">{extra ? "Samples / coefficients" : "Samples"}</dt>
        <dd className="font-medium">
          {n}
          {extra}
        </dd>
      </div>
    </dl>
  );
}

/** The fitted model against a survey it was not fitted to. */
function ValidationBlock({ validation: v, unitSystem }: { validation: NonNullable<CalibrationRecord["validation"]>; unitSystem: UnitSystem }) {
  return (
    <div className="space-y-3 border-t border-rule pt-4" data-testid="calibration-validation">
      <h3>Checked against {v.survey.name}</h3>
      <p className="text-sm text-ink-soft">
        The fitted model, nothing refitted, against the DO of {v.residuals.length} samples of {v.survey.name} (taken {surveyPeriod(v.survey.firstTime, v.survey.lastTime)};{" "}
        {v.survey.fileName}, SHA-256 <span className="font-mono text-xs">{v.survey.sha256.slice(0, 16)}…</span>) on the same condition.
        {v.leftOut.length > 0 ? ` ${v.leftOut.length} samples without DO were left out.` : ""}
      </p>
      <Statistics s={v} n={v.residuals.length} extra={null} testId="validation-statistics" />
      <ResidualTable residuals={v.residuals} unitSystem={unitSystem} testId="validation-residuals" caption="Residuals by sample of the second survey (observed − modelled)" />
    </div>
  );
}

/**
 * A calibration run's report: what was fitted to which survey on which condition, the fitted
 * values with standard errors (from the Jacobian at the optimum) and their correlation, how
 * well the fitted model matches (RMSE, mean error, Nash–Sutcliffe efficiency), the residual of
 * every sample, and warnings where a value sits on a bound or the data cannot tell it.
 */
export function CalibrationReport({ calibration: c, unitSystem }: { calibration: CalibrationRecord; unitSystem: UnitSystem }) {
  const multi = c.parameters.length > 1;
  return (
    <section className="card space-y-4" data-testid="calibration-report">
      <h2>{c.name ? `${c.name}: calibration` : "Calibration"} to {c.survey.name}</h2>
      <p className="text-sm text-ink-soft" data-testid="calibration-provenance">
        Fitted to the DO of {c.residuals.length} samples of the survey {c.survey.name} (taken {surveyPeriod(c.survey.firstTime, c.survey.lastTime)}; {c.survey.fileName}, SHA-256{" "}
        <span className="font-mono text-xs">{c.survey.sha256.slice(0, 16)}…</span>; placed on network version {c.survey.networkVersion}) on the condition &ldquo;{c.condition}&rdquo;, by
        bounded nonlinear least squares (Levenberg–Marquardt), {c.iterations} iterations.
        {c.leftOut.length > 0 ? ` ${c.leftOut.length} samples without DO were left out.` : ""}
      </p>
      {c.warnings.length > 0 && (
        <Notice tone="warning" title="Read the fit with care">
          <ul className="list-disc pl-5" data-testid="calibration-warnings">
            {c.warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </Notice>
      )}
      <div className="overflow-x-auto">
        <table className="data-table" data-testid="calibration-parameters">
          <thead>
            <tr>
              <th>Coefficient</th>
              <th>Reaches</th>
              <th className="num">Fitted</th>
              <th className="num">Standard error</th>
              <th className="num">Range searched</th>
              <th className="num">Start</th>
            </tr>
          </thead>
          <tbody>
            {c.parameters.map((p, i) => (
              <tr key={i}>
                <td>
                  {FIT_PARAMETER_NAMES[p.parameter]}
                  {p.at_bound && <span className="block text-xs text-ochre-700">on its {p.at_bound === "min" ? "lower" : "upper"} bound</span>}
                </td>
                <td className="font-mono text-xs">{p.reaches.length > 6 ? `${p.reaches.length} reaches` : p.reaches.join(", ")}</td>
                <td className="num">{valueText(p.value, p.std_error)}</td>
                <td className="num">{p.std_error === null ? "not identifiable" : `± ${p.std_error.toPrecision(2)}`}</td>
                <td className="num whitespace-nowrap">
                  {c.fit[i].min} – {c.fit[i].max}
                </td>
                <td className="num">{c.fit[i].start}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <Statistics s={c} n={c.residuals.length} extra={<> / {c.parameters.length}</>} testId="calibration-statistics" />
      {multi && (
        <div className="overflow-x-auto">
          <table className="data-table" data-testid="calibration-correlation">
            <caption className="mb-1 text-left text-sm text-ink-soft">Correlation of the estimates</caption>
            <thead>
              <tr>
                <th />
                {c.parameters.map((p, i) => (
                  <th key={i} className="num">
                    {p.parameter}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {c.correlation.map((row, a) => (
                <tr key={a}>
                  <td className="font-mono text-xs">{c.parameters[a].parameter}</td>
                  {row.map((v, b) => (
                    <td key={b} className="num">
                      {num(v, 2)}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      <ObservedModelledChart residuals={c.residuals} />
      <ResidualTable residuals={c.residuals} unitSystem={unitSystem} testId="calibration-residuals" caption="Residuals by sample (observed − modelled)" />
      {c.validation && <ValidationBlock validation={c.validation} unitSystem={unitSystem} />}
      <p className="text-xs text-ink-soft">
        The profile and map below show DO with the fitted values on the condition &ldquo;{c.condition}&rdquo;. A calibration is evidence for a model, not a
        design condition: check it against a second survey before a plan relies on it.
      </p>
    </section>
  );
}
