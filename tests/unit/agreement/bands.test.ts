import { describe, expect, it } from "vitest";
import { coefficient, describeCoefficient, describePercent, formatCoefficient, landisKochBand, wilsonProportion } from "@/lib/agreement";

describe("Landis & Koch (1977) reading bands", () => {
  // Table of Landis & Koch (1977), Biometrics 33:165: <0 poor, 0.00–0.20 slight, 0.21–0.40 fair,
  // 0.41–0.60 moderate, 0.61–0.80 substantial, 0.81–1.00 almost perfect.
  it.each([
    [-0.5, "poor"],
    [-0.01, "poor"],
    [-0.004, "slight"], // shown as 0.00
    [0, "slight"],
    [0.2, "slight"],
    [0.2049, "slight"], // shown as 0.20
    [0.2051, "fair"], // shown as 0.21
    [0.21, "fair"],
    [0.4, "fair"],
    [0.41, "moderate"],
    [0.6, "moderate"],
    [0.61, "substantial"],
    [0.8, "substantial"],
    [0.81, "almost perfect"],
    [1, "almost perfect"],
  ])("%d reads as %s (edges closed above, compared at the two decimals shown)", (value, band) => {
    expect(landisKochBand(value)).toBe(band);
  });

  it("a value that only floating-point noise lifts past an edge keeps the band of its printed number", () => {
    expect(0.2 * 3).toBeGreaterThan(0.6);
    expect(landisKochBand(0.2 * 3)).toBe("moderate");
    expect(formatCoefficient(0.2 * 3)).toBe("0.60");
  });

  it("undefined values have no band", () => {
    expect(landisKochBand(null)).toBeNull();
    expect(landisKochBand(NaN)).toBeNull();
  });
});

describe("reading sentences", () => {
  it("names the band, the symbol, the value and the interval", () => {
    expect(describeCoefficient("α", 0.55, { lower: 0.49, upper: 0.61 })).toBe(
      "moderate agreement (α = 0.55, 95% CI 0.49–0.61; the interval spans moderate to substantial)",
    );
    expect(describeCoefficient("κ", 0.7, { lower: 0.65, upper: 0.75 })).toBe("substantial agreement (κ = 0.70, 95% CI 0.65–0.75)");
  });

  it("writes negative bounds with a true minus sign and 'to'", () => {
    expect(describeCoefficient("κ", 0.05, { lower: -0.1, upper: 0.18 })).toBe(
      "slight agreement (κ = 0.05, 95% CI −0.10 to 0.18; the interval spans poor to slight)",
    );
  });

  it("never gives a bare number: no interval and undefined values are said in words", () => {
    expect(describeCoefficient("α", 0.9, null)).toBe("almost perfect agreement (α = 0.90, no interval: too few items to resample)");
    expect(describeCoefficient("α", 0.9, null, "intervals not computed")).toBe("almost perfect agreement (α = 0.90, no interval: intervals not computed)");
    expect(describeCoefficient("α", null, null)).toMatch(/cannot be computed/);
    expect(describePercent(0.823, { lower: 0.8, upper: 0.85 })).toBe("raters agree on 82% of rating pairs (95% CI 80%–85%; not corrected for chance)");
    expect(coefficient("κ", 0.3, null)).toEqual({ value: 0.3, ci95: null, band: "fair", reading: expect.stringContaining("fair agreement (κ = 0.30") });
  });
});

describe("Wilson score interval", () => {
  it("matches Newcombe (1998), Statistics in Medicine 17:857, Table I: 81/263 → 0.2553–0.3662 (recalled from memory)", () => {
    const p = wilsonProportion(81, 263);
    expect(p.value).toBeCloseTo(0.308, 3);
    expect(p.ci95!.lower).toBeCloseTo(0.2553, 4);
    expect(p.ci95!.upper).toBeCloseTo(0.3662, 4);
  });

  it("gives no value for an empty denominator", () => {
    expect(wilsonProportion(0, 0)).toEqual({ successes: 0, total: 0, value: null, ci95: null });
  });
});
