import type { QueryClient } from "@tanstack/react-query";
import type { KeyTarget } from "./keys";

/** Invalidate each target (see `invalidations` in keys.ts); resolves when the active ones have refetched. */
export const invalidate = (qc: QueryClient, targets: readonly KeyTarget[]) =>
  Promise.all(targets.map((t) => qc.invalidateQueries({ queryKey: t.queryKey, exact: t.exact })));
