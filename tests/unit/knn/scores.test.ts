import { describe, expect, it } from "vitest";
import { entropy, leastConfident, margin, orderByScore, randomOrder } from "@/lib/knn";

describe("ordering scores (hand-computed)", () => {
  it("shares (0.5, 0.3, 0.2): least confident 0.5, margin 0.2, entropy −Σ s ln s", () => {
    const s = [0.5, 0.3, 0.2];
    expect(leastConfident(s)).toBeCloseTo(0.5, 12);
    expect(margin(s)).toBeCloseTo(0.2, 12);
    // 0.5·ln 2 + 0.3·ln(10/3) + 0.2·ln 5 ≈ 0.3466 + 0.3612 + 0.3219 = 1.0297
    expect(entropy(s)).toBeCloseTo(0.5 * Math.log(2) + 0.3 * Math.log(10 / 3) + 0.2 * Math.log(5), 12);
    expect(entropy([1, 0, 0])).toBe(0);
    expect(margin([0.5, 0.5])).toBe(0);
  });

  it("orders: entropy descending, margin ascending, equal scores by lower id", () => {
    expect(Array.from(orderByScore([0.1, 0.9, 0.9, 0.5], [4, 9, 2, 1], "entropy"))).toEqual([2, 1, 3, 0]);
    expect(Array.from(orderByScore([0.1, 0.9, 0.1], [5, 1, 3], "margin"))).toEqual([2, 0, 1]);
  });

  it("random order is a seeded permutation", () => {
    const a = randomOrder(50, 7);
    expect(Array.from(a)).toEqual(Array.from(randomOrder(50, 7)));
    expect([...a].sort((x, y) => x - y)).toEqual([...Array(50).keys()]);
    expect(Array.from(a)).not.toEqual(Array.from(randomOrder(50, 8)));
  });
});
