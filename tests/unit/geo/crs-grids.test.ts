import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import geographiclib from "geographiclib-geodesic";
import { afterAll, describe, expect, it } from "vitest";
import { datumConverter } from "@/geo/crs-datum";
import { loadDatumGrids } from "@/geo/crs-grids";

/**
 * A small NTv2 grid (the format of NADCON's and most national shift grids) written here: nodes
 * every 0.5° over 111°W–109°W, 47°N–49°N, the latitude shift 0.5″ + 0.1″ per row northward and
 * the longitude shift (positive west, as NTv2 stores it) 1″ + 0.2″ per column westward.
 * The same bytes, written to /tmp/sagline-test.gsb by a copy of this function, give PROJ's answers
 * below (and the hand values: at 110.3°W 47.8°N, 0.66″ north and 1.52″ west): `echo "-110.3 47.8" | cs2cs -f %.9f +proj=longlat +ellps=clrk66 +nadgrids=/tmp/sagline-test.gsb +to +proj=longlat +datum=WGS84`.
 */
function testGrid(): Buffer {
  const rows = 5;
  const cols = 5;
  const b = Buffer.alloc(176 * 2 + rows * cols * 16 + 16);
  let at = 0;
  const text = (key: string, value: string) => {
    b.write(key.padEnd(8), at, "latin1");
    b.write(value.padEnd(8), at + 8, "latin1");
    at += 16;
  };
  const int = (key: string, value: number) => {
    b.write(key.padEnd(8), at, "latin1");
    b.writeInt32LE(value, at + 8);
    at += 16;
  };
  const real = (key: string, value: number) => {
    b.write(key.padEnd(8), at, "latin1");
    b.writeDoubleLE(value, at + 8);
    at += 16;
  };
  int("NUM_OREC", 11);
  int("NUM_SREC", 11);
  int("NUM_FILE", 1);
  text("GS_TYPE", "SECONDS");
  text("VERSION", "NTv2.0");
  text("SYSTEM_F", "CLARKE66");
  text("SYSTEM_T", "WGS84");
  real("MAJOR_F", 6378206.4);
  real("MINOR_F", 6356583.8);
  real("MAJOR_T", 6378137);
  real("MINOR_T", 6356752.314245);
  text("SUB_NAME", "TEST");
  text("PARENT", "NONE");
  text("CREATED", "20261202");
  text("UPDATED", "20261202");
  real("S_LAT", 47 * 3600);
  real("N_LAT", 49 * 3600);
  real("E_LONG", 109 * 3600);
  real("W_LONG", 111 * 3600);
  real("LAT_INC", 1800);
  real("LONG_INC", 1800);
  int("GS_COUNT", rows * cols);
  // Rows from south to north, each from east to west (NTv2's order).
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < cols; c++) {
      b.writeFloatLE(0.5 + 0.1 * r, at);
      b.writeFloatLE(1 + 0.2 * c, at + 4);
      at += 16;
    }
  }
  text("END", "");
  return b;
}

const dir = mkdtempSync(join(tmpdir(), "sagline-grids-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const metres = (a: number[], b: number[]) => geographiclib.Geodesic.WGS84.Inverse(a[1], a[0], b[1], b[0]).s12 as number;

describe("NTv2 shift grids", () => {
  it("refuses a datum whose grid is not loaded, naming the datum and the grid", () => {
    expect(() => datumConverter("+proj=longlat +ellps=intl +nadgrids=sagline-missing.gsb +no_defs", "Test datum 1924", null)).toThrow(
      expect.objectContaining({ code: "datum_unsupported", message: expect.stringMatching(/Test datum 1924.*sagline-missing\.gsb/) }),
    );
  });

  it("loads the grids of SAGLINE_DATUM_GRID_DIR and shifts through them as PROJ does", () => {
    writeFileSync(join(dir, "sagline-test.gsb"), testGrid());
    expect(loadDatumGrids(dir)).toContain("sagline-test.gsb");
    const { toWgs84, shift } = datumConverter("+proj=longlat +ellps=clrk66 +nadgrids=sagline-test.gsb +no_defs", "Test NAD", null);
    expect(shift).toMatchObject({ method: "grid", operation: "sagline-test.gsb" });
    // cs2cs (PROJ 9.1.1) with the same grid, as in the comment above:
    //   -110.3 47.8 → -110.300422222 47.800183333; -109.2 48.9 → -109.200300000 48.900244444
    expect(metres(toWgs84(-110.3, 47.8), [-110.300422222, 47.800183333])).toBeLessThan(0.01);
    expect(metres(toWgs84(-109.2, 48.9), [-109.2003, 48.900244444])).toBeLessThan(0.01);
    // Clarke 1866 off the grid: NAD27's published parameters (EPSG:1173) instead, as PROJ gives them:
    //   echo "-100 40" | cs2cs -f %.9f +proj=longlat +ellps=clrk66 +towgs84=-8,160,176 +to +proj=longlat +datum=WGS84
    expect(metres(toWgs84(-100, 40), [-100.000417622, 40.000009483])).toBeLessThan(0.01);
    // Another ellipsoid off the grid: no shift to apply, so NaN, for the validator to name the feature.
    const other = datumConverter("+proj=longlat +ellps=intl +nadgrids=sagline-test.gsb +no_defs", "Test 1924", null);
    expect(other.toWgs84(-100, 40).every(Number.isNaN)).toBe(true);
  });
});
