import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { exportIn, exportValue, formatIn, formatNumber, formatPercent, reductionText, roundDecimals, roundSignificant, toSi } from "@/lib/format/quantities";

describe("percentages and reductions as screens show them", () => {
  it("never prints -0.0", () => {
    expect(formatPercent(-0.02)).toBe("0.0");
    expect(formatPercent(-0.0)).toBe("0.0");
    expect(formatPercent(0.04)).toBe("0.0");
    expect(formatPercent(-0.06)).toBe("-0.1");
    expect(formatPercent(12.345)).toBe("12.3");
    expect(formatPercent(0.0004, 3)).toBe("0.000");
    expect(formatPercent(null)).toBe("—");
    expect(formatPercent(Number.NaN)).toBe("—");
  });

  it("says a reduction in words: a cut, no cut, or above today's load", () => {
    expect(reductionText(12.5)).toBe("12.5 % cut");
    expect(reductionText(-0.0000001)).toBe("no cut");
    expect(reductionText(0.0004)).toBe("no cut");
    expect(reductionText(-2)).toBe("2.0 % above today");
    expect(reductionText(null)).toBe("—");
  });

  it("keeps the unit conversions of formatIn (1 kg = 2.20462 lb; 1 m³/s = 35.3147 cfs)", () => {
    // 1 lb = 0.45359237 kg exactly (US customary definition); 1 ft = 0.3048 m exactly
    expect(formatIn("load", 100, "US")).toBe("220.5");
    expect(formatIn("flow", 1, "US")).toBe("35.31");
  });
});

// ---------------------------------------------------------------------------
// An exact oracle: a double is m·2^e exactly, so its decimal value is a finite decimal that
// BigInt arithmetic can hold and round without any floating-point step.

/** The exact value of a double as [sign, digits, scale]: value = sign · digits / 10^scale. */
function exact(x: number): { negative: boolean; digits: bigint; scale: number } {
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, x);
  const bits = view.getBigUint64(0);
  const negative = bits >> 63n === 1n;
  const exp = Number((bits >> 52n) & 0x7ffn);
  const frac = bits & ((1n << 52n) - 1n);
  const mantissa = exp === 0 ? frac : frac | (1n << 52n);
  const e = (exp === 0 ? 1 : exp) - 1075; // value = mantissa · 2^e
  if (e >= 0) return { negative, digits: mantissa << BigInt(e), scale: 0 };
  // m·2^e = m·5^(-e) / 10^(-e)
  return { negative, digits: mantissa * 5n ** BigInt(-e), scale: -e };
}

/** Round the exact value of `x` to `d` decimals, halves away from zero, as a decimal string. */
function exactRound(x: number, d: number): string {
  const { negative, digits, scale } = exact(x);
  let q: bigint;
  if (scale <= d) q = digits * 10n ** BigInt(d - scale);
  else {
    const div = 10n ** BigInt(scale - d);
    q = digits / div;
    if ((digits % div) * 2n >= div) q += 1n;
  }
  const s = q.toString().padStart(d + 1, "0");
  const text = d === 0 ? s : `${s.slice(0, -d)}.${s.slice(-d)}`;
  return q === 0n || !negative ? text : `-${text}`;
}

/** The exact decimal product of two decimal strings, as a string Number() reads to its nearest double. */
function exactProduct(a: string, b: string): string {
  const parse = (s: string) => {
    const [i, f = ""] = s.replace("-", "").split(".");
    return { n: BigInt(i + f) * (s.startsWith("-") ? -1n : 1n), scale: f.length };
  };
  const x = parse(a);
  const y = parse(b);
  const n = x.n * y.n;
  const scale = x.scale + y.scale;
  const abs = (n < 0n ? -n : n).toString().padStart(scale + 1, "0");
  return `${n < 0n ? "-" : ""}${abs.slice(0, abs.length - scale)}.${abs.slice(abs.length - scale) || "0"}`;
}

describe("rounding rules against exact arithmetic", () => {
  it("the oracle itself reads doubles exactly (0.1 is 0.1000000000000000055511151231257827…)", () => {
    expect(exactRound(0.1, 20)).toBe("0.10000000000000000555");
    expect(exactRound(2.5, 0)).toBe("3");
    expect(exactRound(-2.5, 0)).toBe("-3");
    expect(exactRound(1.005, 2)).toBe("1.00"); // 1.005 is 1.00499999999999989… as a double
  });

  it("roundDecimals agrees with the exact rounding for any double and never returns -0", () => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.integer({ min: 0, max: 6 }), (x, d) => {
        const r = roundDecimals(x, d);
        expect(Object.is(r, -0)).toBe(false);
        expect(r).toBe(Number(exactRound(x, d)) || 0);
      }),
      { numRuns: 2000 },
    );
  });

  it("roundSignificant keeps the stated figures (0.000428219 → 0.000428, 14.092 → 14.1) and never -0", () => {
    expect(roundSignificant(0.000428219, 3)).toBe(0.000428);
    expect(roundSignificant(14.092, 3)).toBe(14.1);
    expect(Object.is(roundSignificant(-1e-30, 3), -0)).toBe(false);
    expect(Object.is(roundDecimals(-0.0004, 2), -0)).toBe(false);
    fc.assert(
      fc.property(fc.double({ min: 1e-9, max: 1e9, noNaN: true }), fc.integer({ min: 1, max: 8 }), (x, s) => {
        const r = roundSignificant(x, s);
        const digitsAfter = (v: number) => v.toExponential().split("e")[0].replace(/[-.]/g, "").replace(/0+$/, "").length;
        expect(digitsAfter(r)).toBeLessThanOrEqual(s);
        expect(Math.abs(r - x)).toBeLessThanOrEqual(0.5 * 10 ** (Math.floor(Math.log10(x)) - s + 1) * (1 + 1e-12));
      }),
      { numRuns: 2000 },
    );
  });
});

describe("one rule per quantity", () => {
  it("screens: DO 0.01, concentration 0.1, rate and dual 3 significant figures, percent 0.1, no -0", () => {
    expect(formatNumber("do", 7.543511140482473)).toBe("7.54");
    expect(formatNumber("do", -0.001)).toBe("0.00");
    expect(formatNumber("concentration", 29.96)).toBe("30.0");
    expect(formatNumber("rate", 14.092)).toBe("14.1");
    expect(formatNumber("rate", 0.2304)).toBe("0.230");
    expect(formatNumber("rate", 123.4)).toBe("123");
    expect(formatNumber("dual", 0.000428219)).toBe("0.000428");
    expect(formatNumber("dual", 2204.6)).toBe("2200");
    expect(formatNumber("dual", 4.2e-8)).toBe("4.20 × 10⁻⁸");
    expect(formatNumber("percent", -0.04)).toBe("0.0");
    expect(formatNumber("percent", -0.06)).toBe("-0.1");
    expect(formatNumber("length", 12.345)).toBe("12.35"); // 12.345 is 12.3450000000000006… as a double
    expect(formatNumber("flow", 0.0424, "SI")).toBe("0.042");
    expect(formatNumber("flow", 1.5, "US")).toBe("1.50");
    expect(formatNumber("do", null)).toBe("—");
  });

  it("exports: the stated precision per quantity, float noise gone", () => {
    expect(exportValue("do", 7.543511140482473)).toBe(7.544);
    expect(exportValue("depth", 0.32004000000000005)).toBe(0.32);
    expect(exportValue("rate", 14.0923)).toBe(14.09);
    expect(exportValue("flow", 0.028316846592)).toBe(0.02832);
    expect(exportValue("percent", -0.001)).toBe(0);
    expect(Object.is(exportValue("percent", -0.001), -0)).toBe(false);
    expect(exportValue("load", null)).toBeNull();
    // 1 ft = 0.3048 m exactly: 1.05 ft shown in US units exports as 1.050 ft, not 1.0500000000000000444
    expect(exportIn("depth", 0.32004, "US")).toBe(1.05);
    expect(exportIn("load", 100, "US")).toBe(220.46); // 100 / 0.45359237 = 220.4622…
  });
});

describe("typed US values stored in SI without float noise", () => {
  it("1.05 ft is stored as 0.32004 m (exact product), not 0.32004000000000005", () => {
    expect(1.05 * 0.3048).not.toBe(0.32004); // the float noise this guards against
    expect(toSi("depth", 1.05, "US")).toBe(0.32004);
    expect(toSi("depth", 1.05, "SI")).toBe(1.05);
  });

  it("feet and miles: the stored value is the double nearest the exact decimal product", () => {
    // 0.3048 (4 digits) and 1.609344 (7) are exact by definition (NIST SP 811): up to 8 and 5
    // typed significant digits keep the product within the 12 digits stored
    const typed = (digits: number) =>
      fc.tuple(fc.integer({ min: 1, max: 10 ** digits - 1 }), fc.integer({ min: 0, max: digits - 1 })).map(([n, d]) => (n / 10 ** d).toFixed(d));
    fc.assert(
      fc.property(typed(8), typed(5), (ft, mi) => {
        expect(toSi("depth", Number(ft), "US")).toBe(Number(exactProduct(ft, "0.3048")));
        expect(toSi("length", Number(mi), "US")).toBe(Number(exactProduct(mi, "1.609344")));
      }),
      { numRuns: 1000 },
    );
  });

  it("cfs (0.3048³ = 0.028316846592 m³/s, 11 digits): within 5e-12 of the exact product and no more than 12 figures", () => {
    const typed = fc.tuple(fc.integer({ min: 1, max: 99_999 }), fc.integer({ min: 0, max: 3 })).map(([n, d]) => (n / 10 ** d).toFixed(d));
    fc.assert(
      fc.property(typed, (s) => {
        const stored = toSi("flow", Number(s), "US");
        const want = Number(exactProduct(s, "0.028316846592"));
        expect(Math.abs(stored - want) / want).toBeLessThan(5e-12);
        expect(stored.toExponential().split("e")[0].replace(/[-.]/g, "").length).toBeLessThanOrEqual(12);
      }),
      { numRuns: 1000 },
    );
  });
});
