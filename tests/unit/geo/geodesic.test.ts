import { length, lineString } from "@turf/turf";
import geographiclib from "geographiclib-geodesic";
import { describe, expect, it } from "vitest";
import { readPointCsv, validateImport } from "@/geo";
import { cumulativeKm, geodesicMetres, lineLengthKm, nearestOnSegment, segmentMetres } from "@/geo/geodesic";
import type { LngLat } from "@/geo/types";
import { geodesicKm, lines } from "./helpers";

/**
 * Lengths on the WGS84 ellipsoid. The reference throughout is GeographicLib's geodesic
 * inverse called directly (geographiclib-geodesic, Karney's own port; helpers.geodesicKm), plus
 * published and analytic figures. The target is 1e-4 of the length (0.01 %); the
 * assertions hold Sagline to 1e-7 per segment, the bound geo/geodesic.ts is built for.
 */
const G = geographiclib.Geodesic.WGS84;
const A = 6378137; // WGS84 semi-major axis, m (EPSG:7030)

/** Park–Miller minimal standard generator: the same "random" cases on every run. */
function random(seed: number) {
  let s = seed;
  return () => (s = (s * 16807) % 2147483647) / 2147483647;
}

/** A point `s` metres from (lon, lat) at azimuth `az`, by GeographicLib's direct problem. */
function direct(p: readonly number[], az: number, s: number): LngLat {
  const d = G.Direct(p[1], p[0], az, s);
  return [d.lon2 as number, d.lat2 as number];
}

const relative = (x: number, ref: number) => Math.abs(x - ref) / ref;

describe("segment and line lengths against GeographicLib", () => {
  it("random segments of 1 m to 200 km at latitudes 0–89.9° N and S, across the antimeridian too: within 1e-7", () => {
    const r = random(11);
    let worst = 0;
    let short = 0;
    for (let k = 0; k < 4000; k++) {
      const lat = (r() < 0.5 ? -1 : 1) * 89.9 * r();
      const lon = k % 10 === 0 ? 179.9 + 0.2 * r() - 0.1 : 360 * r() - 180;
      const s = 10 ** (6 * r() - 0.3 * r()) * (k % 2 ? 1 : 0.2); // 0.5 m .. ~200 km
      const a: LngLat = [lon, lat];
      const b = direct(a, 360 * r(), s);
      const ref = G.Inverse(a[1], a[0], b[1], b[0]).s12 as number;
      const e = relative(segmentMetres(a, b), ref);
      worst = Math.max(worst, e);
      if (s < 5000) short++;
    }
    expect(short).toBeGreaterThan(1000); // the fast formula was exercised, not only the library
    expect(worst).toBeLessThan(1e-7);
  });

  it("whole lines (200 vertices, 20 m – 2 km steps) at 0–89° in both hemispheres: within 1e-7 of the line length", () => {
    const r = random(29);
    for (const lat of [0, 15, 30, 45, 60, 69, 75, 80, 85, 89, -30, -69, -89]) {
      const coords: LngLat[] = [[360 * r() - 180, lat]];
      let az = 360 * r();
      for (let i = 0; i < 200; i++) {
        az += 60 * (r() - 0.5); // a meandering river
        coords.push(direct(coords[i], az, 20 + 1980 * r()));
      }
      const ref = geodesicKm(coords);
      expect(relative(lineLengthKm(coords), ref)).toBeLessThan(1e-7);
      const along = cumulativeKm(coords);
      expect(along[0]).toBe(0);
      expect(along[along.length - 1]).toBe(lineLengthKm(coords));
      expect(relative(along[100], geodesicKm(coords.slice(0, 101)))).toBeLessThan(1e-7);
    }
  });

  it("Flinders Peak → Buninyong, the Geoscience Australia / Vincenty (1975) worked example: 54 972.271 m", () => {
    // From memory: Flinders Peak 37°57′03.72030″ S 144°25′29.52440″ E, Buninyong
    // 37°39′10.15610″ S 143°55′35.38390″ E, ellipsoidal distance 54 972.271 m (GDA94 / GRS80,
    // whose flattening differs from WGS84's in the 11th digit: under 0.1 mm here).
    const dms = (d: number, m: number, s: number) => d + m / 60 + s / 3600;
    const flinders: LngLat = [dms(144, 25, 29.5244), -dms(37, 57, 3.7203)];
    const buninyong: LngLat = [dms(143, 55, 35.3839), -dms(37, 39, 10.1561)];
    expect(geodesicMetres(flinders, buninyong)).toBeCloseTo(54972.271, 3);
    expect(segmentMetres(flinders, buninyong)).toBeCloseTo(54972.271, 3);
    // The same geodesic cut into 1000 pieces of 55 m: the short-segment formula sums to it.
    const az = G.Inverse(flinders[1], flinders[0], buninyong[1], buninyong[0]).azi1 as number;
    const pieces = Array.from({ length: 1001 }, (_, i) => direct(flinders, az, (54972.271 * i) / 1000));
    expect(lineLengthKm(pieces) * 1000).toBeCloseTo(54972.271, 2);
  });

  it("a quarter meridian is 10 001 965.729 m; an equatorial arc is exactly a·Δλ", () => {
    // From memory: the WGS84 quarter meridian (equator to pole) is 10 001 965.729 m.
    expect(lineLengthKm([[0, 0], [0, 90]]) * 1000).toBeCloseTo(10001965.729, 3);
    // In 0.01° steps every segment takes the short formula, M at the mid-latitude.
    const meridian = Array.from({ length: 9001 }, (_, i): LngLat => [12, i / 100]);
    expect(relative(lineLengthKm(meridian) * 1000, 10001965.729)).toBeLessThan(1e-9);
    // The equator is a geodesic (for Δλ < (1 − f)·180°): its arcs are a·Δλ exactly.
    expect(lineLengthKm([[0, 0], [90, 0]]) * 1000).toBeCloseTo((A * Math.PI) / 2, 4);
    const equator = Array.from({ length: 1001 }, (_, i): LngLat => [-170 + i / 1000, 0]);
    expect(lineLengthKm(equator) * 1000).toBeCloseTo(A * (Math.PI / 180), 6);
    // Across the antimeridian a segment goes the short way.
    expect(segmentMetres([179.9995, 0], [-179.9995, 0])).toBeCloseTo(A * 0.001 * (Math.PI / 180), 6);
  });
});

describe("nearest position on a segment", () => {
  it("short segments: the snap distance is the least distance to the geodesic, within 0.05 % (dense sampling by GeographicLib)", () => {
    const r = random(5);
    for (const lat of [0, 45, 69, -69, 85]) {
      for (const len of [50, 300, 2000]) {
        const a: LngLat = [100 * r(), lat];
        const b = direct(a, 360 * r(), len);
        const line = G.InverseLine(a[1], a[0], b[1], b[0], geographiclib.Geodesic.STANDARD | geographiclib.Geodesic.DISTANCE_IN);
        const p = direct(direct(a, line.azi1 as number, 0.4 * len), 360 * r(), 10 + 300 * r());
        const foot = nearestOnSegment(p, a, b);
        let least = Infinity;
        for (let k = 0; k <= 4000; k++) {
          const q = line.Position(((line.s13 as number) * k) / 4000);
          least = Math.min(least, G.Inverse(p[1], p[0], q.lat2 as number, q.lon2 as number).s12 as number);
        }
        expect(Math.abs(foot.distanceM - least)).toBeLessThan(5e-4 * least + 1e-3);
        expect(relative(foot.distanceM, G.Inverse(p[1], p[0], foot.position[1], foot.position[0]).s12 as number)).toBeLessThan(1e-7);
        expect(foot.alongM).toBeCloseTo(G.Inverse(a[1], a[0], foot.position[1], foot.position[0]).s12 as number, 3);
      }
    }
  });

  it("long segments: the foot lies on the geodesic, and a point beyond an end snaps to that end", () => {
    const a: LngLat = [10, 60];
    const b: LngLat = [12, 61];
    const line = G.InverseLine(a[1], a[0], b[1], b[0], geographiclib.Geodesic.STANDARD | geographiclib.Geodesic.DISTANCE_IN);
    const mid = line.Position((line.s13 as number) * 0.4);
    // 1 km off the geodesic at right angles to it, 40 % of the way along.
    const p = direct([mid.lon2 as number, mid.lat2 as number], (mid.azi2 as number) + 90, 1000);
    const foot = nearestOnSegment(p, a, b);
    expect(foot.distanceM).toBeCloseTo(1000, 3);
    expect(foot.alongM).toBeCloseTo((line.s13 as number) * 0.4, 2);
    const beyond = nearestOnSegment(direct(a, 180, 5000), a, b);
    expect(beyond.position).toEqual(a);
    expect(beyond.alongM).toBe(0);
  });
});

describe("the import at 69° N", () => {
  // A reach winding eastward at 69.6° N (the latitude of Tromsø), 40 vertices 300–800 m apart.
  const r = random(3);
  const coords: LngLat[] = [[18.9, 69.6]];
  for (let i = 0; i < 40; i++) coords.push(direct(coords[i], 90 + 50 * (r() - 0.5), 300 + 500 * r()));
  const dischargers = readPointCsv(`name,permit,lat,lon\nMill,P-1,${coords[20][1]},${coords[20][0]}\n`, { kind: "latlon", latitude: "lat", longitude: "lon" });
  const report = validateImport({ reaches: lines([{ id: "R1", coordinates: coords }]), reachMapping: { reachId: "id" }, dischargers, dischargerMapping: { name: "name", permitId: "permit" } });

  it("the reach's length is the ellipsoid's, where turf's sphere was 0.3–0.4 % short", () => {
    expect(report.errors).toEqual([]);
    const reach = report.network.reaches[0];
    const ref = geodesicKm(coords);
    expect(relative(reach.geometryLengthKm, ref)).toBeLessThan(1e-7);
    expect(relative(reach.lengthKm, ref)).toBeLessThan(1e-7);
    // What the import measured before: turf's length on its sphere of R = 6 371 008.8 m. At
    // 69.6° N the ellipsoid's radii are M ≈ 6 391 km (north–south) and N ≈ 6 399 km (east–west),
    // so the sphere is 0.31–0.43 % short, by direction; this reach runs roughly east.
    const sphere = length(lineString(coords));
    expect(sphere / ref - 1).toBeLessThan(-0.0031);
    expect(sphere / ref - 1).toBeGreaterThan(-0.0044);
  });

  it("a discharger's chainage is the ellipsoidal length from the reach head", () => {
    const reach = report.network.reaches[0];
    const [d] = report.network.dischargers;
    expect(d.reachId).toBe("R1");
    expect(d.snapDistanceM).toBeCloseTo(0, 6);
    // The head is the first vertex unless the reach was turned round; the discharger sits on vertex 20.
    const fromHead = reach.flipped ? geodesicKm(coords.slice(20)) : geodesicKm(coords.slice(0, 21));
    expect(relative(d.chainageKm!, fromHead)).toBeLessThan(1e-7);
  });
});
