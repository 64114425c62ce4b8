import type { ImportStage } from "./import-protocol";

/** Where one validation has got to, for the import wizard's progress bar. */
export interface ImportProgress {
  basinId: string;
  userId: string;
  stage: ImportStage | "queued" | "done" | "failed";
  /** 0–100, over the whole job. */
  percent: number;
  updatedAt: number;
}

// Rough share of the whole job each stage takes, measured on large uploads (reading and
// checking lines dominate).
const SPAN: Record<ImportStage, [number, number]> = {
  "reading reaches": [0, 35],
  "reading dischargers": [35, 45],
  "checking lines": [45, 75],
  "building the network": [75, 85],
  "placing dischargers": [85, 95],
  "writing the report": [95, 99],
};

const KEEP_MS = 10 * 60_000;
const holder = globalThis as typeof globalThis & { __saglineImportProgress?: Map<string, ImportProgress> };
const table = () => (holder.__saglineImportProgress ??= new Map());

/**
 * Progress is kept in this process's memory for ten minutes: the validation runs in this
 * process's worker threads and the wizard polls the same server while it waits.
 */
export function setProgress(key: string, basinId: string, userId: string, stage: ImportProgress["stage"], fraction = 0): void {
  const now = Date.now();
  for (const [k, p] of table()) if (now - p.updatedAt > KEEP_MS) table().delete(k);
  const percent = stage === "done" || stage === "failed" ? 100 : stage === "queued" ? 0 : SPAN[stage][0] + (SPAN[stage][1] - SPAN[stage][0]) * Math.min(1, Math.max(0, fraction));
  table().set(key, { basinId, userId, stage, percent: Math.round(percent), updatedAt: now });
}

export function getProgress(key: string): ImportProgress | undefined {
  return table().get(key);
}
