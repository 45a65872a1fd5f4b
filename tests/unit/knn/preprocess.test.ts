import { describe, expect, it } from "vitest";
import { fitPreprocessor, preprocessStateSchema, transformTable } from "@/lib/knn";

// Hand-computed: column [1, 2, 3, NaN] has present mean 2 and population sd √(2/3) ≈ 0.8165.
const input = {
  n: 4,
  numeric: Float32Array.from([1, 5, 2, 5, 3, 5, Number.NaN, 5]),
  numericWidth: 2,
  categorical: [["red", null, "blue", "red"]],
};

describe("preprocessing", () => {
  it("z-score: mean/population sd of present values; missing → mean; constant column → scale 1; one-hot sorted", () => {
    const state = fitPreprocessor(input, "zscore");
    expect(state.numeric[0].centre).toBeCloseTo(2, 12);
    expect(state.numeric[0].scale).toBeCloseTo(Math.sqrt(2 / 3), 12);
    expect(state.numeric[1]).toEqual({ centre: 5, scale: 1, fill: 5 });
    expect(state.categorical[0].categories).toEqual(["blue", "red"]);
    expect(state.width).toBe(4);
    const x = Array.from(transformTable(state, input));
    const s = Math.sqrt(2 / 3);
    const expected = [-1 / s, 0, 0, 1, 0, 0, 0, 0, 1 / s, 0, 1, 0, 0, 0, 0, 1];
    x.forEach((v, i) => expect(v).toBeCloseTo(expected[i], 6));
  });

  it("min-max maps to [0, 1]; none keeps values; unseen categories encode as zeros", () => {
    const mm = fitPreprocessor(input, "minmax");
    expect(Array.from(transformTable(mm, input)).filter((_, i) => i % 4 === 0)).toEqual([0, 0.5, 1, 0.5]);
    const none = fitPreprocessor(input, "none");
    const other = { n: 1, numeric: Float32Array.from([7, 8]), numericWidth: 2, categorical: [["green"]] };
    expect(Array.from(transformTable(none, other))).toEqual([7, 8, 0, 0]);
  });

  it("the fitted state is plain JSON that round-trips through its schema", () => {
    const state = fitPreprocessor(input, "zscore");
    const back = preprocessStateSchema.parse(JSON.parse(JSON.stringify(state)));
    expect(transformTable(back, input)).toEqual(transformTable(state, input));
    expect(() => transformTable(state, { ...input, numericWidth: 1, numeric: new Float32Array(4) })).toThrow(RangeError);
  });
});
