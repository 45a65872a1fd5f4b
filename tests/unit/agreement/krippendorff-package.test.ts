import { alpha as referenceAlpha } from "krippendorff";
import { describe, expect, it } from "vitest";
import { computeAgreement, createRandom } from "@/lib/agreement";
import { fromMatrix } from "./helpers";

/** Seeded rater × unit matrix with missing values and a shared truth so that agreement is neither 0 nor 1. */
function randomMatrix(seed: number, raters: number, units: number, classes: number, missing: number, accuracy: number) {
  const random = createRandom(seed);
  const truth = Array.from({ length: units }, () => Math.floor(random() * classes));
  return Array.from({ length: raters }, () =>
    truth.map((t) => {
      if (random() < missing) return null;
      return random() < accuracy ? t : Math.floor(random() * classes);
    }),
  );
}

describe("Krippendorff's alpha against the npm package krippendorff 0.1.0 (nominal, missing = undefined)", () => {
  for (const [seed, raters, units, classes, missing, accuracy] of [
    [1, 3, 30, 3, 0.2, 0.7],
    [2, 4, 40, 4, 0.35, 0.5],
    [3, 5, 25, 2, 0.3, 0.8],
    [4, 2, 50, 5, 0.1, 0.3],
    [5, 6, 20, 6, 0.5, 0.6],
  ] as const) {
    it(`seed ${seed}: ${raters} raters × ${units} units, ${classes} classes, ${missing * 100}% missing`, () => {
      const matrix = randomMatrix(seed, raters, units, classes, missing, accuracy);
      // The package wants every rater's row at full unit count, with undefined for a missing rating.
      const expected = referenceAlpha(matrix.map((row) => row.map((v) => (v === null ? undefined : v))));
      const ours = computeAgreement(fromMatrix(matrix, classes), { resamples: 0 }).krippendorffAlpha.value;
      expect(Number.isFinite(expected)).toBe(true);
      expect(ours).not.toBeNull();
      expect(ours!).toBeCloseTo(expected, 10);
    });
  }
});
