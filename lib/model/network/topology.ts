import { ModelInputError } from "../errors";
import type { ReachInput } from "../types";

export interface Topology {
  /** Reach indices (into the input array) ordered upstream → downstream. */
  order: number[];
  /** Index of each reach's downstream reach, −1 at an outlet. */
  downstream: number[];
  /** Upstream reach indices of each reach. */
  upstream: number[][];
  /** Reach id → index. */
  index: Map<string, number>;
}

/**
 * Orders a forest of reaches upstream → downstream (Kahn's algorithm).
 * Throws a ModelInputError for a duplicate id, a downstream id that names no reach, a reach
 * that drains into itself, or a cycle (naming the reaches on it).
 * Example: [{id "A", downstream "B"}, {id "B", downstream null}] → order [0, 1].
 */
export function orderReaches(reaches: ReadonlyArray<Pick<ReachInput, "id" | "downstream">>): Topology {
  const index = new Map<string, number>();
  reaches.forEach((r, i) => {
    if (index.has(r.id)) throw new ModelInputError(["reaches", i, "id"], `duplicate reach id "${r.id}"`);
    index.set(r.id, i);
  });
  const n = reaches.length;
  const downstream = new Array<number>(n).fill(-1);
  const upstream: number[][] = Array.from({ length: n }, () => []);
  const pending = new Array<number>(n).fill(0);
  reaches.forEach((r, i) => {
    if (r.downstream === null) return;
    const d = index.get(r.downstream);
    if (d === undefined) throw new ModelInputError(["reaches", i, "downstream"], `no reach has id "${r.downstream}"`);
    if (d === i) throw new ModelInputError(["reaches", i, "downstream"], `reach "${r.id}" cannot drain into itself`);
    downstream[i] = d;
    upstream[d].push(i);
    pending[d]++;
  });
  const order: number[] = [];
  for (let i = 0; i < n; i++) if (pending[i] === 0) order.push(i);
  for (let k = 0; k < order.length; k++) {
    const d = downstream[order[k]];
    if (d >= 0 && --pending[d] === 0) order.push(d);
  }
  if (order.length < n) {
    const onCycle = reaches.filter((_, i) => pending[i] > 0).map((r) => r.id);
    const first = pending.findIndex((p) => p > 0);
    throw new ModelInputError(["reaches", first, "downstream"], `the reaches form a cycle: ${onCycle.join(", ")}`);
  }
  return { order, downstream, upstream, index };
}
