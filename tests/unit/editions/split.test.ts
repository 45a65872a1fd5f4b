// Stratified train/validation/test split: sizes, stratification on real class counts, determinism.
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { assignSplits, splitKey, splitSizes } from "@/lib/editions/split";

const f = { seed: 7, train: 0.7, validation: 0.15, test: 0.15 };

describe("splitSizes (largest remainders)", () => {
  it("floors each share and hands leftovers to the largest remainders, ties to train, then validation", () => {
    // 10 × (0.7, 0.15, 0.15) = (7, 1.5, 1.5): floors 7, 1, 1; one left, tie of 0.5 and 0.5 → validation.
    expect(splitSizes(10, f)).toEqual([7, 2, 1]);
    // 7 × (0.7, 0.15, 0.15) = (4.9, 1.05, 1.05): floors 4, 1, 1; one left → train (remainder 0.9).
    expect(splitSizes(7, f)).toEqual([5, 1, 1]);
    expect(splitSizes(0, f)).toEqual([0, 0, 0]);
    expect(splitSizes(1, f)).toEqual([1, 0, 0]);
    expect(splitSizes(3, { train: 1 / 3, validation: 1 / 3, test: 1 / 3 })).toEqual([1, 1, 1]);
    expect(splitSizes(5, { train: 0, validation: 0, test: 1 })).toEqual([0, 0, 5]);
  });

  it("always sums to n", () => {
    for (let n = 0; n < 200; n += 1) {
      const s = splitSizes(n, { train: 0.6, validation: 0.25, test: 0.15 });
      expect(s[0] + s[1] + s[2]).toBe(n);
    }
  });
});

describe("assignSplits on the Palmer penguins (vega-datasets penguins.json, species as strata)", () => {
  const penguins = JSON.parse(readFileSync("node_modules/vega-datasets/data/penguins.json", "utf8")) as Array<{ Species: string }>;
  const species = [...new Set(penguins.map((p) => p.Species))];
  const ids = Int32Array.from(penguins.map((_, i) => 1000 + i * 3));
  const strata = Int32Array.from(penguins.map((p) => species.indexOf(p.Species)));

  it("gives every species its own 70/15/15 cut (within one row of the exact share)", () => {
    expect(penguins.length).toBe(344);
    const parts = assignSplits({ ids, strata, options: f });
    for (let s = 0; s < species.length; s += 1) {
      const rows = [...strata.keys()].filter((i) => strata[i] === s);
      const counts = [0, 1, 2].map((p) => rows.filter((i) => parts[i] === p).length);
      expect(counts).toEqual(splitSizes(rows.length, f));
      expect(Math.abs(counts[0] - rows.length * 0.7)).toBeLessThanOrEqual(1);
    }
  });

  it("is deterministic: same seed, same parts, whatever order the rows arrive in", () => {
    const a = assignSplits({ ids, strata, options: f });
    const order = [...ids.keys()].reverse();
    const b = assignSplits({ ids: order.map((i) => ids[i]), strata: order.map((i) => strata[i]), options: f });
    order.forEach((i, j) => expect(b[j]).toBe(a[i]));
    expect(assignSplits({ ids, strata, options: f })).toEqual(a);
  });

  it("changes with the seed", () => {
    const a = assignSplits({ ids, strata, options: f });
    const b = assignSplits({ ids, strata, options: { ...f, seed: 8 } });
    const moved = a.filter((p, i) => p !== b[i]).length;
    expect(moved).toBeGreaterThan(20);
  });

  it("keeps most rows in their part when new items are added", () => {
    const a = assignSplits({ ids, strata, options: f });
    const more = Int32Array.from([...ids, ...Array.from({ length: 20 }, (_, i) => 5000 + i)]);
    const moreStrata = Int32Array.from([...strata, ...Array.from({ length: 20 }, (_, i) => i % 3)]);
    const b = assignSplits({ ids: more, strata: moreStrata, options: f });
    const kept = a.filter((p, i) => p === b[i]).length;
    expect(kept / a.length).toBeGreaterThan(0.9);
  });

  it("draws keys in [0, 1) that differ per item", () => {
    const keys = new Set(Array.from(ids, (id) => splitKey(7, id)));
    expect(keys.size).toBe(ids.length);
    for (const k of keys) expect(k >= 0 && k < 1).toBe(true);
  });
});
