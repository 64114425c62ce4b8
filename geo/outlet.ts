/** Reaches as edges between node indexes; `adjacency[n]` lists the edges touching node n. */
export interface Graph {
  from: Int32Array;
  to: Int32Array;
  adjacency: number[][];
}

/** What the outlet rule knows of one line: its name, its mapped downstream id, and how it was drawn. */
export interface OutletLine {
  name: string;
  downstreamName?: string;
  /** Length of the line, km. */
  lengthKm: number;
  /**
   * Of that length, the km drawn against the line's own direction (from→to): parts of a
   * multi-part feature pointing the other way. 0 for a simple line.
   */
  againstKm?: number;
}

/** How the suggested outlet was found, and how sure that is. */
export type OutletBasis =
  /** The one reach a mapped downstream-id field marks as last. */
  | { kind: "field" }
  /** The line directions: the free end that turns the least length of line. */
  | {
      kind: "directions";
      /** Km of line that this outlet turns round. */
      turnedKm: number;
      /** Km of line in the part. */
      totalKm: number;
      /** The next-best free end and the km it would turn (none for a part with one free end). */
      runnerUp?: { node: number; turnedKm: number };
      /** Whether the evidence is too weak to use without the planner's confirmation. */
      weak: boolean;
    };

export interface OutletSuggestion {
  node: number;
  basis: OutletBasis;
}

/**
 * When the directions decide weakly. For each other free end, the km of line between it and
 * the best one, and how much more the other end would turn: the lines on that path all drawn
 * toward the best end make the difference the whole path, drawn half each way make it none.
 * The evidence is weak when for some free end the difference is under WEAK_PATH_SHARE of the
 * path (less than two thirds of it drawn toward the best end), or when the best end still turns
 * more than WEAK_TURNED_SHARE of the part (lines drawn every which way). Measured against the
 * path, not the whole network, so a big network drawn downstream never counts as weak because a
 * headwater lies near its mouth, and one mis-drawn tributary does not either.
 */
export const WEAK_PATH_SHARE = 1 / 3;
export const WEAK_TURNED_SHARE = 0.25;

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
 * of the one reach with no (known) downstream reach. Otherwise the line directions, on the
 * convention that reaches are digitised downstream: the free end whose choice turns round the
 * least total *length* of line (a part of a multi-part feature counts with its own
 * direction), so a short tributary drawn the wrong way cannot outvote a long main stem drawn
 * the right way. Ties go to the lowest node number. The basis says how clear the choice was.
 * `order` is a breadth-first visit of the part and `parentEdge` its spanning tree.
 */
export function suggestOutlet(g: Graph, order: readonly number[], parentEdge: Int32Array, lines: ReadonlyArray<OutletLine>): OutletSuggestion {
  const edges = [...new Set(order.flatMap((v) => g.adjacency[v]))];
  if (edges.some((e) => lines[e].downstreamName !== undefined)) {
    const names = new Set(lines.map((l) => l.name));
    const hit = outletFromField(g, edges, lines.map((l) => l.downstreamName), names);
    if (hit !== undefined) return { node: hit, basis: { kind: "field" } };
  }
  // Km turned for each node as outlet, by re-rooting the spanning tree: moving the outlet
  // across one tree edge reverses only that edge's downstream direction.
  const against = (e: number) => Math.min(lines[e].againstKm ?? 0, lines[e].lengthKm);
  const along = (e: number) => lines[e].lengthKm - against(e);
  /** Km of edge e turned when it must flow from node `up` toward node `down`. */
  const turned = (e: number, down: number) => (g.to[e] === down && g.from[e] !== down ? against(e) : along(e));
  const cost = new Map<number, number>();
  let base = 0;
  for (const v of order.slice(1)) base += turned(parentEdge[v], other(g, parentEdge[v], v));
  cost.set(order[0], base);
  for (const v of order.slice(1)) {
    const e = parentEdge[v];
    const p = other(g, e, v);
    // rooted at p, e flows v → p; rooted at v, it flows p → v
    cost.set(v, (cost.get(p) as number) - turned(e, p) + turned(e, v));
  }
  const leaves = order.filter((v) => g.adjacency[v].length === 1);
  const candidates = leaves.length > 0 ? leaves : [...order];
  const best = candidates.reduce((b, v) => {
    const [cv, cb] = [cost.get(v) as number, cost.get(b) as number];
    return cv < cb || (cv === cb && v < b) ? v : b;
  });
  const turnedKm = cost.get(best) as number;
  const totalKm = edges.reduce((s, e) => s + lines[e].lengthKm, 0);
  // km along the spanning tree from the best end to every node
  const treeEdges = new Set(order.slice(1).map((v) => parentEdge[v]));
  const pathKm = new Map<number, number>([[best, 0]]);
  for (let queue = [best]; queue.length > 0; ) {
    const next: number[] = [];
    for (const u of queue) {
      for (const e of g.adjacency[u]) {
        const v = other(g, e, u);
        if (!treeEdges.has(e) || pathKm.has(v)) continue;
        pathKm.set(v, (pathKm.get(u) as number) + lines[e].lengthKm);
        next.push(v);
      }
    }
    queue = next;
  }
  // the most competitive other end: the least extra turning per km of line between the two
  let runnerUp: { node: number; turnedKm: number } | undefined;
  let least = Infinity;
  for (const v of candidates) {
    const km = pathKm.get(v) ?? 0;
    if (v === best || km <= 0) continue;
    const share = ((cost.get(v) as number) - turnedKm) / km;
    if (share < least) [least, runnerUp] = [share, { node: v, turnedKm: cost.get(v) as number }];
  }
  const weak = totalKm > 0 && (turnedKm > WEAK_TURNED_SHARE * totalKm || least < WEAK_PATH_SHARE);
  return { node: best, basis: { kind: "directions", turnedKm, totalKm, runnerUp, weak } };
}
