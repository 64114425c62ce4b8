import { describe, expect, it } from "vitest";
import { fitLp3, lp3Quantile } from "@/lib/hydrology/low-flow";
import { frequencyPlot } from "@/lib/results/frequency-plot";

describe("low-flow frequency plot", () => {
  it("puts each year at its Weibull plotting position (hand-checked: 4 years, ranks 1–4 of n + 1 = 5)", () => {
    const minima = [
      { year: 2001, flow: 3 },
      { year: 2002, flow: 1 },
      { year: 2003, flow: 4 },
      { year: 2004, flow: 2 },
    ];
    const plot = frequencyPlot(minima, fitLp3(minima.map((m) => m.flow)));
    // the lowest minimum (rank 1) is the rarest: T = 5/1; the highest (rank 4): T = 5/4
    expect(plot.points).toEqual([
      { year: 2002, flow_m3_s: 1, return_period_years: 5 },
      { year: 2004, flow_m3_s: 2, return_period_years: 2.5 },
      { year: 2001, flow_m3_s: 3, return_period_years: 5 / 3 },
      { year: 2003, flow_m3_s: 4, return_period_years: 1.25 },
    ]);
    expect(plot.zero_years).toBe(0);
    // the curve is the fit's own quantiles, falling as the return period grows
    const fit = fitLp3([3, 1, 4, 2]);
    expect(plot.curve.find((c) => c.return_period_years === 10)!.flow_m3_s).toBe(lp3Quantile(fit, 10));
    for (let i = 1; i < plot.curve.length; i++) expect(plot.curve[i].flow_m3_s).toBeLessThan(plot.curve[i - 1].flow_m3_s);
  });

  it("counts zero minima instead of plotting them, and draws no curve without a fit", () => {
    const plot = frequencyPlot(
      [
        { year: 1, flow: 0 },
        { year: 2, flow: 2 },
      ],
      undefined,
    );
    expect(plot.zero_years).toBe(1);
    expect(plot.points).toHaveLength(1);
    expect(plot.curve).toEqual([]);
  });
});
