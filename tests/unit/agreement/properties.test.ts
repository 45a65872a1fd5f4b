import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { type AgreementInput, type AgreementReport, computeAgreement, createRandom, landisKochBand } from "@/lib/agreement";
import { fromMatrix } from "./helpers";

const RUNS = { numRuns: 60, seed: 20260601 };

/** Rater × unit matrices with missing ratings (null), 2–5 raters, 4–30 units, classes 0..k-1. */
const matrixArb = fc
  .record({ raters: fc.integer({ min: 2, max: 5 }), units: fc.integer({ min: 4, max: 30 }), k: fc.integer({ min: 2, max: 4 }) })
  .chain(({ raters, units, k }) =>
    fc.record({
      k: fc.constant(k),
      matrix: fc.array(fc.array(fc.option(fc.integer({ min: 0, max: k - 1 }), { nil: null, freq: 4 }), { minLength: units, maxLength: units }), {
        minLength: raters,
        maxLength: raters,
      }),
    }),
  );

const close = (a: number | null, b: number | null) => {
  if (a === null || b === null) expect(a).toBe(b);
  else expect(a).toBeCloseTo(b, 10);
};

function expectSamePoints(x: AgreementReport, y: AgreementReport) {
  close(x.krippendorffAlpha.value, y.krippendorffAlpha.value);
  close(x.fleissKappa.value, y.fleissKappa.value);
  close(x.percentAgreement.value, y.percentAgreement.value);
  expect(x.cohenKappa.length).toBe(y.cohenKappa.length);
  x.cohenKappa.forEach((pair, i) => close(pair.kappa.value, y.cohenKappa[i].kappa.value));
  x.perAnnotator.forEach((a, i) => close(a.kappaVsOthers.value, y.perAnnotator[i].kappaVsOthers.value));
}

describe("properties (fast-check)", () => {
  it("perfect agreement gives 1 for every defined coefficient", () => {
    fc.assert(
      fc.property(matrixArb, fc.array(fc.integer({ min: 0, max: 3 }), { minLength: 30, maxLength: 30 }), ({ k, matrix }, truth) => {
        const perfect = matrix.map((row) => row.map((v, u) => (v === null ? null : truth[u] % k)));
        const pairable = perfect[0].map((_, u) => perfect.filter((row) => row[u] !== null).length >= 2);
        fc.pre(new Set(perfect[0].map((_, u) => truth[u] % k).filter((_, u) => pairable[u])).size >= 2);
        const report = computeAgreement(fromMatrix(perfect, k), { resamples: 0 });
        expect(report.krippendorffAlpha.value).toBeCloseTo(1, 12);
        expect(report.percentAgreement.value).toBeCloseTo(1, 12);
        for (const v of [report.fleissKappa.value, ...report.cohenKappa.map((p) => p.kappa.value), ...report.perAnnotator.map((a) => a.kappaVsOthers.value)]) {
          if (v !== null) expect(v).toBeCloseTo(1, 12);
        }
      }),
      RUNS,
    );
  });

  it("with two classes, each class's one-vs-rest alpha is alpha itself (the split is the same)", () => {
    fc.assert(
      fc.property(matrixArb, ({ k, matrix }) => {
        const binary = matrix.map((row) => row.map((v) => (v === null ? null : v % 2)));
        const report = computeAgreement(fromMatrix(binary, 2), { resamples: 0 });
        close(report.perClass[0].alpha.value, report.krippendorffAlpha.value);
        close(report.perClass[1].alpha.value, report.krippendorffAlpha.value);
        return k >= 2;
      }),
      RUNS,
    );
  });

  it("is invariant under relabelling classes by a permutation", () => {
    fc.assert(
      fc.property(matrixArb, fc.integer(), ({ k, matrix }, seed) => {
        const random = createRandom(seed);
        const perm = Array.from({ length: k }, (_, c) => c);
        for (let i = k - 1; i > 0; i -= 1) {
          const j = Math.floor(random() * (i + 1));
          [perm[i], perm[j]] = [perm[j], perm[i]];
        }
        const relabelled = matrix.map((row) => row.map((v) => (v === null ? null : perm[v])));
        const x = computeAgreement(fromMatrix(matrix, k), { resamples: 0 });
        const y = computeAgreement(fromMatrix(relabelled, k), { resamples: 0 });
        expectSamePoints(x, y);
        x.perClass.forEach((c) => close(c.alpha.value, y.perClass[perm[c.class]].alpha.value));
      }),
      RUNS,
    );
  });

  it("is invariant under shuffling items and the order of the rating rows", () => {
    fc.assert(
      fc.property(matrixArb, fc.integer(), ({ k, matrix }, seed) => {
        const input = fromMatrix(matrix, k);
        const random = createRandom(seed);
        const itemPerm = Array.from({ length: input.itemCount }, (_, i) => i).sort(() => random() - 0.5);
        const rowOrder = Array.from({ length: input.item.length }, (_, r) => r).sort(() => random() - 0.5);
        const shuffled: AgreementInput = {
          ...input,
          item: Int32Array.from(rowOrder, (r) => itemPerm[input.item[r]]),
          annotator: Int32Array.from(rowOrder, (r) => input.annotator[r]),
          label: Int32Array.from(rowOrder, (r) => input.label[r]),
        };
        expectSamePoints(computeAgreement(input, { resamples: 0 }), computeAgreement(shuffled, { resamples: 0 }));
      }),
      RUNS,
    );
  });

  it("the bootstrap interval contains the point estimate for reasonable data (≥ 80 items, 3–5 raters, some disagreement)", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 3, max: 5 }),
        fc.integer({ min: 80, max: 150 }),
        fc.double({ min: 0.4, max: 0.9, noNaN: true }),
        fc.integer(),
        (raters, units, accuracy, seed) => {
          const random = createRandom(seed);
          const truth = Array.from({ length: units }, () => Math.floor(random() * 3));
          const matrix = Array.from({ length: raters }, () =>
            truth.map((t) => (random() < 0.15 ? null : random() < accuracy ? t : Math.floor(random() * 3))),
          );
          const report = computeAgreement(fromMatrix(matrix, 3), { resamples: 200, seed: 3 });
          for (const c of [report.krippendorffAlpha, report.fleissKappa, report.percentAgreement]) {
            expect(c.value).not.toBeNull();
            expect(c.ci95).not.toBeNull();
            expect(c.ci95!.lower).toBeLessThanOrEqual(c.value!);
            expect(c.ci95!.upper).toBeGreaterThanOrEqual(c.value!);
          }
        },
      ),
      { numRuns: 25, seed: 7 },
    );
  });

  it("the same seed gives the same intervals; another seed gives other ones", () => {
    const random = createRandom(9);
    const matrix = Array.from({ length: 4 }, () => Array.from({ length: 60 }, () => (random() < 0.2 ? null : Math.floor(random() * 3))));
    const input = fromMatrix(matrix, 3);
    const a = computeAgreement(input, { resamples: 100, seed: 5 });
    const b = computeAgreement(input, { resamples: 100, seed: 5 });
    const c = computeAgreement(input, { resamples: 100, seed: 6 });
    expect(a.krippendorffAlpha.ci95).toEqual(b.krippendorffAlpha.ci95);
    expect(a.krippendorffAlpha.ci95).not.toEqual(c.krippendorffAlpha.ci95);
  });

  it("bands are monotone in the value", () => {
    const order = ["poor", "slight", "fair", "moderate", "substantial", "almost perfect"];
    fc.assert(
      fc.property(fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }), (x, y) => {
        const [lo, hi] = x <= y ? [x, y] : [y, x];
        expect(order.indexOf(landisKochBand(lo)!)).toBeLessThanOrEqual(order.indexOf(landisKochBand(hi)!));
      }),
      RUNS,
    );
  });
});
