"use client";
import { useCallback, useRef, useState } from "react";
import { apiFetch } from "@/lib/queries/fetcher";
import type { DraftResultDto } from "@/lib/queries/networks";
import type { NetworkDraft } from "@/lib/validation/network";

export interface ValidationProgress {
  stage: string;
  percent: number;
}

/**
 * Validates a draft and follows its progress: the POST names a fresh progress id and, while
 * it is pending, the stage and percentage are polled every half second (the validation of a
 * large upload runs for tens of seconds in the server's import worker).
 */
export function useValidation(basinId: string) {
  const [pending, setPending] = useState(false);
  const [progress, setProgress] = useState<ValidationProgress | null>(null);
  const running = useRef(0);

  const run = useCallback(
    async (draft: NetworkDraft): Promise<DraftResultDto> => {
      const id = crypto.randomUUID();
      const token = ++running.current;
      setPending(true);
      setProgress({ stage: "queued", percent: 0 });
      const timer = setInterval(() => {
        apiFetch<ValidationProgress>(`/api/basins/${basinId}/networks/validate/${id}`)
          .then((p) => {
            if (running.current === token) setProgress(p);
          })
          .catch(() => undefined); // not started yet, or finished: the POST tells the outcome
      }, 500);
      try {
        return await apiFetch<DraftResultDto>(`/api/basins/${basinId}/networks/validate?progress=${id}`, { method: "POST", json: draft });
      } finally {
        clearInterval(timer);
        if (running.current === token) {
          setPending(false);
          setProgress(null);
        }
      }
    },
    [basinId],
  );

  return { run, pending, progress };
}
