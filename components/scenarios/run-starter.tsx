"use client";
import { nameOf, RUN_KIND_NAMES, RUN_STATUS_NAMES } from "@/lib/format/labels";
import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { useRunQuery, type useStartRunMutation } from "@/lib/queries/scenarios";

/** Start a model or allocation run of the saved scenario and follow it to its result. */
export function RunStarter({
  basinId,
  scenarioId,
  dirty,
  start,
}: {
  basinId: string;
  scenarioId: string;
  dirty: boolean;
  start: ReturnType<typeof useStartRunMutation>;
}) {
  const [runId, setRunId] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const go = async (kind: "model" | "allocation") => {
    setFailure(null);
    try {
      const run = await start.mutateAsync({ scenarioId, kind });
      setRunId(run.id);
    } catch (e) {
      setFailure(e instanceof Error ? e.message : String(e));
    }
  };
  return (
    <section className="card space-y-3" aria-label="Runs">
      <h2>Run</h2>
      {dirty && <Notice tone="warning">Save your changes first: runs use the saved scenario.</Notice>}
      <div className="flex flex-wrap gap-3">
        <Button variant="secondary" disabled={dirty || start.isPending} onClick={() => go("model")}>
          Run the model on today&apos;s loads
        </Button>
        <Button disabled={dirty || start.isPending} onClick={() => go("allocation")}>
          Run the allocation
        </Button>
      </div>
      {failure && <Notice tone="error">{failure}</Notice>}
      {runId && <RunProgress basinId={basinId} runId={runId} />}
    </section>
  );
}

function RunProgress({ basinId, runId }: { basinId: string; runId: string }) {
  const { data } = useRunQuery(basinId, runId);
  if (!data) return <p className="text-sm text-ink-faint">Queued…</p>;
  return (
    <div className="space-y-2" data-testid="run-progress" data-status={data.status}>
      <div className="h-2 w-full overflow-hidden rounded bg-paper-sunk">
        <div
          className={`h-full transition-all ${data.status === "failed" ? "bg-clay-500" : "bg-tarn-500"}`}
          style={{ width: `${Math.round((data.status === "done" ? 1 : data.progress) * 100)}%` }}
        />
      </div>
      <p className="text-sm">
        {nameOf(RUN_KIND_NAMES, data.kind)}: <strong>{nameOf(RUN_STATUS_NAMES, data.status).toLowerCase()}</strong>
        {data.status === "done" && (
          <>
            {" "}
            — <Link href={`/basins/${basinId}/runs/${runId}`}>see the results</Link>
          </>
        )}
      </p>
      {data.status === "failed" && <Notice tone="error" title="The run failed">{data.error}</Notice>}
    </div>
  );
}
