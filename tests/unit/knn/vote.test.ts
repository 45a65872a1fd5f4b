import { describe, expect, it } from "vitest";
import { ExactIndex, suggest, vote, type Neighbour } from "@/lib/knn";

const nb = (id: number, classIndex: number, distance: number): Neighbour => ({ id, classIndex, distance });

describe("distance-weighted votes against published worked examples", () => {
  it("McCaffrey, 'Weighted k-NN Classification Using Python', Visual Studio Magazine, 10 Apr 2019: k = 6, query (0.62, 0.35)", () => {
    // The six nearest of his 30 demo points (listed with distances in his blog post of 3 May 2022);
    // the article gives the voting values (0.5711, 0.1782, 0.2508) for classes (0, 1, 2).
    const near = [[0.61, 0.42, 0], [0.55, 0.32, 0], [0.55, 0.41, 1], [0.64, 0.24, 2], [0.49, 0.32, 0], [0.71, 0.22, 2]];
    const far = [[0.1, 0.9, 1], [0.95, 0.95, 1], [0.05, 0.05, 2]];
    const points = [...near, ...far];
    const index = ExactIndex.from(
      Float32Array.from(points.flatMap((p) => [p[0], p[1]])), 2, points.map((p) => p[2]),
    );
    const s = suggest(index, [0.62, 0.35], { k: 6, numClasses: 3, weighting: "inverse" });
    expect(s.neighbours.map((n) => n.id)).toEqual([0, 1, 2, 3, 4, 5]);
    expect(s.neighbours[0].distance).toBeCloseTo(0.0707, 4);
    expect(s.shares[0]).toBeCloseTo(0.5711, 3);
    expect(s.shares[1]).toBeCloseTo(0.1782, 3);
    expect(s.shares[2]).toBeCloseTo(0.2508, 3);
    expect(s.top).toBe(0);
  });

  it("McCaffrey, 'Determining Weights for Weighted k-NN Classification', blog, 7 Feb 2019: inverse weights", () => {
    // Distances 0.1234 (class 1), 0.2076 (0), 0.3588 (0), 0.5032 (1), 0.7505 (2); published inverse
    // weights 0.4259, 0.2532, 0.1465, 0.1044, 0.0700 → class 0: 0.3997, class 1: 0.5303, class 2: 0.0700.
    const list = [nb(1, 1, 0.1234), nb(2, 0, 0.2076), nb(3, 0, 0.3588), nb(4, 1, 0.5032), nb(5, 2, 0.7505)];
    const w = vote(list, 3, "inverse");
    expect(w.shares[0]).toBeCloseTo(0.2532 + 0.1465, 3);
    expect(w.shares[1]).toBeCloseTo(0.4259 + 0.1044, 3);
    expect(w.shares[2]).toBeCloseTo(0.07, 3);
    expect(w.top).toBe(1);
    // Same post: uniform weights give 0.40 / 0.40 / 0.20, a tie between classes 0 and 1; Vicinal's
    // rule gives it to the nearest tied neighbour's class: the neighbour at 0.1234 is class 1.
    const u = vote(list, 3, "uniform");
    expect(Array.from(u.shares)).toEqual([0.4, 0.4, 0.2]);
    expect(u.top).toBe(1);
  });
});

describe("hand-computed votes", () => {
  it("inverse weights at distances 1, 2, 4 (classes A, B, B)", () => {
    // weights 1/1 = 1, 1/2 = 0.5, 1/4 = 0.25; total 1.75 → A = 1/1.75 = 4/7, B = 0.75/1.75 = 3/7.
    const v = vote([nb(7, 0, 1), nb(8, 1, 2), nb(9, 1, 4)], 2, "inverse");
    expect(v.shares[0]).toBeCloseTo(4 / 7, 12);
    expect(v.shares[1]).toBeCloseTo(3 / 7, 12);
    expect(v.top).toBe(0);
    // uniform: A = 1/3, B = 2/3.
    const u = vote([nb(7, 0, 1), nb(8, 1, 2), nb(9, 1, 4)], 2, "uniform");
    expect(Array.from(u.shares)).toEqual([1 / 3, 2 / 3]);
    expect(u.top).toBe(1);
  });

  it("an exact duplicate decides alone; several at 0 vote uniformly among themselves", () => {
    const one = vote([nb(1, 2, 0), nb(2, 0, 0.01), nb(3, 0, 0.01)], 3, "inverse");
    expect(Array.from(one.shares)).toEqual([0, 0, 1]);
    const two = vote([nb(1, 2, 0), nb(4, 1, 0), nb(5, 1, 0), nb(2, 0, 0.01)], 3, "inverse");
    // three duplicates: class 2 once, class 1 twice → 1/3, 2/3.
    expect(two.shares[1]).toBeCloseTo(2 / 3, 12);
    expect(two.shares[2]).toBeCloseTo(1 / 3, 12);
    expect(two.shares[0]).toBe(0);
    expect(two.top).toBe(1);
  });

  it("equal votes → the class of the nearest tied neighbour (not the farthest, as ml-knn does)", () => {
    // A at 1 and 4, B at 2 and 3: 2–2 tie; nearest tied neighbour (distance 1) is A.
    expect(vote([nb(1, 0, 1), nb(2, 1, 2), nb(3, 1, 3), nb(4, 0, 4)], 2).top).toBe(0);
    // B nearest this time.
    expect(vote([nb(2, 1, 1), nb(1, 0, 2), nb(3, 1, 3), nb(4, 0, 4)], 2).top).toBe(1);
    // A third class with fewer votes, nearest of all, does not win the tie between the leaders.
    expect(vote([nb(9, 2, 0.5), nb(2, 1, 1), nb(1, 0, 2), nb(3, 1, 3), nb(4, 0, 4)], 3).top).toBe(1);
    // weighted tie: A at 1 (weight 1) vs B at 2 and 2 (0.5 + 0.5) → nearest is A.
    expect(vote([nb(5, 0, 1), nb(6, 1, 2), nb(7, 1, 2)], 2, "inverse").top).toBe(0);
  });

  it("non-voters are ignored; nobody voting gives top −1 and zero shares", () => {
    expect(vote([nb(1, -1, 0.1), nb(2, 1, 1)], 2).top).toBe(1);
    const none = vote([nb(1, -1, 0.1)], 2);
    expect(none.top).toBe(-1);
    expect(Array.from(none.shares)).toEqual([0, 0]);
    expect(() => vote([nb(1, 5, 1)], 2)).toThrow(RangeError);
  });
});
