/** Reaches as edges between node indexes; `adjacency[n]` lists the edges touching node n. */
export interface Graph {
  from: Int32Array;
  to: Int32Array;
  adjacency: number[][];
}

const other = (g: Graph, e: number, n: number) => (g.from[e] === n ? g.to[e] : g.from[e]);

/** The free end of the single reach a mapped downstream-id field marks as last, if exactly one. */
function outletFromField(g: Graph, edges: number[], downstream: ReadonlyArray<string | undefined>, names: ReadonlySet<string>) {
  const last = edges.filter((e) => downstream[e] === undefined || !names.has(downstream[e] as string));
  if (last.length !== 1) return undefined;
  const e = last[0];
  return [g.to[e], g.from[e]].find((n) => g.adjacency[n].length === 1);
}

/**
 * Suggests the outlet of one connected part. With a mapped downstream-id field, the free end
 * of the one reach with no (known) downstream reach. Otherwise, geometry alone: the free end
 * (headwater-like node) for which the most lines are already drawn toward it, on the
 * convention that reaches are digitised downstream; ties go to the lowest node number.
 * `order` is a breadth-first visit of the part and `parentEdge` its spanning tree.
 */
export function suggestOutlet(
  g: Graph,
  order: readonly number[],
  parentEdge: Int32Array,
  lines: ReadonlyArray<{ name: string; downstreamName?: string }>,
): number {
  const edges = [...new Set(order.flatMap((v) => g.adjacency[v]))];
  if (edges.some((e) => lines[e].downstreamName !== undefined)) {
    const names = new Set(lines.map((l) => l.name));
    const hit = outletFromField(g, edges, lines.map((l) => l.downstreamName), names);
    if (hit !== undefined) return hit;
  }
  // Agreement of each node as root, by re-rooting: moving the root across one tree edge
  // flips only that edge's direction.
  const agreement = new Map<number, number>();
  const drawnTowardParent = (v: number) => g.from[parentEdge[v]] === v && g.to[parentEdge[v]] !== v;
  let base = 0;
  for (const v of order.slice(1)) if (drawnTowardParent(v)) base++;
  agreement.set(order[0], base);
  for (const v of order.slice(1)) {
    const p = other(g, parentEdge[v], v);
    const m = drawnTowardParent(v) ? 1 : 0;
    agreement.set(v, (agreement.get(p) as number) - m + (1 - m));
  }
  const leaves = order.filter((v) => g.adjacency[v].length === 1);
  const candidates = leaves.length > 0 ? leaves : [...order];
  return candidates.reduce((best, v) => {
    const a = agreement.get(v) as number;
    const b = agreement.get(best) as number;
    return a > b || (a === b && v < best) ? v : best;
  });
}
