/**
 * Generates the invented demo basin — the Tamsel River and its tributaries — as
 *   tests/fixtures/demo/tamsel-reaches.zip      zipped shapefile, WGS 84 / UTM zone 16N (.prj), US units
 *   tests/fixtures/demo/tamsel-reaches.geojson  the same reaches in WGS84, SI units
 *   tests/fixtures/demo/tamsel-dischargers.csv  five dischargers with latitude/longitude
 * Deterministic: same bytes on every run. Usage: `npx tsx scripts/make-demo-gis.ts [outDir]`.
 */
import { mkdirSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { crsFromEpsg } from "../geo/crs";
import { utmNorthPrj, type DbfField } from "./lib/shapefile-writer";
import { zipShapefile } from "./lib/shapefile-zip";

type XY = [number, number];

const EPSG = 32616;
const ZONE = 16;
// in the northern wetlands near 52.4° N 86.1° W (UTM 16N), far from any town: the basin is invented
const ORIGIN: XY = [560_000, 5_800_000];

/** Network nodes, metres east/north of ORIGIN. */
const NODE: Record<string, XY> = {
  M0: [0, 30_000], M1: [4_000, 27_500], M2: [8_500, 25_500], M3: [13_000, 22_500], M4: [17_000, 20_000],
  M5: [21_500, 17_000], M6: [26_000, 14_500], M7: [30_000, 11_000], M8: [34_500, 8_000],
  O0: [3_000, 38_000], O1: [5_500, 34_000], O2: [7_500, 29_500],
  B0: [14_000, 32_000], B1: [17_500, 26_000], B2: [20_000, 21_500], S0: [22_500, 30_500],
  H0: [38_000, 22_000], H1: [34_000, 16_000],
};

interface DemoReach {
  id: string;
  name: string;
  from: string;
  to: string;
  /** Inflow joining along this reach, cfs (design low flow). */
  addCfs: number;
  /** Drawn from downstream to upstream, as happens in real files; the importer turns it round. */
  reversed?: boolean;
}

const REACHES: DemoReach[] = [
  { id: "TR-01", name: "Tamsel River (source to Wenlow Ford)", from: "M0", to: "M1", addCfs: 6 },
  { id: "TR-02", name: "Tamsel River (Wenlow Ford to Orrin mouth)", from: "M1", to: "M2", addCfs: 2 },
  { id: "TR-03", name: "Tamsel River (Orrin mouth to Quillford)", from: "M2", to: "M3", addCfs: 1.5 },
  { id: "TR-04", name: "Tamsel River (Quillford to Bellow mouth)", from: "M3", to: "M4", addCfs: 1.5 },
  { id: "TR-05", name: "Tamsel River (Bellow mouth reach)", from: "M4", to: "M5", addCfs: 1 },
  { id: "TR-06", name: "Tamsel River (Bellow mouth to East Penhallow)", from: "M5", to: "M6", addCfs: 2 },
  { id: "TR-07", name: "Tamsel River (East Penhallow to Harrow mouth)", from: "M6", to: "M7", addCfs: 1.5 },
  { id: "TR-08", name: "Tamsel River (Harrow mouth to basin outlet)", from: "M7", to: "M8", addCfs: 2 },
  { id: "OC-01", name: "Orrin Creek (upper)", from: "O0", to: "O1", addCfs: 2.5 },
  { id: "OC-02", name: "Orrin Creek (middle)", from: "O1", to: "O2", addCfs: 1 },
  { id: "OC-03", name: "Orrin Creek (Marrowby to mouth)", from: "O2", to: "M2", addCfs: 1 },
  { id: "BB-01", name: "Bellow Brook (upper)", from: "B0", to: "B1", addCfs: 3 },
  { id: "BB-02", name: "Bellow Brook (Sedge mouth to Dunmere)", from: "B1", to: "B2", addCfs: 1 },
  { id: "BB-03", name: "Bellow Brook (Dunmere to mouth)", from: "B2", to: "M5", addCfs: 1 },
  { id: "SR-01", name: "Sedge Run", from: "S0", to: "B1", addCfs: 1.5 },
  { id: "HC-01", name: "Harrow Creek (upper)", from: "H0", to: "H1", addCfs: 2, reversed: true },
  { id: "HC-02", name: "Harrow Creek (Harrowgate to mouth)", from: "H1", to: "M7", addCfs: 1 },
];

/** Elevation of each node, ft above sea level. */
const ELEV_FT: Record<string, number> = {
  M0: 905, M1: 842, M2: 790, M3: 741, M4: 700, M5: 655, M6: 611, M7: 566, M8: 524,
  O0: 1010, O1: 930, O2: 852, B0: 980, B1: 860, B2: 760, S0: 1003, H0: 940, H1: 770,
};

interface DemoDischarger {
  name: string;
  permitId: string;
  reach: string;
  /** Fraction of the reach length from its head, and offset to the left bank side (m). */
  at: number;
  offsetM: number;
  flowMgd: number;
  bod5: number;
  bottleRate: number;
  doMgL: number;
  tempF: number;
  email: string;
}

const DISCHARGERS: DemoDischarger[] = [
  { name: "Quillford Water Reclamation Plant", permitId: "DP-1001", reach: "TR-03", at: 0.4, offsetM: 60, flowMgd: 2.5, bod5: 20, bottleRate: 0.23, doMgL: 5.5, tempF: 75.2, email: "operations@quillford-water.example" },
  { name: "Marrowby Creamery", permitId: "DP-1002", reach: "OC-03", at: 0.5, offsetM: 35, flowMgd: 0.4, bod5: 45, bottleRate: 0.3, doMgL: 4.0, tempF: 78.8, email: "plant@marrowby-creamery.example" },
  { name: "East Penhallow Sanitary District", permitId: "DP-1003", reach: "TR-06", at: 0.3, offsetM: 80, flowMgd: 4.2, bod5: 30, bottleRate: 0.2, doMgL: 5.0, tempF: 74.3, email: "district.office@eastpenhallow.example" },
  { name: "Dunmere Board Mill", permitId: "DP-1004", reach: "BB-03", at: 0.7, offsetM: -45, flowMgd: 1.8, bod5: 60, bottleRate: 0.25, doMgL: 3.5, tempF: 82.4, email: "environment@dunmere-board.example" },
  { name: "Harrowgate Village Wastewater Works", permitId: "DP-1005", reach: "HC-02", at: 0.55, offsetM: 25, flowMgd: 0.3, bod5: 25, bottleRate: 0.22, doMgL: 6.0, tempF: 73.4, email: "clerk@harrowgate-village.example" },
];

const round = (v: number, places: number) => Number(v.toFixed(places));

/** A gently meandering line between two nodes: vertices every ~250 m, sideways swing ≤ 120 m. */
function meander(a: XY, b: XY, seed: number): XY[] {
  const [dx, dy] = [b[0] - a[0], b[1] - a[1]];
  const len = Math.hypot(dx, dy);
  const n = Math.max(2, Math.round(len / 250));
  const [nx, ny] = [-dy / len, dx / len];
  const out: XY[] = [];
  for (let i = 0; i <= n; i++) {
    const t = i / n;
    const swing = i === 0 || i === n ? 0 : 120 * Math.sin(Math.PI * t) * Math.sin(2 * Math.PI * (2 + (seed % 3)) * t + seed);
    out.push([round(ORIGIN[0] + a[0] + dx * t + nx * swing, 2), round(ORIGIN[1] + a[1] + dy * t + ny * swing, 2)]);
  }
  return out;
}

/** Point at fraction `at` of a polyline's length, moved `offset` metres to the left of it. */
function along(line: XY[], at: number, offset: number): XY {
  const seg = line.slice(1).map((p, i) => Math.hypot(p[0] - line[i][0], p[1] - line[i][1]));
  let target = at * seg.reduce((s, d) => s + d, 0);
  for (let i = 0; i < seg.length; i++) {
    if (target <= seg[i] || i === seg.length - 1) {
      const [p, q] = [line[i], line[i + 1]];
      const t = target / seg[i];
      const [ux, uy] = [(q[0] - p[0]) / seg[i], (q[1] - p[1]) / seg[i]];
      return [p[0] + (q[0] - p[0]) * t - uy * offset, p[1] + (q[1] - p[1]) * t + ux * offset];
    }
    target -= seg[i];
  }
  return line[line.length - 1];
}

/** Design flow of each reach: its own inflow plus everything upstream (cfs). */
function designFlows(): Map<string, number> {
  const flows = new Map<string, number>();
  const flowOf = (r: DemoReach): number => {
    const known = flows.get(r.id);
    if (known !== undefined) return known;
    const q = r.addCfs + REACHES.filter((u) => u.to === r.from).reduce((s, u) => s + flowOf(u), 0);
    flows.set(r.id, q);
    return q;
  };
  REACHES.forEach(flowOf);
  return flows;
}

export function buildDemo() {
  const toWgs84 = crsFromEpsg(EPSG).toWgs84;
  const flows = designFlows();
  const lines = new Map(REACHES.map((r, i) => [r.id, meander(NODE[r.from], NODE[r.to], i + 1)]));
  const rows = REACHES.map((r) => {
    const line = lines.get(r.id) as XY[];
    const q = flows.get(r.id) as number;
    const lengthM = line.slice(1).reduce((s, p, i) => s + Math.hypot(p[0] - line[i][0], p[1] - line[i][1]), 0);
    const drop = ELEV_FT[r.from] - ELEV_FT[r.to];
    return {
      r,
      line,
      downstream: REACHES.find((d) => d.from === r.to)?.id ?? "",
      flowCfs: round(q, 2),
      velFps: round(0.35 * q ** 0.3, 2),
      depthFt: round(0.55 * q ** 0.38, 2),
      slope: round((drop * 0.3048) / lengthM, 6),
      elevFt: ELEV_FT[r.from],
    };
  });

  const fields: DbfField[] = [
    { name: "REACH_ID", type: "C", length: 8 },
    { name: "NAME", type: "C", length: 48 },
    { name: "DOWN_ID", type: "C", length: 8 },
    { name: "FLOW_CFS", type: "N", length: 10, decimals: 2 },
    { name: "VEL_FPS", type: "N", length: 8, decimals: 2 },
    { name: "DEPTH_FT", type: "N", length: 8, decimals: 2 },
    { name: "SLOPE", type: "N", length: 10, decimals: 6 },
    { name: "TEMP_F", type: "N", length: 6, decimals: 1 },
    { name: "ELEV_FT", type: "N", length: 8, decimals: 1 },
    { name: "KD_20", type: "N", length: 6, decimals: 2 },
  ];
  const zip = zipShapefile(
    "tamsel_reaches",
    "polyline",
    fields,
    rows.map((x) => ({
      geometry: [x.r.reversed ? [...x.line].reverse() : x.line],
      attributes: {
        REACH_ID: x.r.id, NAME: x.r.name, DOWN_ID: x.downstream, FLOW_CFS: x.flowCfs, VEL_FPS: x.velFps,
        DEPTH_FT: x.depthFt, SLOPE: x.slope, TEMP_F: 77, ELEV_FT: x.elevFt, KD_20: 0.3,
      },
    })),
    { prj: utmNorthPrj(ZONE) },
  );

  const lonLat = (p: XY) => toWgs84(p[0], p[1]).map((v) => round(v, 7));
  const geojson = {
    type: "FeatureCollection",
    name: "tamsel_reaches",
    features: rows.map((x) => ({
      type: "Feature",
      properties: {
        reach_id: x.r.id, name: x.r.name, downstream_id: x.downstream || null,
        design_flow_m3s: round(x.flowCfs * 0.3048 ** 3, 4), velocity_m_s: round(x.velFps * 0.3048, 3),
        depth_m: round(x.depthFt * 0.3048, 3), slope: x.slope, temperature_c: 25, elevation_m: round(x.elevFt * 0.3048, 1),
        kd_per_day: 0.3,
      },
      geometry: { type: "LineString", coordinates: (x.r.reversed ? [...x.line].reverse() : x.line).map(lonLat) },
    })),
  };

  const header = "facility,permit_id,latitude,longitude,design_flow_mgd,bod5_mg_l,bottle_rate_per_day,do_mg_l,temperature_f,contact_email";
  const csvRows = DISCHARGERS.map((d) => {
    const [lon, lat] = lonLat(along(lines.get(d.reach) as XY[], d.at, d.offsetM));
    return [`"${d.name}"`, d.permitId, lat, lon, d.flowMgd, d.bod5, d.bottleRate, d.doMgL, d.tempF, d.email].join(",");
  });
  return { zip, geojson: `${JSON.stringify(geojson, null, 1)}\n`, csv: `${[header, ...csvRows].join("\n")}\n` };
}

const isMain = process.argv[1]?.endsWith("make-demo-gis.ts");
if (isMain) {
  const outDir = process.argv[2] ?? join(process.cwd(), "tests/fixtures/demo");
  mkdirSync(outDir, { recursive: true });
  const demo = buildDemo();
  writeFileSync(join(outDir, "tamsel-reaches.zip"), demo.zip);
  writeFileSync(join(outDir, "tamsel-reaches.geojson"), demo.geojson);
  writeFileSync(join(outDir, "tamsel-dischargers.csv"), demo.csv);
  console.log(`Wrote the Tamsel demo basin (${REACHES.length} reaches, ${DISCHARGERS.length} dischargers) to ${outDir}`);
}
