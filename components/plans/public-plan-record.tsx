import type { UnitSystem } from "@/db/schema";
import { conditionFlowText } from "@/lib/results/condition-flow";
import { nameOf, ROLE_NAMES, THREAD_STATUS_NAMES } from "@/lib/format/labels";
import { formatIn, formatNumber, unitLabel } from "@/lib/format/quantities";
import { formatWhen } from "@/lib/format/zoned-time";
import type { RunResult } from "@/lib/model";
import { formatDo } from "@/lib/results/do-scale";
import type { ResponsivenessRow } from "@/lib/results/responsiveness";
import { conditionRows, type StoredRunResult } from "@/lib/results/run-conditions";
import type { ConditionInputs } from "@/lib/validation/scenario";

/** The largest flow any segment of a condition's run carries: the flow at the outlet (flow only grows downstream). */
const outletFlow = (run: RunResult) => Math.max(...run.reaches.flatMap((r) => r.segments.map((s) => s.flow_m3_s)));
const temperatures = (run: RunResult) => {
  const all = run.reaches.flatMap((r) => r.segments.map((s) => s.temperature_c));
  return { low: Math.min(...all), high: Math.max(...all) };
};

/**
 * The critical (design) conditions the plan was computed at, one row each: what the
 * scenario set (design-flow scale, reach flows set by hand, temperature), the flow and
 * temperatures the run used, and the lowest DO with the allocated loads — the governing
 * condition marked.
 */
export function CriticalConditions({ inputs, result, unitSystem }: { inputs: ConditionInputs[]; result: StoredRunResult; unitSystem: UnitSystem }) {
  const rows = conditionRows(result);
  const flow = unitLabel("flow", unitSystem);
  const temp = unitLabel("temperature", unitSystem);
  const t = (c: number) => `${formatIn("temperature", c, unitSystem)} ${temp}`;
  return (
    <div className="overflow-x-auto">
      <table className="data-table" data-testid="critical-conditions">
        <thead>
          <tr>
            <th>Condition</th>
            <th>Design flow</th>
            <th>Temperature</th>
            <th className="num">Flow at the outlet ({flow})</th>
            <th className="num">Lowest DO (mg/L)</th>
            <th>Where</th>
            <th>Criterion</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((row, i) => {
            const input = inputs.find((c) => c.name === row.name);
            const run = result.conditions[i].run;
            const temps = temperatures(run);
            const handSet = Object.keys(input?.reachFlowsM3s ?? {}).length;
            return (
              <tr key={row.name} data-governing={row.governing || undefined}>
                <td>
                  <span className="font-semibold">{row.name}</span>
                  {row.governing && <span className="ml-2 rounded bg-ochre-100 px-1.5 py-0.5 text-xs font-semibold text-ink">governing</span>}
                </td>
                <td>
                  {input ? conditionFlowText(input, unitSystem) : "—"}
                  {handSet > 0 && `; ${handSet} reach flow${handSet === 1 ? "" : "s"} set by hand`}
                </td>
                <td>
                  {input?.temperatureC != null
                    ? `${t(input.temperatureC)} in every reach`
                    : Math.abs(temps.high - temps.low) < 0.05
                      ? t(temps.low)
                      : `each reach's own (${t(temps.low)} to ${t(temps.high)})`}
                </td>
                <td className="num">{formatIn("flow", outletFlow(run), unitSystem)}</td>
                <td className="num">{formatDo(row.minimum.do_mg_l)}</td>
                <td>
                  reach {row.minimum.reach}, {formatIn("length", row.minimum.km, unitSystem)} {unitLabel("length", unitSystem)} from its head
                </td>
                <td>{row.meets ? `met (${formatNumber("do", row.criterion_do_mg_l)} mg/L)` : `not met (${formatNumber("do", row.criterion_do_mg_l)} mg/L)`}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

/** Labelled groups of what the plan used (the PDF's methods: model, kinetics and reaeration, headwaters, allocation with MOS and reserve). */
export function MethodGroups({ groups }: { groups: Array<{ heading: string; items: Array<{ label: string; value: string }> }> }) {
  return (
    <div className="grid gap-4 md:grid-cols-2" data-testid="plan-methods">
      {groups.map((g) => (
        <section key={g.heading} aria-label={g.heading} className="card">
          <h3 className="mb-2 font-semibold">{g.heading}</h3>
          <dl className="grid grid-cols-[minmax(8rem,auto)_1fr] gap-x-4 gap-y-1 text-sm">
            {g.items.map((item) => (
              <div key={item.label} className="contents">
                <dt className="text-ink-soft">{item.label}</dt>
                <dd className="break-words">{item.value}</dd>
              </div>
            ))}
          </dl>
        </section>
      ))}
    </div>
  );
}

/**
 * The comments received in review and the responses to them, topic by topic (the plan as a
 * whole first), each comment with its author, role and time in the review's time zone.
 */
export function ResponsivenessRecord({
  rows,
  timeZone,
  respondedAt = {},
  acknowledgement = null,
}: {
  rows: ResponsivenessRow[];
  timeZone: string;
  /** The lead's acknowledgement of threads published without a response (acknowledgementSummary), or null. */
  acknowledgement?: string | null;
  /** When each topic's thread was answered (ISO), by topic. */
  respondedAt?: Record<string, string | null>;
}) {
  if (rows.length === 0) return <p className="text-sm text-ink-soft">No comments were received during the review.</p>;
  const topics = [...new Set(rows.map((r) => r.topic))];
  return (
    <div className="space-y-4" data-testid="responsiveness">
      {acknowledgement && (
        <p className="rounded-md border-l-4 border-ochre-500 bg-ochre-100 p-3 text-sm" data-testid="publication-acknowledgement">
          {acknowledgement}
        </p>
      )}
      {topics.map((topic) => {
        const of = rows.filter((r) => r.topic === topic);
        const responses = [...new Set(of.map((r) => r.response).filter(Boolean))];
        const responder = of.find((r) => r.responder)?.responder;
        return (
          <article key={topic} aria-label={`Comments on ${topic}`} className="rounded-md border border-rule p-3">
            <h3 className="mb-2 font-semibold">
              {topic} {of[0].permitId && <span className="font-mono text-sm text-ink-soft">{of[0].permitId}</span>}
              <span className="ml-2 text-xs font-normal text-ink-faint">{nameOf(THREAD_STATUS_NAMES, of[0].status)}</span>
            </h3>
            <ul className="space-y-2">
              {of.map((r, i) => (
                <li key={`${r.at}-${i}`} className="text-sm">
                  <p className="text-xs text-ink-faint">
                    {r.author} · {nameOf(ROLE_NAMES, r.role)} · {formatWhen(new Date(r.at), timeZone)}
                  </p>
                  <p className="whitespace-pre-wrap">{r.comment}</p>
                </li>
              ))}
            </ul>
            <div className="mt-2 border-l-4 border-tarn-600 pl-3 text-sm" data-testid="response">
              {responses.length ? (
                <>
                  <p className="text-xs text-ink-faint">
                    Response{responder ? ` by ${responder}` : ""}
                    {respondedAt[topic] ? ` · ${formatWhen(new Date(respondedAt[topic]!), timeZone)}` : ""}
                  </p>
                  {responses.map((text) => (
                    <p key={text} className="whitespace-pre-wrap">
                      {text}
                    </p>
                  ))}
                </>
              ) : (
                <p className="text-ink-soft">No response was recorded.</p>
              )}
            </div>
          </article>
        );
      })}
    </div>
  );
}
