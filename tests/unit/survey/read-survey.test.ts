import geographiclib from "geographiclib-geodesic";
import { describe, expect, it } from "vitest";
import { placeSamples, type NetworkReachLine } from "@/lib/survey/place-stations";
import { findSurveyColumns, readSurvey, type SurveyReadOptions } from "@/lib/survey/read-survey";

const SI: SurveyReadOptions = { temperatureUnit: "C", flowUnit: "m3/s", bodKind: "bod5" };
const bytes = (s: string) => new TextEncoder().encode(s);

describe("reading a survey file", () => {
  it("reads a CSV with lat/lon, finding columns by their usual names, and converts °F and cfs exactly", async () => {
    const csv = "Station ID,Latitude,Longitude,Date,Time,DO (mg/L),Temp F,Flow,BOD\nS1,0.001,0.25,2026-08-14,9:30,6.2,68,10,3.5\nS2,0.002,0.5,2026-08-14,11:05,5.1,77,,\n";
    const r = await readSurvey("csv", bytes(csv), "s.csv", { temperatureUnit: "F", flowUnit: "cfs", bodKind: "cbodu" });
    expect(r.problems).toEqual([]);
    expect(r.columns).toMatchObject({ station: "Station ID", date: "Date", do: "DO (mg/L)", temperature: "Temp F", flow: "Flow", bod: "BOD" });
    const [a, b] = r.samples;
    expect(a).toMatchObject({ row: 1, station: "S1", time: "2026-08-14T09:30", position: [0.25, 0.001], do_mg_l: 6.2, bod5_mg_l: null, cbodu_mg_l: 3.5 });
    // exact by definition: 68 °F = 20 °C, 77 °F = 25 °C; 1 ft = 0.3048 m so 1 cfs = 0.3048³ m³/s (international foot, 1959)
    expect(a.temperature_c).toBeCloseTo(20, 12);
    expect(b.temperature_c).toBeCloseTo(25, 12);
    expect(a.flow_m3s).toBeCloseTo(10 * 0.3048 ** 3, 14);
    expect(b).toMatchObject({ flow_m3s: null, cbodu_mg_l: null, time: "2026-08-14T11:05" });
  });

  it("reads a CSV placed by reach and km, without coordinates", async () => {
    const csv = "station,reach,km,datetime,do,temperature,cbodu,nh3-n,weight\nA,R1,2.5,2026-08-14T08:00,7.9,22,4,0.3,2\n";
    const r = await readSurvey("csv", bytes(csv), "s.csv", SI);
    expect(r.problems).toEqual([]);
    expect(r.samples[0]).toMatchObject({ station: "A", reach: "R1", km: 2.5, position: null, do_mg_l: 7.9, temperature_c: 22, cbodu_mg_l: 4, nh3n_mg_l: 0.3, weight: 2, time: "2026-08-14T08:00" });
  });

  it("names the row and the column of every value it cannot use, and keeps reading", async () => {
    const csv = "station,lat,lon,datetime,do\nS1,0,0.1,2026-08-14T08:00,abc\nS2,0,0.2,14/08/2026,31\n,0,0.3,2026-08-14,5\nS4,,,2026-08-14,5\n";
    const r = await readSurvey("csv", bytes(csv), "s.csv", SI);
    expect(r.problems).toEqual([
      { row: 1, field: "do", message: '"abc" is not a number' },
      { row: 2, field: "datetime", message: '"14/08/2026" is not an ISO 8601 date-time (e.g. 2026-08-14T09:30)' },
      { row: 2, field: "do", message: "DO 31 mg/L lies outside 0–25 mg/L" },
      { row: 3, field: "station", message: "The station is empty" },
      { row: 4, field: "station", message: "The row has no usable coordinates" },
    ]);
  });

  it("refuses a file without a station column or without any measured value, naming the columns it has", async () => {
    const noStation = await readSurvey("csv", bytes("lat,lon,do\n0,0,5\n"), "s.csv", SI);
    expect(noStation.problems[0]).toMatchObject({ row: null, field: "station" });
    expect(noStation.problems[0].message).toContain("the columns are lat, lon, do");
    const noValues = await readSurvey("csv", bytes("station,lat,lon\nA,0,0\n"), "s.csv", SI);
    expect(noValues.problems[0]).toMatchObject({ row: null, field: "do" });
  });

  it("reads GeoJSON points with their properties", async () => {
    const gj = JSON.stringify({
      type: "FeatureCollection",
      features: [{ type: "Feature", geometry: { type: "Point", coordinates: [0.75, -0.001] }, properties: { site: "G1", sampled_at: "2026-08-14T10:00:00Z", dissolved_oxygen: 4.4, wtemp: 24.5 } }],
    });
    const r = await readSurvey("geojson", bytes(gj), "s.geojson", SI);
    expect(r.problems).toEqual([]);
    expect(r.samples[0]).toMatchObject({ station: "G1", position: [0.75, -0.001], time: "2026-08-14T10:00:00Z", do_mg_l: 4.4, temperature_c: 24.5 });
  });

  it("takes the planner's column mapping over the names it recognises, coordinates included", async () => {
    const csv = "Site Code,N,E,Oxygen reading,DO\nQ1,0.001,0.25,6.4,99\n";
    const r = await readSurvey("csv", bytes(csv), "s.csv", { ...SI, columns: { station: "Site Code", latitude: "N", longitude: "E", do: "Oxygen reading" } });
    expect(r.problems).toEqual([]);
    // "DO" would be recognised, but the mapping names another column for DO
    expect(r.columns).toMatchObject({ station: "Site Code", do: "Oxygen reading" });
    expect(r.samples[0]).toMatchObject({ station: "Q1", position: [0.25, 0.001], do_mg_l: 6.4 });
    const wrong = await readSurvey("csv", bytes("station,lat,lon,do\nA,0,0,5\n"), "s.csv", { ...SI, columns: { do: "Dissolved" } });
    expect(wrong.problems[0]).toMatchObject({ row: null, field: "do" });
    expect(wrong.problems[0].message).toMatch(/^The mapping names a column "Dissolved" for do, which the file does not have; its columns are station, lat, lon, do$/);
  });

  it("matches column names without case, spaces or punctuation, each file column used once", () => {
    expect(findSurveyColumns(["SITE_ID", "Dissolved Oxygen", "Water.Temperature", "Q"])).toEqual({ station: "SITE_ID", do: "Dissolved Oxygen", temperature: "Water.Temperature", flow: "Q" });
  });
});

// On the equator a geodesic is the equator itself, so 1° of it is exactly a·π/180 with
// a = 6 378 137 m, the WGS84 semi-major axis (EPSG:7030).
const EQUATOR_KM_PER_DEGREE = (6378137 * Math.PI) / 180 / 1000;
const REACHES: NetworkReachLine[] = [{ reach_key: "E", coordinates: [[0, 0], [1, 0]], geometry_length_km: EQUATOR_KM_PER_DEGREE, length_km: 100 }];

describe("placing survey samples on the network", () => {
  it("snaps a station to the reach by geodesic distance (GeographicLib) with its km scaled to the model length", async () => {
    const r = await readSurvey("csv", bytes("station,lat,lon,do\nS1,0.001,0.25,6\nS2,0.004,0.5,6\n"), "s.csv", SI);
    const { placed, problems } = placeSamples(REACHES, r.samples);
    expect(problems).toEqual([]);
    // reference: GeographicLib's inverse problem from the station to the foot of the meridian through it
    const g = geographiclib.Geodesic.WGS84;
    expect(placed[0].distance_m!).toBeCloseTo(g.Inverse(0.001, 0.25, 0, 0.25).s12 as number, 3);
    expect(placed[1].distance_m!).toBeCloseTo(g.Inverse(0.004, 0.5, 0, 0.5).s12 as number, 3);
    // a quarter and half of the line, in a reach the model takes as 100 km long
    expect(placed[0]).toMatchObject({ reach: "E", placement: "snapped" });
    expect(placed[0].km).toBeCloseTo(25, 6);
    expect(placed[1].km).toBeCloseTo(50, 6);
  });

  it("refuses a station beyond the snapping limit, an unknown reach and a km past the reach's end, naming each", async () => {
    const r = await readSurvey("csv", bytes("station,lat,lon,do\nFar,0.01,0.5,6\n"), "s.csv", SI);
    const far = placeSamples(REACHES, r.samples, { maxSnapDistanceM: 500 });
    expect(far.placed).toEqual([]);
    expect(far.problems[0].message).toMatch(/^Station Far is 1106 m from the nearest reach \(E\), beyond the 500 m limit/);
    const given = await readSurvey("csv", bytes("station,reach,km,do\nA,E,40,6\nB,X,1,6\nC,E,100.5,6\n"), "s.csv", SI);
    const out = placeSamples(REACHES, given.samples);
    expect(out.placed.map((p) => [p.station, p.reach, p.km, p.placement])).toEqual([["A", "E", 40, "given"]]);
    expect(out.problems).toEqual([
      { row: 2, field: "reach", message: 'Station B names reach "X", which is not in the network' },
      { row: 3, field: "km", message: "Station C is at km 100.5 of reach E, which is 100.000 km long" },
    ]);
  });
});
