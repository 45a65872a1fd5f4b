import { describe, expect, it } from "vitest";
import { type AgreementInput, AgreementInputError, computeAgreement } from "@/lib/agreement";

// Three annotators, four items; rows: (item, annotator, label, took, blind, suggestion top). Counts in the
// expectations below are counted by hand from these rows.
const rows = [
  [0, 0, 1, 1, 0, 1],
  [0, 1, 1, 0, 0, 1],
  [0, 2, 0, 0, 1, 1],
  [1, 0, 2, 0, 1, 0],
  [1, 1, 2, 1, 0, 2],
  [2, 0, 0, 1, 0, 0],
  [2, 2, 0, 0, 1, 2],
  [3, 1, 1, 0, 1, 1],
] as const;

function input(): AgreementInput {
  const col = (i: number) => rows.map((r) => r[i]);
  return {
    itemCount: 4,
    annotatorCount: 3,
    classCount: 3,
    item: Int32Array.from(col(0)),
    annotator: Int32Array.from(col(1)),
    label: Int32Array.from(col(2)),
    tookSuggestion: Uint8Array.from(col(3)),
    blind: Uint8Array.from(col(4)),
    suggestionTop: Int32Array.from(col(5)),
    finalLabel: Int32Array.from([1, 2, 0, -1]),
    controlLabel: Int32Array.from([-1, 2, 2, -1]),
  };
}

describe("label quality figures (hand-counted)", () => {
  const report = computeAgreement(input(), { resamples: 0 });
  const byAnnotator = (a: number) => report.perAnnotator.find((x) => x.annotator === a)!;

  it("control-item accuracy per annotator and overall", () => {
    // Control items 1 (known 2) and 2 (known 2): annotator 0 gave 2 and 0, annotator 1 gave 2, annotator 2 gave 0.
    expect(byAnnotator(0).control).toMatchObject({ successes: 1, total: 2, value: 0.5 });
    expect(byAnnotator(1).control).toMatchObject({ successes: 1, total: 1, value: 1 });
    expect(byAnnotator(2).control).toMatchObject({ successes: 0, total: 1, value: 0 });
    expect(report.control).toMatchObject({ successes: 2, total: 4 });
  });

  it("take-rate counts only labels that had a suggestion on screen", () => {
    expect(byAnnotator(0).takeRate).toMatchObject({ successes: 2, total: 2 });
    expect(byAnnotator(1).takeRate).toMatchObject({ successes: 1, total: 2 });
    expect(byAnnotator(2).takeRate).toMatchObject({ successes: 0, total: 0, value: null });
    expect(report.suggestions!.takeRate).toMatchObject({ successes: 3, total: 4 });
  });

  it("suggestion accuracy against the final label is kept apart for blind and shown labels", () => {
    // Blind labels: rows 2, 3, 6, 7; item 3 has no final label. Top vs final: 1=1 yes, 0≠2 no, 2≠0 no.
    expect(report.suggestions!.blind.labels).toBe(4);
    expect(report.suggestions!.blind.topClassAccuracy).toMatchObject({ successes: 1, total: 3 });
    // Label equals top on blind rows: 0≠1, 2≠0, 0≠2, 1=1.
    expect(report.suggestions!.blind.labelMatchesTop).toMatchObject({ successes: 1, total: 4 });
    // Shown labels: rows 0, 1, 4, 5: tops 1, 1, 2, 0 vs finals 1, 1, 2, 0.
    expect(report.suggestions!.shown.topClassAccuracy).toMatchObject({ successes: 4, total: 4 });
  });

  it("per-annotator agreement with the final label", () => {
    // Annotator 0 rated items 0, 1, 2 with finals 1, 2, 0 and gave 1, 2, 0.
    expect(byAnnotator(0).matchesFinal).toMatchObject({ successes: 3, total: 3 });
    expect(byAnnotator(0).kappaVsFinal.value).toBeCloseTo(1, 12);
    // Annotator 2 rated items 0 and 2 (finals 1, 0) and gave 0, 0: marginals (0 twice) vs (1, 0) give p_e = 0.5.
    expect(byAnnotator(2).matchesFinal).toMatchObject({ successes: 1, total: 2 });
    expect(byAnnotator(2).kappaVsFinal.value).toBeCloseTo(0, 12);
  });

  it("omits suggestion figures when no per-label suggestion data is given", () => {
    const { tookSuggestion: _t, blind: _b, suggestionTop: _s, ...plain } = input();
    expect(computeAgreement(plain, { resamples: 0 }).suggestions).toBeNull();
  });
});

describe("input validation", () => {
  it("rejects a duplicate (item, annotator) rating", () => {
    const bad = input();
    bad.annotator[1] = 0;
    expect(() => computeAgreement(bad)).toThrow(AgreementInputError);
    expect(() => computeAgreement(bad)).toThrow(/annotator 0 rated item 0 more than once/);
  });

  it("rejects out-of-range indices and mismatched lengths", () => {
    expect(() => computeAgreement({ ...input(), label: Int32Array.from([1, 1, 0, 2, 2, 0, 0, 3]) })).toThrow(/label\[7\] = 3/);
    expect(() => computeAgreement({ ...input(), blind: new Uint8Array(3) })).toThrow(/blind has length 3/);
    expect(() => computeAgreement({ ...input(), finalLabel: Int32Array.from([1, 2, 0, -2]) })).toThrow(/finalLabel\[3\]/);
  });

  it("rejects bad options", () => {
    expect(() => computeAgreement(input(), { resamples: -1 })).toThrow(AgreementInputError);
    expect(() => computeAgreement(input(), { resamples: 1.5 })).toThrow(AgreementInputError);
  });

  it("gives null coefficients, not numbers, when nothing is pairable", () => {
    const single: AgreementInput = { itemCount: 2, annotatorCount: 1, classCount: 2, item: Int32Array.from([0, 1]), annotator: Int32Array.from([0, 0]), label: Int32Array.from([0, 1]) };
    const report = computeAgreement(single);
    expect(report.krippendorffAlpha.value).toBeNull();
    expect(report.fleissKappa).toMatchObject({ value: null, items: 0, ratersPerItem: null });
    expect(report.reading).toMatch(/cannot be computed/);
    expect(JSON.parse(JSON.stringify(report))).toEqual(report);
  });
});
