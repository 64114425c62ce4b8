import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { csvText, NOTES_HEADER } from "@/lib/reports/csv-text";

// Formula-leading cells (=, +, -, @, tab, CR) are the CSV-injection vectors a
// spreadsheet runs; the expected output is read back with papaparse's own parser.
const table = (cells: (string | number)[], notes = ["Plan =HYPERLINK(x)"]) => ({
  notes,
  columns: [{ header: "value", value: (r: { v: string | number }) => r.v }],
  rows: cells.map((v) => ({ v })),
});

/** The file as papaparse reads it with a header row: the rows as objects. */
const parsed = (text: string) => Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true });
const readBack = (text: string) => parsed(text).data.map((r) => r.value);

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

  it("one header row first, the notes in the last column one per row, neutralised like any cell", () => {
    const text = csvText(table(["a", "b", "c"], ["Planning-level estimates only.", "=HYPERLINK(x); @SUM(A1)"]));
    const lines = text.split("\r\n");
    expect(lines[0]).toBe(`value,${NOTES_HEADER}`);
    const p = parsed(text);
    expect(p.errors).toEqual([]);
    expect(p.meta.fields).toEqual(["value", NOTES_HEADER]);
    expect(p.data.map((r) => r[NOTES_HEADER])).toEqual(["Planning-level estimates only.", "'=HYPERLINK(x); @SUM(A1)", ""]);
    expect(p.data.map((r) => r.value)).toEqual(["a", "b", "c"]);
  });

  it("more notes than rows: the last row holds the rest; no rows: one row of empty cells holds them", () => {
    const two = parsed(csvText(table(["a"], ["one", "two", "three"]))).data;
    expect(two).toEqual([{ value: "a", [NOTES_HEADER]: "one two three" }]);
    const none = parsed(csvText(table([], ["one", "two"]))).data;
    expect(none).toEqual([{ value: "", [NOTES_HEADER]: "one two" }]);
    // no notes: no Notes column
    expect(csvText(table(["a"], [])).split("\r\n")[0]).toBe("value");
  });

  it("writes CRLF line ends, the last line too, and no line starts with #", () => {
    const text = csvText(table(["a"]));
    expect(text.endsWith("\r\n")).toBe(true);
    expect(text.replace(/\r\n/g, "")).not.toMatch(/\n/);
    for (const line of text.split("\r\n")) expect(line.startsWith("#")).toBe(false);
  });
});
