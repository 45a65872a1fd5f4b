import { describe, expect, it } from "vitest";
import { computeAgreement } from "@/lib/agreement";
import { fromCounts, fromMatrix, fromTable } from "./helpers";

describe("published worked examples", () => {
  it("Krippendorff (2011) 'Computing Krippendorff's Alpha-Reliability', nominal example, 4 observers × 12 units with missing values: α = 0.743", () => {
    // Reliability data matrix recalled from memory (values 1–5 shifted to 0–4; null = missing); the published
    // nominal alpha 0.743 is reproduced, which checks the recollection.
    const _ = null;
    const matrix = [
      [1, 2, 3, 3, 2, 1, 4, 1, 2, _, _, _],
      [1, 2, 3, 3, 2, 2, 4, 1, 2, 5, _, 3],
      [_, 3, 3, 3, 2, 3, 4, 2, 2, 5, 1, _],
      [1, 2, 3, 3, 2, 4, 4, 1, 2, 5, 1, _],
    ].map((row) => row.map((v) => (v === null ? null : v - 1)));
    const report = computeAgreement(fromMatrix(matrix, 5), { resamples: 0 });
    expect(report.krippendorffAlpha.value).toBeCloseTo(0.743, 3);
    // Same source: unit 12 has a single value, so n = 40 pairable values in 11 units.
    expect(report.pairableItems).toBe(11);
    expect(report.perClass.reduce((s, c) => s + c.ratings, 0)).toBe(40);
  });

  it("Fleiss' kappa: the 10 subjects × 14 raters × 5 categories worked example of the Wikipedia article 'Fleiss' kappa': κ = 0.210", () => {
    // Table and the values P̄ = 0.378, P̄e = 0.213, κ = 0.210 recalled from memory.
    const counts = [
      [0, 0, 0, 0, 14],
      [0, 2, 6, 4, 2],
      [0, 0, 3, 5, 6],
      [0, 3, 9, 2, 0],
      [2, 2, 8, 1, 1],
      [7, 7, 0, 0, 0],
      [3, 2, 6, 3, 0],
      [2, 5, 3, 2, 2],
      [6, 5, 2, 1, 0],
      [0, 2, 2, 3, 7],
    ];
    const report = computeAgreement(fromCounts(counts), { resamples: 0 });
    expect(report.fleissKappa.value).toBeCloseTo(0.21, 3);
    expect(report.fleissKappa.items).toBe(10);
    expect(report.fleissKappa.ratersPerItem).toBe(14);
    // Percent agreement here is Fleiss' P̄ (mean share of agreeing rater pairs per subject).
    expect(report.percentAgreement.value).toBeCloseTo(0.378, 3);
  });

  it("Cohen's kappa: Fleiss, Levin & Paik (2003) 'Statistical Methods for Rates and Proportions', 3rd ed., Table 18.1 (two psychiatrists, 100 subjects, 3 diagnoses): κ = 0.676", () => {
    // Cell counts recalled from memory; p_o = 0.89 and p_e = 0.66 follow from them.
    const report = computeAgreement(fromTable([[75, 1, 4], [5, 4, 1], [0, 0, 10]]), { resamples: 0 });
    expect(report.cohenKappa).toHaveLength(1);
    expect(report.cohenKappa[0].n).toBe(100);
    expect(report.cohenKappa[0].kappa.value).toBeCloseTo(0.676, 3);
    expect(report.percentAgreement.value).toBeCloseTo(0.89, 10);
  });

  it("Cohen's kappa: the 50-proposal example of the Wikipedia article 'Cohen's kappa' (20 yes/yes, 5, 10, 15 no/no): κ = 0.4", () => {
    // Recalled from memory: p_o = 0.7, p_e = 0.5.
    const report = computeAgreement(fromTable([[20, 5], [10, 15]]), { resamples: 0 });
    expect(report.cohenKappa[0].kappa.value).toBeCloseTo(0.4, 10);
    // With two raters, the per-annotator kappa against the others is Cohen's kappa itself.
    expect(report.perAnnotator[0].kappaVsOthers.value).toBeCloseTo(0.4, 10);
    expect(report.perAnnotator[1].kappaVsOthers.value).toBeCloseTo(0.4, 10);
  });
});
