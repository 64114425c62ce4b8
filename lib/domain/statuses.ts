/** What a run computes (runs.kind). */
export const RUN_KINDS = ["model", "allocation", "calibration"] as const;
export type RunKind = (typeof RUN_KINDS)[number];

/** Where a run is (runs.status). */
export const RUN_STATUSES = ["queued", "running", "done", "failed"] as const;
export type RunStatus = (typeof RUN_STATUSES)[number];

/** A plan's stored status (plans.status; the stage a reader sees is planStage() in lib/plans/review-rules). */
export const PLAN_STATUSES = ["draft", "review", "closed", "published", "withdrawn"] as const;
export type PlanStatus = (typeof PLAN_STATUSES)[number];

export const RUN_KIND_NAMES: Readonly<Record<RunKind, string>> = {
  model: "Model run on today's loads",
  allocation: "Allocation run",
  calibration: "Calibration to a survey",
};

export const RUN_STATUS_NAMES: Readonly<Record<RunStatus, string>> = {
  queued: "Waiting to start",
  running: "Running",
  done: "Finished",
  failed: "Failed",
};

export const PLAN_STATUS_NAMES: Readonly<Record<PlanStatus, string>> = {
  draft: "Draft",
  review: "In review",
  closed: "Review closed",
  published: "Published",
  withdrawn: "Withdrawn",
};

/** A comment thread on a plan (comment_threads.status). */
export const THREAD_STATUSES = ["open", "addressed"] as const;
export type ThreadStatus = (typeof THREAD_STATUSES)[number];

export const THREAD_STATUS_NAMES: Readonly<Record<ThreadStatus, string>> = {
  open: "Awaiting a response",
  addressed: "Answered",
};
