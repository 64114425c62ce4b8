import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { csvText } from "@/lib/reports/csv-text";

// Formula-leading cells (=, +, -, @, tab, CR) are the CSV-injection vectors a
// spreadsheet runs; the expected output is read back with papaparse's own parser.
const table = (cells: (string | number)[]) => ({
  preface: ["Plan =HYPERLINK(x)"],
  columns: [{ header: "value", value: (r: { v: string | number }) => r.v }],
  rows: cells.map((v) => ({ v })),
});

const readBack = (text: string) =>
  Papa.parse<string[]>(text.split("\r\n").filter((l) => !l.startsWith("#")).join("\r\n"), { skipEmptyLines: true }).data.slice(1).map((r) => r[0]);

describe("csvText", () => {
  it("neutralises formula-leading text cells with a leading quote", () => {
    const hostile = ['=HYPERLINK("http://x","y")', "@SUM(A1:A2)", "+1+1", "-2+3", "\t=1", "\r=1", "=cmd|' /C calc'!A0"];
    const back = readBack(csvText(table(hostile)));
    expect(back).toEqual(hostile.map((h) => `'${h}`));
  });

  it("neutralises a formula spread over several lines (papaparse's own default rule misses it)", () => {
    const multi = "=1+1\nsecond line";
    expect(Papa.unparse([[multi]], { escapeFormulae: true })).not.toContain("'");
    expect(readBack(csvText(table([multi])))).toEqual([`'${multi}`]);
    expect(readBack(csvText(table(["-1.5\n=2"])))).toEqual(["'-1.5\n=2"]);
  });

  it("leaves numbers, signed numeric text and ordinary text as they are", () => {
    const fine = [-1.5, 0, 12.25, "-0.42", "+3", "-1e-3", "Tamsel Creek WWTP", "a=b", "x@y"];
    expect(readBack(csvText(table(fine)))).toEqual(fine.map(String));
  });

  it("quotes a text cell holding a semicolon, so a spreadsheet splitting on ; keeps it one cell", () => {
    const text = csvText(table(["a;=HYPERLINK(x)"]));
    expect(text).toContain('"a;=HYPERLINK(x)"');
    expect(readBack(text)).toEqual(["a;=HYPERLINK(x)"]);
  });

  it("neutralises a formula that a comma or semicolon in a preface line would start as its own cell", () => {
    const text = csvText({ ...table(["a"]), preface: ["Basin Tamsel,=HYPERLINK(x); @SUM(A1)", "loads, today"] });
    const [first, second] = text.split("\r\n");
    expect(first).toBe("# Basin Tamsel,'=HYPERLINK(x); '@SUM(A1)");
    expect(second).toBe("# loads, today");
    for (const cell of first.split(/[,;]/)) expect(cell.trimStart()).not.toMatch(/^[=+\-@]/);
  });

  it("writes CRLF line ends, the last line too, and keeps preface lines as comments", () => {
    const text = csvText(table(["a"]));
    expect(text.endsWith("\r\n")).toBe(true);
    expect(text.split("\r\n")[0]).toBe("# Plan =HYPERLINK(x)");
    expect(text.replace(/\r\n/g, "")).not.toMatch(/\n/);
  });
});
