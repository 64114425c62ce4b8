import { describe, expect, it } from "vitest";
import { readGeoJson } from "@/geo";
import { fixtureText } from "./helpers";

const codeOf = (f: () => unknown): string => {
  try {
    f();
    return "no error";
  } catch (e) {
    return (e as { code?: string }).code ?? `untyped: ${String(e)}`;
  }
};

describe("readGeoJson", () => {
  it("reads a FeatureCollection as WGS84 with its fields", () => {
    const layer = readGeoJson(fixtureText("geo/y-confluence.geojson"));
    expect(layer.crs).toEqual({ source: "geojson-default", epsg: 4326, name: "WGS 84" });
    expect(layer.name).toBe("y-confluence");
    expect(layer.features.map((f) => f.properties.id)).toEqual(["A", "B", "C"]);
    expect(layer.features[2].geometry).toEqual({ type: "LineString", coordinates: [[0, 0], [0, -0.02]] });
    expect(layer.fields.find((f) => f.name === "down")).toEqual({ name: "down", kind: "text", samples: ["C"], filled: 2 });
  });

  it("reads a single Feature and a bare geometry", () => {
    expect(readGeoJson('{"type":"Feature","id":7,"properties":null,"geometry":{"type":"Point","coordinates":[1,2]}}').features[0]).toEqual({
      index: 0,
      label: "feature 1 (id 7)",
      geometry: { type: "Point", coordinates: [1, 2] },
      properties: {},
    });
    expect(readGeoJson('{"type":"LineString","coordinates":[[0,0],[1,1]]}').features).toHaveLength(1);
  });

  it("reprojects a legacy crs member naming an EPSG code", () => {
    const text = JSON.stringify({
      type: "FeatureCollection",
      crs: { type: "name", properties: { name: "urn:ogc:def:crs:EPSG::32615" } },
      features: [{ type: "Feature", properties: {}, geometry: { type: "Point", coordinates: [500000, 0] } }],
    });
    const layer = readGeoJson(text);
    expect(layer.crs.epsg).toBe(32615);
    const [lon, lat] = (layer.features[0].geometry as { coordinates: number[] }).coordinates;
    expect(lon).toBeCloseTo(-93, 9); // zone 15 central meridian, by definition of UTM
    expect(lat).toBeCloseTo(0, 9);
  });

  it.each([
    ["not JSON", "{oops", "geojson_invalid"],
    ["a JSON array", "[1,2]", "geojson_invalid"],
    ["an unknown type", '{"type":"Topology"}', "geojson_invalid"],
    ["features not an array", '{"type":"FeatureCollection","features":{}}', "geojson_invalid"],
    ["a non-feature member", '{"type":"FeatureCollection","features":[{"type":"Point"}]}', "geojson_invalid"],
    ["malformed coordinates", '{"type":"FeatureCollection","features":[{"type":"Feature","properties":{},"geometry":{"type":"LineString","coordinates":[1,2]}}]}', "geojson_invalid"],
    ["an unknown geometry", '{"type":"Feature","properties":{},"geometry":{"type":"Circle","coordinates":[1,2]}}', "geojson_invalid"],
    ["an unknown legacy crs", '{"type":"FeatureCollection","crs":{"type":"name","properties":{"name":"my grid"}},"features":[]}', "epsg_unknown"],
  ])("refuses %s with a typed error", (_what, text, code) => {
    expect(codeOf(() => readGeoJson(text))).toBe(code);
  });

  it("names the feature whose geometry is malformed", () => {
    const text = '{"type":"FeatureCollection","features":[{"type":"Feature","properties":{},"geometry":null},{"type":"Feature","properties":{},"geometry":{"type":"Polygon","coordinates":[[1,2]]}}]}';
    expect(() => readGeoJson(text)).toThrow(/feature 2: Polygon coordinates are malformed/);
  });
});
