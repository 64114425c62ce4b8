"use client";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useBasinZone } from "@/components/layout/basin-zone";
import { Button } from "@/components/ui/button";
import { formatTime } from "@/lib/format/zoned-time";
import { Notice } from "@/components/ui/notice";
import { nameOf, OBJECTIVE_NAMES, RUN_KIND_NAMES, RUN_STATUS_NAMES } from "@/lib/format/labels";
import {
  useCreateScenarioMutation,
  useDeleteScenarioMutation,
  useDuplicateScenarioMutation,
  useRunsQuery,
  useScenariosQuery,
} from "@/lib/queries/scenarios";
import { useRunOutcomesQuery } from "@/lib/queries/run-outcomes";
import { scenarioInputsSchema } from "@/lib/validation/scenario";
import { RunOutcomeCell } from "./run-outcome-cell";

/** Scenarios of the basin, recent runs, and choosing runs to compare. */
export function ScenarioList({ basinId, canEdit }: { basinId: string; canEdit: boolean }) {
  const router = useRouter();
  const zone = useBasinZone();
  const when = (iso: string) => formatTime(new Date(iso), zone);
  const scenarios = useScenariosQuery(basinId);
  const runs = useRunsQuery(basinId);
  const doneIds = (runs.data ?? []).filter((r) => r.status === "done").map((r) => r.id);
  const outcomes = useRunOutcomesQuery(basinId, doneIds);
  const latestNetwork = outcomes.data?.latestNetworkVersion ?? null;
  const create = useCreateScenarioMutation(basinId);
  const duplicate = useDuplicateScenarioMutation(basinId);
  const remove = useDeleteScenarioMutation(basinId);
  const [name, setName] = useState("");
  const [failure, setFailure] = useState<string | null>(null);
  const [picked, setPicked] = useState<string[]>([]);
  const fail = (e: unknown) => setFailure(e instanceof Error ? e.message : String(e));

  const createNew = async () => {
    setFailure(null);
    try {
      const s = await create.mutateAsync({
        name: name.trim(),
        description: "",
        inputs: scenarioInputsSchema.parse({ conditions: [{ name: "Design low flow (7Q10), summer" }] }),
      });
      router.push(`/basins/${basinId}/scenarios/${s.id}`);
    } catch (e) {
      fail(e);
    }
  };

  return (
    <div className="space-y-6">
      {failure && <Notice tone="error">{failure}</Notice>}
      <section className="card">
        <h2 className="mb-3">Scenarios</h2>
        {scenarios.data?.length === 0 && <p className="text-sm text-ink-soft">No scenarios yet.</p>}
        {scenarios.data && scenarios.data.length > 0 && (
          <div className="overflow-x-auto">
          <table className="data-table" data-testid="scenario-table">
            <thead>
              <tr>
                <th>Scenario</th>
                <th>Network</th>
                <th>Conditions</th>
                <th>Objective</th>
                <th>Last saved</th>
                {canEdit && <th />}
              </tr>
            </thead>
            <tbody>
              {scenarios.data.map((s) => (
                <tr key={s.id}>
                  <td>
                    <Link href={`/basins/${basinId}/scenarios/${s.id}`} className="font-medium">
                      {s.name}
                    </Link>
                  </td>
                  <td>
                    v{s.networkVersion}
                    {latestNetwork !== null && s.networkVersion < latestNetwork && (
                      <span className="block text-xs text-ochre-700">newer: v{latestNetwork}</span>
                    )}
                  </td>
                  <td>{s.inputs.conditions.map((c) => c.name).join("; ")}</td>
                  <td>{nameOf(OBJECTIVE_NAMES, s.inputs.allocation.objective)}</td>
                  <td className="text-xs">
                    {when(s.updatedAt)}
                    {s.updatedBy ? ` · ${s.updatedBy}` : ""}
                  </td>
                  {canEdit && (
                    <td className="whitespace-nowrap">
                      <Button
                        variant="quiet"
                        className="px-2 py-1"
                        onClick={() => duplicate.mutate({ scenarioId: s.id, name: `${s.name} (copy)` }, { onError: fail })}
                      >
                        Duplicate
                      </Button>
                      <Button
                        variant="quiet"
                        className="px-2 py-1"
                        onClick={() => window.confirm(`Delete "${s.name}"?`) && remove.mutate(s.id, { onError: fail })}
                      >
                        Delete
                      </Button>
                    </td>
                  )}
                </tr>
              ))}
            </tbody>
          </table>
          </div>
        )}
        {canEdit && (
          <div className="mt-4 flex items-end gap-3 border-t border-rule pt-4">
            <div className="grow">
              <label htmlFor="new-scenario" className="field-label">
                New scenario on the newest network
              </label>
              <input id="new-scenario" className="field-input" value={name} onChange={(e) => setName(e.target.value)} />
            </div>
            <Button disabled={!name.trim() || create.isPending} onClick={createNew}>
              Create scenario
            </Button>
          </div>
        )}
      </section>

      <section className="card">
        <div className="mb-3 flex items-center justify-between">
          <h2>Runs</h2>
          <Button
            variant="secondary"
            disabled={picked.length < 2}
            onClick={() => router.push(`/basins/${basinId}/compare?runs=${picked.join(",")}`)}
          >
            Compare {picked.length > 1 ? `${picked.length} runs` : "(pick two or more)"}
          </Button>
        </div>
        {runs.data?.length === 0 && <p className="text-sm text-ink-soft">No runs yet: open a scenario and run it.</p>}
        {runs.data && runs.data.length > 0 && (
          <div className="overflow-x-auto">
          <table className="data-table" data-testid="run-table">
            <thead>
              <tr>
                <th>Compare</th>
                <th>Scenario</th>
                <th>Kind</th>
                <th>Status</th>
                <th>Outcome</th>
                <th>Started</th>
                <th />
              </tr>
            </thead>
            <tbody>
              {runs.data.map((r) => (
                <tr key={r.id}>
                  <td>
                    <input
                      type="checkbox"
                      aria-label={`Compare run of ${r.scenarioName} (${nameOf(RUN_KIND_NAMES, r.kind).toLowerCase()}) from ${when(r.createdAt)}`}
                      disabled={r.status !== "done"}
                      checked={picked.includes(r.id)}
                      onChange={(e) => setPicked((p) => (e.target.checked ? [...p, r.id] : p.filter((x) => x !== r.id)))}
                    />
                  </td>
                  <td>
                    {r.scenarioName} <span className="text-xs text-ink-faint">v{r.scenarioVersion}</span>
                  </td>
                  <td>{nameOf(RUN_KIND_NAMES, r.kind)}</td>
                  <td>
                    <span className={r.status === "failed" ? "text-clay-700" : r.status === "done" ? "text-reed-700" : "text-ochre-700"}>
                      {nameOf(RUN_STATUS_NAMES, r.status)}
                      {r.status === "running" ? ` ${Math.round(r.progress * 100)} %` : ""}
                    </span>
                    {r.error && <span className="block text-xs text-clay-700">{r.error}</span>}
                  </td>
                  <td className="text-sm">{r.status === "done" ? <RunOutcomeCell outcome={outcomes.data?.runs[r.id]} /> : null}</td>
                  <td className="text-xs">{when(r.createdAt)}</td>
                  <td>{r.status === "done" && <Link href={`/basins/${basinId}/runs/${r.id}`}>Results</Link>}</td>
                </tr>
              ))}
            </tbody>
          </table>
          </div>
        )}
      </section>
    </div>
  );
}
