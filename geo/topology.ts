import { IMPORT_DEFAULTS } from "@/lib/domain";
import { distance, lengthToDegrees, nearestPointOnLine } from "@turf/turf";
import { lineLengthKm } from "./geodesic";
import { BoxGrid } from "./box-grid";
import type { LineString, MultiLineString } from "geojson";
import { PointGrid } from "./point-grid";
import { appendAll, error, nameList, warning, type Problem } from "./problems";
import type { LngLat } from "./types";
import { UnionFind } from "./union-find";
import { suggestOutlet, WEAK_TURNED_SHARE, type Graph, type OutletBasis } from "./outlet";

/** One usable reach line going into the topology. */
export interface TopologyLine {
  /** How messages name the reach: its id, or its file position when the id is missing. */
  name: string;
  coordinates: LngLat[];
  /** Mapped downstream reach id, when the file has one; used to suggest the outlet. */
  downstreamName?: string;
  /** Length of the line, km (weighs its direction when the outlet is suggested); measured here when not given. */
  lengthKm?: number;
  /** Km of the line drawn against its own direction (parts of a multi-part feature); default 0. */
  againstKm?: number;
}

/** The planner's outlet: a node by id, or the free end of a reach by reach id. */
export type OutletChoice = { nodeId: string } | { reachId: string };

export interface TopologyOptions {
  /** Line ends closer than this (m) are joined into one node. Default IMPORT_DEFAULTS (5 m). */
  toleranceM?: number;
  /** Unjoined ends closer than this (m) are reported as gaps. Default max(50 m, 10 × tolerance). */
  gapSearchM?: number;
  /** The planner's outlet choice (one per separate part); otherwise the suggestion is used. */
  outlets?: OutletChoice[];
  /** Whether separate parts (several outlets) are a warning rather than an error. Default false. */
  allowMultipleOutlets?: boolean;
}

export type NodeKind = "outlet" | "headwater" | "confluence" | "junction";

export interface TopologyNode {
  id: string;
  /** Mean of the joined line ends, WGS84. */
  position: LngLat;
  kind: NodeKind;
  /** Indexes (into the input lines) of the reaches meeting here. */
  reaches: number[];
  component: number;
}

export interface TopologyReach {
  /** Index into the input lines. */
  index: number;
  name: string;
  upstreamNodeId: string;
  downstreamNodeId: string;
  /** Head (upstream end) first. */
  coordinates: LngLat[];
  /** Whether the line was drawn from downstream to upstream and has been reversed. */
  flipped: boolean;
  /** Index of the reach this one flows into; undefined at the outlet. */
  downstreamReach?: number;
  upstreamReaches: number[];
  component: number;
}

export interface TopologyComponent {
  index: number;
  reaches: number[];
  outletNodeId: string;
  /** The reach whose downstream end is the outlet. */
  outletReach: number;
  suggestedOutletNodeId: string;
  /** How the suggestion was found and how sure it is (see geo/outlet.ts). */
  suggestion: OutletBasis;
  /** The next-best outlet's reach, when the line directions decided. */
  runnerUpReach?: number;
  chosen: boolean;
  hasCycles: boolean;
}

export interface Topology {
  nodes: TopologyNode[];
  reaches: TopologyReach[];
  components: TopologyComponent[];
  problems: Problem[];
}

const multiLine = (lines: readonly TopologyLine[], idx: readonly number[]): MultiLineString => ({
  type: "MultiLineString",
  coordinates: idx.map((i) => lines[i].coordinates),
});

/** Joins line ends within the tolerance into nodes; reports gaps just over it. */
function joinEnds(lines: readonly TopologyLine[], toleranceM: number, gapM: number) {
  const ends: LngLat[] = lines.flatMap((l) => [l.coordinates[0], l.coordinates[l.coordinates.length - 1]]);
  const grid = new PointGrid(ends, gapM);
  const uf = new UnionFind(ends.length);
  const near: Array<[number, number, number]> = [];
  ends.forEach((p, i) => {
    for (const j of grid.near(p)) {
      if (j <= i) continue;
      const d = distance(p, ends[j], { units: "meters" });
      if (d <= toleranceM) uf.union(i, j);
      else if (d <= gapM) near.push([i, j, d]);
    }
  });
  const nodeOf = new Int32Array(ends.length);
  const roots = new Map<number, number>();
  const sums: Array<[number, number, number]> = [];
  ends.forEach((p, i) => {
    const r = uf.find(i);
    let k = roots.get(r);
    if (k === undefined) {
      k = sums.length;
      roots.set(r, k);
      sums.push([0, 0, 0]);
    }
    nodeOf[i] = k;
    sums[k][0] += p[0];
    sums[k][1] += p[1];
    sums[k][2]++;
  });
  const positions = sums.map(([x, y, c]) => [x / c, y / c] as LngLat);
  const gaps = new Map<string, [number, number, number]>();
  for (const [i, j, d] of near) {
    if (nodeOf[i] === nodeOf[j]) continue;
    const key = `${Math.min(nodeOf[i], nodeOf[j])}-${Math.max(nodeOf[i], nodeOf[j])}`;
    const seen = gaps.get(key);
    if (!seen || d < seen[2]) gaps.set(key, [i, j, d]);
  }
  const inGap = new Set([...gaps.values()].flatMap(([i, j]) => [i, j]));
  const problems = [...gaps.values()].map(([i, j, d]) => {
    const [a, b] = [lines[i >> 1].name, lines[j >> 1].name];
    const geometry: LineString = { type: "LineString", coordinates: [ends[i], ends[j]] };
    return warning(
      "gap",
      `The ends of ${a} and ${b} are ${d.toFixed(1)} m apart, just over the ${toleranceM} m tolerance, so they are not joined; ` +
        `join them in the file or raise the tolerance to ${Math.ceil(d)} m`,
      [a, b],
      { geometry },
    );
  });
  return { nodeOf, positions, problems, inGap };
}

/**
 * Free line ends lying near the middle of another reach (not near its ends): a tributary
 * drawn to meet the main stem where the main stem has no vertex end, so no node joins them.
 */
function endsMidReach(
  lines: readonly TopologyLine[],
  nodeOf: Int32Array,
  endCount: Int32Array,
  toleranceM: number,
  gapM: number,
  inGap: ReadonlySet<number>,
): Problem[] {
  const grid = new BoxGrid(lines.map((l) => l.coordinates), lengthToDegrees(gapM, "meters"));
  const problems: Problem[] = [];
  lines.forEach((l, e) => {
    for (const end of [0, 1]) {
      // an end already reported as a gap to another line's end gets that one piece of advice only
      if (endCount[nodeOf[2 * e + end]] !== 1 || inGap.has(2 * e + end)) continue;
      const p = end === 0 ? l.coordinates[0] : l.coordinates[l.coordinates.length - 1];
      for (const other of grid.near(p)) {
        if (other === e) continue;
        const target = lines[other].coordinates;
        const hit = nearestPointOnLine({ type: "LineString", coordinates: target }, p, { units: "meters" });
        if (hit.properties.pointDistance > gapM) continue;
        const q = hit.geometry.coordinates;
        const nearEnd = [target[0], target[target.length - 1]].some((t) => distance(q, t, { units: "meters" }) <= toleranceM);
        if (nearEnd) continue;
        problems.push(
          warning(
            "ends_mid_reach",
            `${l.name} ends ${hit.properties.pointDistance.toFixed(1)} m from the middle of ${lines[other].name}, not at one of its ends, ` +
              `so they are not joined; split ${lines[other].name} at that point`,
            [l.name, lines[other].name],
            { geometry: { type: "LineString", coordinates: [p, q] } },
          ),
        );
        break;
      }
    }
  });
  return problems;
}

/** Breadth-first spanning tree from `root`: parent edge per node (-1 at the root) and visit order. */
function spanningTree(g: Graph, root: number, parentEdge: Int32Array, order: number[], seen: Uint8Array) {
  seen[root] = 1;
  parentEdge[root] = -1;
  order.push(root);
  for (let q = order.length - 1; q < order.length; q++) {
    const u = order[q];
    for (const e of g.adjacency[u]) {
      const v = g.from[e] === u ? g.to[e] : g.from[e];
      if (seen[v]) continue;
      seen[v] = 1;
      parentEdge[v] = e;
      order.push(v);
    }
  }
}

/** Closed lines, braids (two reaches between the same nodes) and longer loops; all are errors. */
function cycleProblems(lines: readonly TopologyLine[], g: Graph, parentEdge: Int32Array, depth: Int32Array): Problem[] {
  const problems: Problem[] = [];
  const byPair = new Map<string, number[]>();
  g.from.forEach((a, e) => {
    const b = g.to[e];
    if (a === b) {
      problems.push(
        error("closed_loop", `${lines[e].name} starts and ends at the same point; a reach must run from one node to another`, [lines[e].name], {
          geometry: multiLine(lines, [e]),
        }),
      );
      return;
    }
    const key = `${Math.min(a, b)}-${Math.max(a, b)}`;
    const pair = byPair.get(key);
    if (pair) pair.push(e);
    else byPair.set(key, [e]);
  });
  const inBraid = new Set<number>();
  for (const edges of byPair.values()) {
    if (edges.length < 2) continue;
    edges.forEach((e) => inBraid.add(e));
    const names = edges.map((e) => lines[e].name);
    problems.push(
      error("braid", `${nameList(names)} run between the same two nodes (a braid); keep one channel as the reach`, names, {
        geometry: multiLine(lines, edges),
      }),
    );
  }
  const treeEdges = new Set(parentEdge.filter((e) => e >= 0));
  g.from.forEach((a0, e) => {
    const b0 = g.to[e];
    if (a0 === b0 || treeEdges.has(e) || inBraid.has(e)) return;
    const cycle = [e];
    let [a, b] = [a0, b0];
    while (a !== b) {
      if (depth[a] < depth[b]) [a, b] = [b, a];
      const pe = parentEdge[a];
      cycle.push(pe);
      a = g.from[pe] === a ? g.to[pe] : g.from[pe];
    }
    const names = cycle.map((i) => lines[i].name);
    problems.push(
      error("loop", `${nameList(names)} form a loop (channels split and rejoin); the network must branch like a tree`, names, {
        geometry: multiLine(lines, cycle),
      }),
    );
  });
  return problems;
}

/** Most end pairs compared when naming the closest ends of two separate parts (beyond it, none are named). */
const MAX_END_PAIRS = 4_000_000;

/**
 * The closest pair of line ends between two separate parts, as words ("the end of X at
 * (lon, lat) and the start of Y") and metres, so a planner can find the break on the map.
 */
function nearestEnds(lines: readonly TopologyLine[], a: readonly number[], b: readonly number[]): { text: string; metres: number } | undefined {
  if (4 * a.length * b.length > MAX_END_PAIRS) return undefined;
  const ends = (e: number) => [
    { e, p: lines[e].coordinates[0], which: "start" },
    { e, p: lines[e].coordinates[lines[e].coordinates.length - 1], which: "end" },
  ];
  let best: { x: ReturnType<typeof ends>[number]; y: ReturnType<typeof ends>[number]; d: number } | undefined;
  for (const x of a.flatMap(ends)) {
    for (const y of b.flatMap(ends)) {
      const d = distance(x.p, y.p, { units: "meters" });
      if (!best || d < best.d) best = { x, y, d };
    }
  }
  if (!best) return undefined;
  const at = (p: LngLat) => `(${p[0].toFixed(5)}, ${p[1].toFixed(5)})`;
  return {
    text: `the ${best.x.which} of ${lines[best.x.e].name} at ${at(best.x.p)} and the ${best.y.which} of ${lines[best.y.e].name} at ${at(best.y.p)}`,
    metres: best.d,
  };
}

/**
 * The line directions do not settle the outlet clearly: an error until the planner chooses
 * (or confirms) the outlet, naming the suggestion, the next-best end and the km each turns.
 */
function uncertainOutlet(lines: readonly TopologyLine[], c: TopologyComponent, basis: Extract<OutletBasis, { kind: "directions" }>): Problem {
  const km = (x: number) => `${x.toFixed(2)} km`;
  const best = lines[c.outletReach].name;
  const why =
    basis.turnedKm > WEAK_TURNED_SHARE * basis.totalKm
      ? `even the best outlet, the downstream end of ${best}, turns round ${km(basis.turnedKm)} of the part's ${km(basis.totalKm)} of lines`
      : `the downstream end of ${best} (turning round ${km(basis.turnedKm)} of lines) and the free end of ${lines[c.runnerUpReach as number].name} ` +
        `(turning ${km(basis.runnerUp?.turnedKm ?? 0)}) fit the line directions almost equally well`;
  const names = [best, ...(c.runnerUpReach !== undefined ? [lines[c.runnerUpReach].name] : [])];
  return error(
    "outlet_uncertain",
    `The outlet cannot be told from the way the lines are drawn: ${why}. Choose the outlet reach under "Outlet" and check again`,
    names,
    { geometry: multiLine(lines, c.reaches) },
  );
}

/** The node a planner's outlet choice points at, or a problem. */
function resolveChoice(choice: OutletChoice, lines: readonly TopologyLine[], g: Graph, nodeIds: string[]): number | Problem {
  if ("nodeId" in choice) {
    const n = nodeIds.indexOf(choice.nodeId);
    return n >= 0 ? n : error("outlet_invalid", `The chosen outlet node ${choice.nodeId} does not exist`, []);
  }
  const e = lines.findIndex((l) => l.name === choice.reachId);
  if (e < 0) return error("outlet_invalid", `The chosen outlet reach ${choice.reachId} is not in the network`, [choice.reachId]);
  const free = [g.to[e], g.from[e]].find((n) => g.adjacency[n].length === 1);
  return free ?? error("outlet_invalid", `Neither end of reach ${choice.reachId} is free, so it cannot end at the outlet`, [choice.reachId]);
}

/**
 * Builds the network from line ends: joins ends within the tolerance into nodes, finds the
 * separate parts, loops and braids, suggests an outlet per part (or uses the planner's),
 * and orients every reach toward its outlet (flipping lines drawn upstream).
 * Problems: gap, ends_mid_reach, closed_loop, braid, loop, outlet_invalid, outlet_uncertain, disconnected_parts,
 * reach_reversed.
 */
export function buildTopology(lines: readonly TopologyLine[], options: TopologyOptions = {}): Topology {
  const toleranceM = options.toleranceM ?? IMPORT_DEFAULTS.toleranceM;
  const gapM = options.gapSearchM ?? Math.max(50, 10 * toleranceM);
  const { nodeOf, positions, problems, inGap } = joinEnds(lines, toleranceM, gapM);
  const nodeCount = positions.length;
  const from = Int32Array.from(lines, (_, e) => nodeOf[2 * e]);
  const to = Int32Array.from(lines, (_, e) => nodeOf[2 * e + 1]);
  const adjacency: number[][] = Array.from({ length: nodeCount }, () => []);
  lines.forEach((_, e) => {
    adjacency[from[e]].push(e);
    if (to[e] !== from[e]) adjacency[to[e]].push(e);
  });
  const g: Graph = { from, to, adjacency };
  const endCount = new Int32Array(nodeCount);
  nodeOf.forEach((n) => endCount[n]++);
  appendAll(problems, endsMidReach(lines, nodeOf, endCount, toleranceM, gapM, inGap));
  const nodeIds = positions.map((_, k) => `N${k + 1}`);

  // First pass: parts and cycles, on a spanning tree rooted at each part's first node.
  const parentEdge = new Int32Array(nodeCount).fill(-1);
  const depth = new Int32Array(nodeCount);
  const seen = new Uint8Array(nodeCount);
  const parts: number[][] = [];
  for (let n = 0; n < nodeCount; n++) {
    if (seen[n]) continue;
    const order: number[] = [];
    spanningTree(g, n, parentEdge, order, seen);
    for (const v of order.slice(1)) {
      const e = parentEdge[v];
      depth[v] = depth[from[e] === v ? to[e] : from[e]] + 1;
    }
    parts.push(order);
  }
  appendAll(problems, cycleProblems(lines, g, parentEdge, depth));
  const partOf = new Int32Array(nodeCount);
  parts.forEach((order, c) => order.forEach((v) => (partOf[v] = c)));

  const chosen = new Map<number, number>();
  for (const choice of options.outlets ?? []) {
    const n = resolveChoice(choice, lines, g, nodeIds);
    if (typeof n !== "number") {
      problems.push(n);
      continue;
    }
    if (chosen.has(partOf[n])) {
      problems.push(error("outlet_invalid", `Two outlets were chosen for the same part of the network (${nodeIds[chosen.get(partOf[n]) as number]} and ${nodeIds[n]})`, []));
      continue;
    }
    if (adjacency[n].length !== 1) {
      problems.push(error("outlet_invalid", `Node ${nodeIds[n]} joins ${adjacency[n].length} reaches; the outlet must be the free end of one reach`, [], {
        geometry: { type: "Point", coordinates: positions[n] },
      }));
    }
    chosen.set(partOf[n], n);
  }

  // Second pass: orient each part from its outlet.
  const weighed = lines.map((l) => ({ ...l, lengthKm: l.lengthKm ?? lineLengthKm(l.coordinates) }));
  const orientedParent = new Int32Array(nodeCount).fill(-1);
  const seen2 = new Uint8Array(nodeCount);
  const components: TopologyComponent[] = parts.map((order, c) => {
    const suggestion = suggestOutlet(g, order, parentEdge, weighed);
    const outlet = chosen.get(c) ?? suggestion.node;
    spanningTree(g, outlet, orientedParent, [], seen2);
    const edges = new Set(order.flatMap((v) => adjacency[v]));
    const runnerUp = suggestion.basis.kind === "directions" ? suggestion.basis.runnerUp : undefined;
    return {
      index: c,
      reaches: [...edges].sort((a, b) => a - b),
      outletNodeId: nodeIds[outlet],
      outletReach: adjacency[outlet][0],
      suggestedOutletNodeId: nodeIds[suggestion.node],
      suggestion: suggestion.basis,
      runnerUpReach: runnerUp ? adjacency[runnerUp.node][0] : undefined,
      chosen: chosen.has(c),
      hasCycles: edges.size > order.length - 1,
    };
  });
  const uncertain = new Set<number>();
  for (const c of components) {
    if (c.chosen || c.suggestion.kind !== "directions" || !c.suggestion.weak || c.hasCycles) continue;
    problems.push(uncertainOutlet(lines, c, c.suggestion));
    uncertain.add(c.index);
  }
  const downstreamNode = (e: number) => {
    if (orientedParent[from[e]] === e) return to[e];
    if (orientedParent[to[e]] === e) return from[e];
    return to[e];
  };
  const reaches: TopologyReach[] = lines.map((l, e) => {
    const down = downstreamNode(e);
    const up = down === to[e] ? from[e] : to[e];
    const flipped = down === from[e] && down !== to[e];
    const parent = orientedParent[down];
    return {
      index: e,
      name: l.name,
      upstreamNodeId: nodeIds[up],
      downstreamNodeId: nodeIds[down],
      coordinates: flipped ? [...l.coordinates].reverse() : l.coordinates,
      flipped,
      downstreamReach: parent >= 0 && parent !== e ? parent : undefined,
      upstreamReaches: [],
      component: partOf[down],
    };
  });
  for (const r of reaches) if (r.downstreamReach !== undefined) reaches[r.downstreamReach].upstreamReaches.push(r.index);

  const outletNodes = new Set(components.map((c) => c.outletNodeId));
  const nodes: TopologyNode[] = positions.map((position, n) => {
    const degree = adjacency[n].length;
    const kind: NodeKind = outletNodes.has(nodeIds[n]) ? "outlet" : degree === 1 ? "headwater" : degree >= 3 ? "confluence" : "junction";
    return { id: nodeIds[n], position, kind, reaches: adjacency[n], component: partOf[n] };
  });

  // where the outlet is uncertain, which reaches are "drawn upstream" is not known yet either
  const flipped = reaches.filter((r) => r.flipped && !uncertain.has(r.component));
  if (flipped.length > 0) {
    const names = flipped.map((r) => r.name);
    const outlets = nameList(components.filter((c) => c.reaches.some((e) => reaches[e].flipped)).map((c) => `the downstream end of ${lines[c.outletReach].name}`));
    problems.push(
      warning(
        "reach_reversed",
        `${names.length} reach(es) were drawn from downstream to upstream and have been turned round to flow to the outlet at ${outlets}: ${nameList(names)}`,
        names,
        { geometry: multiLine(lines, flipped.map((r) => r.index)) },
      ),
    );
  }
  if (components.length > 1) {
    const main = components.reduce((m, c) => (c.reaches.length > m.reaches.length ? c : m));
    const others = components.filter((c) => c !== main).flatMap((c) => c.reaches);
    const summary = components
      .map((c) => `part ${c.index + 1}: ${c.reaches.length} reach(es), outlet at the downstream end of ${lines[c.outletReach].name}`)
      .join("; ");
    const closest = components
      .filter((c) => c !== main)
      .map((c) => nearestEnds(lines, c.reaches, main.reaches))
      .filter((x) => x !== undefined);
    const where = closest.map((x) => `${x.text} are ${x.metres.toFixed(1)} m apart`).join("; ");
    const make = options.allowMultipleOutlets ? warning : error;
    problems.push(
      make(
        "disconnected_parts",
        `The network has ${components.length} separate parts, each with its own outlet (${summary}); ` +
          `${where ? `the closest ends: ${where}; ` : ""}join them or remove stray reaches`,
        others.map((e) => lines[e].name),
        { geometry: multiLine(lines, others) },
      ),
    );
  }
  return { nodes, reaches, components, problems };
}
