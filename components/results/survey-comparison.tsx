"use client";
import type { FeatureCollection } from "geojson";
import { useEffect, useId, useMemo, useState, type ComponentProps } from "react";
import { SortableTable } from "@/components/tables/sortable-table";
import { Notice } from "@/components/ui/notice";
import type { UnitSystem } from "@/lib/domain";
import { formatIn, formatNumber, unitLabel } from "@/lib/format/quantities";
import { useSurveyQuery, useSurveysQuery } from "@/lib/queries/surveys";
import { quoted } from "@/lib/results/run-conditions";
import { surveyResiduals, type FitStatistics, type ResidualRow } from "@/lib/results/survey-residuals";
import type { SurveySummaryDto } from "@/lib/services/surveys";
import { column, DoCell } from "./columns";
import { ProfileSection } from "./profile-section";

type ProfileProps = Omit<ComponentProps<typeof ProfileSection>, "observed">;

/** The survey's first and last dates, as written in its file (its times are wall-clock without a zone, so they are not converted). */
function dateRange(s: Pick<SurveySummaryDto, "firstTime" | "lastTime">): string {
  const first = s.firstTime?.slice(0, 10);
  const last = s.lastTime?.slice(0, 10);
  if (!first || !last) return "no dates";
  return first === last ? first : `${first} to ${last}`;
}

const surveyLabel = (s: SurveySummaryDto) => `${s.name} — ${dateRange(s)} — network v${s.networkVersion}`;

/** A residual with its sign: "+0.25", "-0.40", and "0.00" unsigned. */
function signed(x: number): string {
  const t = formatNumber("do", x);
  return x > 0 && Number(t) !== 0 ? `+${t}` : t;
}

function statisticsText(s: FitStatistics): string {
  if (s.n === 0) return "No sample lies on this run's network: no statistics.";
  return [
    `n = ${s.n}`,
    `RMSE ${formatNumber("do", s.rmse_mg_l)} mg/L`,
    `bias ${s.bias_mg_l === null ? "—" : signed(s.bias_mg_l)} mg/L (mean of modelled − observed)`,
    `NSE ${s.nse === null ? "— (needs 2 or more samples that differ)" : formatNumber("ratio", s.nse)}`,
  ].join(" · ");
}

type Row = ResidualRow & { key: string };

/**
 * The DO profile card with a survey to compare with: the planner picks one of the basin's
 * synoptic surveys (none by default), its samples are drawn on the chart beside the
 * modelled line of the condition shown, and a table below gives each sample's observed and
 * modelled DO and residual, with RMSE, bias and NSE. Surveys are asked for only when this
 * is rendered: the run page renders it for readers who may read surveys (scenario.read).
 */
export function SurveyComparison({
  basinId,
  runNetwork,
  condition,
  profile,
  onObserved,
}: {
  basinId: string;
  /** The network version the run used. */
  runNetwork: { id: string; version: number };
  /** The condition whose DO the profile shows. */
  condition: string;
  profile: ProfileProps;
  /** Hears the chosen survey's samples as map points (null when none is chosen), for the DO map. */
  onObserved?: (points: FeatureCollection | null) => void;
}) {
  const selectId = useId();
  const [surveyId, setSurveyId] = useState<string | null>(null);
  const surveys = useSurveysQuery(basinId);
  const survey = useSurveyQuery(basinId, surveyId);
  const chosen = surveyId !== null && survey.data?.id === surveyId ? survey.data : null;
  const compared = useMemo(() => (chosen ? surveyResiduals(profile.run, chosen.samples) : null), [chosen, profile.run]);
  const observed = useMemo(() => (chosen && compared ? { label: chosen.name, rows: compared.rows } : undefined), [chosen, compared]);
  const list = surveys.data ?? [];
  // the samples with DO, in the order surveyResiduals lists them, placed where they were snapped (or given by coordinates)
  const points = useMemo<FeatureCollection | null>(() => {
    if (!chosen || !compared) return null;
    const withDo = chosen.samples.filter((x) => x.do_mg_l !== null && Number.isFinite(x.do_mg_l));
    return {
      type: "FeatureCollection",
      features: withDo.flatMap((x, i) => {
        const at = x.snapped ?? x.position;
        const row = compared.rows[i];
        if (!at || !row) return [];
        return [
          {
            type: "Feature" as const,
            geometry: { type: "Point" as const, coordinates: at },
            properties: { kind: "observed", station: x.station, reach: x.reach, km: x.km, observed: row.observed_mg_l, modelled: row.modelled_mg_l, residual: row.residual_mg_l },
          },
        ];
      }),
    };
  }, [chosen, compared]);
  useEffect(() => onObserved?.(points), [points, onObserved]);

  return (
    <>
      <ProfileSection {...profile} observed={observed}>
        {profile.children}
        <div className="flex flex-wrap items-end gap-3">
          <div className="min-w-0 max-w-full">
            <label htmlFor={selectId} className="field-label">
              Compare with a survey
            </label>
            <select
              id={selectId}
              className="field-input max-w-full"
              value={surveyId ?? ""}
              disabled={surveys.isPending || list.length === 0}
              onChange={(e) => setSurveyId(e.target.value === "" ? null : e.target.value)}
            >
              <option value="">{surveys.isPending ? "Reading the basin's surveys…" : "None"}</option>
              {list.map((s) => (
                <option key={s.id} value={s.id}>
                  {surveyLabel(s)}
                </option>
              ))}
            </select>
          </div>
          {surveys.isError && <p className="text-sm text-clay-700">The basin&apos;s surveys could not be read.</p>}
          {surveys.isSuccess && list.length === 0 && <p className="text-sm text-ink-soft">No survey has been uploaded to this basin yet.</p>}
          {surveyId !== null && survey.isPending && <p className="text-sm text-ink-soft">Reading the survey…</p>}
          {surveyId !== null && survey.isError && <p className="text-sm text-clay-700">The survey could not be read.</p>}
        </div>
      </ProfileSection>
      {chosen && compared && (
        <section className="card space-y-3" data-testid="survey-residuals">
          <h2>
            {quoted(chosen.name)} against the run under {quoted(condition)}
          </h2>
          {chosen.networkId !== runNetwork.id && (
            <Notice tone="warning" title="Different network versions">
              <span data-testid="survey-network-mismatch">
                The survey&apos;s stations were placed on network version {chosen.networkVersion}; this run used version {runNetwork.version}. A
                reach that was added, removed or changed in length between them can put a station in the wrong place.
              </span>
            </Notice>
          )}
          <p className="text-sm font-semibold tabular-nums" data-testid="survey-statistics">
            {statisticsText(compared.statistics)}
          </p>
          <p className="text-sm text-ink-soft">
            Residual = observed − modelled. The survey is one day&apos;s river; the run is under {quoted(condition)}, so the residuals show how far
            that day was from this run as well as any error in the model. Fitting rate coefficients to a survey is a calibration, which this
            comparison is not.
          </p>
          <ResidualsTable rows={compared.rows} unitSystem={profile.unitSystem} criterion={profile.run.criterion_do_mg_l} />
          {compared.withoutDo > 0 && (
            <p className="text-sm text-ink-soft">
              {compared.withoutDo} {compared.withoutDo === 1 ? "sample has" : "samples have"} no DO value and {compared.withoutDo === 1 ? "is" : "are"} not listed.
            </p>
          )}
        </section>
      )}
    </>
  );
}

function ResidualsTable({ rows, unitSystem, criterion }: { rows: readonly ResidualRow[]; unitSystem: UnitSystem; criterion: number }) {
  const keyed = useMemo<Row[]>(() => rows.map((r, i) => ({ ...r, key: String(i) })), [rows]);
  const len = unitLabel("length", unitSystem);
  const columns = useMemo(
    () => [
      column<Row>("station", "Station", (r) => r.station),
      column<Row>("reach", "Reach", (r) => r.reach),
      column<Row>("km", `At (${len} from reach head)`, (r) => r.km, { numeric: true, show: (r) => formatIn("length", r.km, unitSystem) }),
      column<Row>("time", "Time", (r) => r.time, { show: (r) => <span className="whitespace-nowrap">{r.time ? r.time.replace("T", " ") : "—"}</span> }),
      column<Row>("observed", "Observed (mg/L)", (r) => r.observed_mg_l, { numeric: true, show: (r) => <DoCell value={r.observed_mg_l} criterion={criterion} /> }),
      column<Row>("modelled", "Modelled (mg/L)", (r) => r.modelled_mg_l, {
        numeric: true,
        show: (r) =>
          r.onNetwork ? (
            <DoCell value={r.modelled_mg_l} criterion={criterion} />
          ) : (
            <span className="text-ink-soft" title={r.why === "reach" ? "The run has no such reach" : "Past the reach's length in the run"}>
              not on this run&apos;s network
            </span>
          ),
      }),
      column<Row>("residual", "Residual (mg/L)", (r) => r.residual_mg_l, { numeric: true, show: (r) => (r.residual_mg_l === null ? "—" : signed(r.residual_mg_l)) }),
    ],
    [len, unitSystem, criterion],
  );
  return <SortableTable rows={keyed} columns={columns} rowId={(r) => r.key} testId="survey-residuals-table" />;
}
