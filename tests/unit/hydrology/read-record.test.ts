import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { annualMinima, lowFlowStatistics } from "@/lib/hydrology/low-flow";
import { CFS_TO_M3S, readDailyRecord, readDailyTemperature } from "@/lib/hydrology/read-record";

/** A tab-separated record in the layout national water-data services publish (invented site and values). */
const RDB = [
  "# Invented data for a test: a gauge that does not exist",
  "# columns: agency, site, date, mean discharge (ft3/s), its qualifier",
  "agency_cd\tsite_no\tdatetime\t123_00060_00003\t123_00060_00003_cd",
  "5s\t15s\t20d\t14n\t10s",
  "XX\t0001\t2021-04-01\t35.3\tA",
  "XX\t0001\t2021-04-02\t\tA",
  "XX\t0001\t2021-04-03\tIce\tA:e",
  "XX\t0001\t2021-04-04\t40\tP",
].join("\n");

describe("daily flow records", () => {
  it("reads CSV date,flow, converting cfs exactly ((0.3048 m)³ per ft³)", () => {
    expect(CFS_TO_M3S).toBe(0.028316846592);
    const r = readDailyRecord("Date, Flow\n2021-04-02,2\n2021-04-01,1\n2021-04-03,\n", "cfs");
    expect(r).toEqual([
      { date: "2021-04-01", flow: CFS_TO_M3S },
      { date: "2021-04-02", flow: 2 * CFS_TO_M3S },
      { date: "2021-04-03", flow: null },
    ]);
  });

  it("reads rdb text: comments and the formats row skipped, blanks and qualifier words missing", () => {
    const r = readDailyRecord(RDB, "cfs");
    expect(r.map((d) => d.date)).toEqual(["2021-04-01", "2021-04-02", "2021-04-03", "2021-04-04"]);
    expect(r.map((d) => d.flow)).toEqual([35.3 * CFS_TO_M3S, null, null, 40 * CFS_TO_M3S]);
  });

  it("names the line at fault", () => {
    expect(() => readDailyRecord("date,flow\n2021-04-01,1\n01/04/2021,2\n", "m3/s")).toThrow(/^line 3: date "01\/04\/2021" is not an ISO date/);
    expect(() => readDailyRecord("date,flow\n2021-04-01,-1\n", "m3/s")).toThrow(/^line 2: flow -1 is negative/);
    expect(() => readDailyRecord("date,flow\n2021-04-01,1\n2021-04-01,2\n", "m3/s")).toThrow(/^line 3: date 2021-04-01 appears twice/);
    expect(() => readDailyRecord("day,q\n2021-04-01,1\n", "m3/s")).toThrow(/must name the columns date and flow/);
    expect(() => readDailyRecord("# only comments\n", "m3/s")).toThrow(/empty/);
  });
});

/** The command line, run as a user would (tsx). */
function cli(args: string[]) {
  const r = spawnSync(process.execPath, ["--import", "tsx", "scripts/design-flow-cli.ts", ...args], { encoding: "utf8" });
  return { code: r.status, out: r.stdout, err: r.stderr };
}

describe("npm run design-flow", () => {
  const dir = mkdtempSync(join(tmpdir(), "design-flow-"));
  // 12 complete climatic years, each with a known 7-day low: year k dips to (k + 1) for 7 days (hand-checked)
  const lines = ["date,flow"];
  for (let t = Date.UTC(2000, 3, 1); t < Date.UTC(2012, 3, 1); t += 86_400_000) {
    const d = new Date(t).toISOString().slice(0, 10);
    const k = Number(d.slice(0, 4)) - (d.slice(5) >= "04-01" ? 2000 : 2001);
    lines.push(`${d},${d.slice(5) >= "08-01" && d.slice(5) <= "08-07" ? k + 1 : 50}`);
  }
  const file = join(dir, "record.csv");
  writeFileSync(file, lines.join("\n"));

  it("prints the design flows as JSON, the same numbers as the library", { timeout: 30_000 }, () => {
    const r = cli([file, "--unit", "m3/s"]);
    expect(r.code, r.err).toBe(0);
    const out = JSON.parse(r.out);
    const lib = lowFlowStatistics(readDailyRecord(lines.join("\n"), "m3/s"));
    expect(out.years_used).toBe(12);
    expect(out.statistics.map((s: { name: string }) => s.name)).toEqual(["1Q10", "7Q10", "30Q5", "7Q2"]);
    expect(out.statistics[1]).toEqual({ ...lib.statistics[1], unit: "m3/s" });
    expect(Object.keys(out.lp3)).toEqual(["1", "7", "30"]);
    // the 7-day minima are 1…12 exactly
    expect(annualMinima(readDailyRecord(lines.join("\n"), "m3/s"), 7).minima.map((m) => m.flow)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);
  });

  it("refuses bad arguments and unreadable files with exit 2, naming the flag or the line", () => {
    const unit = cli([file, "--unit", "gallons"]);
    expect(unit.code).toBe(2);
    expect(unit.err).toMatch(/unit: unit must be "m3\/s" or "cfs"/);
    expect(cli([file, "--climatic-year-start", "4/1"]).err).toMatch(/--climatic-year-start: climatic year start must be MM-DD/);
    expect(cli([]).err).toMatch(/record: give the record file/);
    const missing = cli([join(dir, "nope.csv")]);
    expect(missing.code).toBe(2);
    expect(missing.err).toMatch(/nope\.csv: cannot read the file \(ENOENT\)/);
    const bad = join(dir, "bad.csv");
    writeFileSync(bad, "date,flow\n2021-04-01,x\n");
    const refused = cli([bad]);
    expect(refused.err).toMatch(/bad\.csv: line 2: flow "x" is not a number/);
    expect(refused.err).not.toMatch(/at .*\.ts:\d+/);
  }, 60_000);
});

describe("reading a daily water-temperature record", () => {
  it("reads CSV date,temperature in °C or °F (exact: 77 °F = 25 °C, 68 °F = 20 °C), a blank as a missing day, sorted by date", () => {
    const r = readDailyTemperature("date,temperature\n2021-07-02,77\n2021-07-01,68\n2021-07-03,\n", "F");
    expect(r.map((d) => d.date)).toEqual(["2021-07-01", "2021-07-02", "2021-07-03"]);
    expect(r[0].value).toBeCloseTo(20, 12);
    expect(r[1].value).toBeCloseTo(25, 12);
    expect(r[2].value).toBeNull();
    expect(readDailyTemperature("date,temperature\n2021-07-01,-1.5\n", "C")[0].value).toBe(-1.5);
  });

  it("reads rdb text: the first value column after datetime, qualifier words as missing days", () => {
    const rdb = "# a comment\nagency_cd\tsite_no\tdatetime\t00010_mean\t00010_mean_cd\n5s\t15s\t20d\t14n\t10s\nXX\t01\t2021-08-01\t24.5\tA\nXX\t01\t2021-08-02\tEqp\tA\n";
    const r = readDailyTemperature(rdb, "C");
    expect(r).toEqual([
      { date: "2021-08-01", value: 24.5 },
      { date: "2021-08-02", value: null },
    ]);
  });

  it("names the line of a value it cannot use", () => {
    expect(() => readDailyTemperature("date,temperature\n2021-07-01,warm\n", "C")).toThrow(/^line 2: temperature "warm" is not a number$/);
    // 120 °F is 48.9 °C: no river's daily mean; most likely the wrong unit
    expect(() => readDailyTemperature("date,temperature\n2021-07-01,75\n2021-07-02,120\n", "F")).toThrow(/^line 3: temperature 120 °F lies outside -2–45 °C for water/);
    expect(() => readDailyTemperature("date,flow\n2021-07-01,1\n", "C")).toThrow(/the header must name the columns date and temperature/);
    expect(() => readDailyTemperature("date,temperature\n2021-07-01,20\n2021-07-01,21\n", "C")).toThrow(/line 3: date 2021-07-01 appears twice/);
  });
});
