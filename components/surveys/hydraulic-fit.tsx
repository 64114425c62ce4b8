"use client";
import { useMutation } from "@tanstack/react-query";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { apiFetch, ApiError } from "@/lib/queries/fetcher";
import type { HydraulicFitDto } from "@/lib/services/hydraulic-fit";

/**
 * For each reach where this survey measured flow, velocity and depth together at two or more
 * flows: fit its hydraulic geometry (U = a·Q^b, H = c·Q^f) and write it on the reach of the
 * newest network, so its velocity and depth follow each condition's flow.
 */
export function HydraulicFit({ basinId, surveyId, network, reaches }: { basinId: string; surveyId: string; network: { id: string; version: number }; reaches: { id: string; count: number }[] }) {
  const [done, setDone] = useState<Record<string, HydraulicFitDto>>({});
  const [problem, setProblem] = useState<string | null>(null);
  const fit = useMutation({
    mutationFn: (reachId: string) =>
      apiFetch<HydraulicFitDto>(`/api/basins/${basinId}/networks/${network.id}/reaches/${encodeURIComponent(reachId)}/hydraulic-geometry`, { method: "POST", json: { surveyIds: [surveyId] } }),
    onSuccess: (r) => setDone((d) => ({ ...d, [r.reachId]: r })),
    onError: (e) => setProblem(e instanceof ApiError ? e.message : String(e)),
  });
  if (reaches.length === 0) return null;
  return (
    <section className="card space-y-3" data-testid="hydraulic-fit">
      <h2>Hydraulic geometry from these measurements</h2>
      <p className="text-sm text-ink-soft">
        Where the survey measured flow, mean velocity and mean depth together at two or more flows, the reach&apos;s U = a·Q^b and H = c·Q^f can be fitted
        (least squares on log–log axes) and written on the reach of network version {network.version}, replacing a Manning channel there.
      </p>
      <ul className="space-y-2">
        {reaches.map((r) => {
          const f = done[r.id];
          return (
            <li key={r.id} className="flex flex-wrap items-center gap-3 text-sm">
              <span className="font-mono">{r.id}</span>
              <span className="text-ink-soft">{r.count} measurements</span>
              {f ? (
                <span data-testid={`hydraulic-fit-${r.id}`}>
                  U = {f.geometry.a.toPrecision(4)}·Q^{f.geometry.b.toPrecision(3)} (r² {f.velocity.r2.toFixed(3)}), H = {f.geometry.c.toPrecision(4)}·Q^{f.geometry.f.toPrecision(3)} (r²{" "}
                  {f.depth.r2.toFixed(3)}) — saved on the reach
                </span>
              ) : (
                <Button variant="secondary" disabled={fit.isPending} onClick={() => fit.mutate(r.id)}>
                  Fit and use on {r.id}
                </Button>
              )}
            </li>
          );
        })}
      </ul>
      {problem && <Notice tone="error">{problem}</Notice>}
    </section>
  );
}
