import { describe, expect, it } from "vitest";
import { findDoubts, LOG_LOSS_EPSILON, reliability, tune } from "@/lib/knn";

// Hand case (1-D): x = 0, 1, 2, 5, 6 with classes A, A, B, B, B (A = 0, B = 1).
const set = { vectors: Float32Array.from([0, 1, 2, 5, 6]), dim: 1, classes: Int32Array.from([0, 0, 1, 1, 1]), numClasses: 2 };

describe("leave-one-out tuning on a hand case", () => {
  const [k1, k3] = tune(set, { ks: [1, 3] });

  it("k = 1: predictions A, A (tie 0 vs 2 → lower id 0), A, B, B → 4 of 5", () => {
    expect(k1).toMatchObject({ k: 1, distance: "euclidean", correct: 4, n: 5, accuracy: 0.8 });
    // F1(A) = 2·2/(2·2 + 1 + 0) = 0.8; F1(B) = 2·2/(2·2 + 0 + 1) = 0.8.
    expect(k1.macroF1).toBeCloseTo(0.8, 12);
    const e = LOG_LOSS_EPSILON;
    const right = Math.log((1 + e) / (1 + 2 * e));
    const wrong = Math.log(e / (1 + 2 * e));
    expect(k1.logLoss).toBeCloseTo(-(4 * right + wrong) / 5, 12);
  });

  it("k = 3: neighbours {1,2,5}→B, {0,2,5}→B, {1,0,5}→A, {6,2,1}→B, {5,2,1}→B → 2 of 5; reliability", () => {
    expect(k3).toMatchObject({ k: 3, correct: 2, n: 5, accuracy: 0.4 });
    // every top share is 2/3 → one bin [0.6, 0.7) with accuracy 0.4: ECE = |0.4 − 2/3|.
    const bin = k3.reliability.bins[6];
    expect(bin.count).toBe(5);
    expect(bin.accuracy).toBeCloseTo(0.4, 12);
    expect(k3.reliability.ece).toBeCloseTo(2 / 3 - 0.4, 12);
  });

  it("one search of max k serves every k: same figures as tuning each k alone", () => {
    const [alone] = tune(set, { ks: [3] });
    expect(alone).toEqual(k3);
  });

  it("reliability: ECE is the count-weighted gap between accuracy and mean top share", () => {
    // bins: [0.5, 0.6): shares 0.5, 0.5, one right → |0.5 − 0.5| = 0; [0.9, 1]: 1, 1, both right → 0.
    expect(reliability([0.5, 0.5, 1, 1], [true, false, true, true]).ece).toBe(0);
    // [0.9, 1]: shares 1 and 1, one right → gap 0.5, weight 2/2.
    expect(reliability([1, 1], [true, false]).ece).toBeCloseTo(0.5, 12);
  });
});

describe("doubts", () => {
  it("ranks labelled items by the share their own label gets, lowest first", () => {
    // k = 1: item 2 (B) has nearest 1 (A) → own share 0; every other item has own share 1.
    const doubts = findDoubts(set, { k: 1 });
    expect(doubts[0]).toEqual({ id: 2, classIndex: 1, ownShare: 0, top: 0 });
    expect(doubts.slice(1).map((d) => d.ownShare)).toEqual([1, 1, 1, 1]);
    expect(doubts.slice(1).map((d) => d.id)).toEqual([0, 1, 3, 4]);
  });
});
