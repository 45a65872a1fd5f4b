import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ExactIndex, fitPreprocessor, suggest, transformTable } from "@/lib/knn";

// Property tests (fast-check): invariants that follow from the definitions in docs/knn.md.
const row = (d: number) => fc.array(fc.integer({ min: -50, max: 50 }), { minLength: d, maxLength: d });
const labelledRows = fc.integer({ min: 1, max: 4 }).chain((d) =>
  fc.record({
    d: fc.constant(d),
    rows: fc.array(fc.record({ x: row(d), c: fc.integer({ min: 0, max: 2 }) }), { minLength: 1, maxLength: 30 }),
    q: row(d),
    k: fc.integer({ min: 1, max: 40 }),
    weighting: fc.constantFrom("uniform" as const, "inverse" as const),
    metric: fc.constantFrom("euclidean" as const, "manhattan" as const, "cosine" as const),
  }),
);

function build(d: number, rows: { x: number[]; c: number }[], order: number[], metric: "euclidean" | "manhattan" | "cosine") {
  const index = new ExactIndex(d, metric, 1);
  for (const i of order) index.upsert(i, rows[i].x, rows[i].c);
  return index;
}

describe("k-NN properties", () => {
  it("vote shares sum to 1 and k ≥ n returns all n rows", () => {
    fc.assert(
      fc.property(labelledRows, ({ d, rows, q, k, weighting, metric }) => {
        const index = build(d, rows, rows.map((_, i) => i), metric);
        const s = suggest(index, q, { k, numClasses: 3, weighting });
        expect(s.neighbours.length).toBe(Math.min(k, rows.length));
        const sum = Array.from(s.shares).reduce((a, b) => a + b, 0);
        expect(sum).toBeCloseTo(1, 12);
        expect(s.shares[s.top]).toBe(Math.max(...s.shares));
      }),
    );
  });

  it("the result does not depend on row order", () => {
    fc.assert(
      fc.property(labelledRows, fc.integer(), ({ d, rows, q, k, weighting, metric }, seed) => {
        const order = rows.map((_, i) => i);
        const shuffled = [...order].sort((a, b) => ((a * 2654435761 + seed) % 97) - ((b * 2654435761 + seed) % 97));
        const a = suggest(build(d, rows, order, metric), q, { k, numClasses: 3, weighting });
        const b = suggest(build(d, rows, shuffled, metric), q, { k, numClasses: 3, weighting });
        expect(b).toEqual(a);
      }),
    );
  });

  it("z-scored features are unchanged when a column is multiplied by a positive constant", () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.integer({ min: -1000, max: 1000 }), fc.integer({ min: -1000, max: 1000 })), { minLength: 2, maxLength: 40 }),
        fc.double({ min: 0.01, max: 100, noNaN: true }),
        (ints, c) => {
          const pairs = ints.map(([a, b]) => [a / 10, b / 10]);
          const n = pairs.length;
          const plain = Float32Array.from(pairs.flat());
          const scaled = Float32Array.from(pairs.flatMap(([a, b]) => [a * c, b]));
          const enc = (numeric: Float32Array) => {
            const input = { n, numeric, numericWidth: 2, categorical: [] };
            return transformTable(fitPreprocessor(input, "zscore"), input);
          };
          const x = enc(plain);
          const y = enc(scaled);
          for (let i = 0; i < x.length; i += 1) expect(Math.abs(x[i] - y[i])).toBeLessThan(2e-3);
        },
      ),
    );
  });

  it("predictions are identical when a column is multiplied by a power of two (exact in floating point)", () => {
    fc.assert(
      fc.property(labelledRows, fc.integer({ min: -6, max: 6 }), ({ d, rows, q, k, weighting }, e) => {
        // A constant column keeps scale 1 (docs/knn.md), so the invariance holds for varying columns only.
        fc.pre(rows.some((r) => r.x[0] !== rows[0].x[0]));
        const c = 2 ** e;
        const n = rows.length;
        const enc = (factor: number) => {
          const numeric = Float32Array.from([...rows.flatMap((r) => [r.x[0] * factor, ...r.x.slice(1)]), q[0] * factor, ...q.slice(1)]);
          const all = { n: n + 1, numeric, numericWidth: d, categorical: [] };
          const fitted = fitPreprocessor({ n, numeric: numeric.subarray(0, n * d), numericWidth: d, categorical: [] });
          return transformTable(fitted, all);
        };
        const run = (x: Float32Array) => {
          const index = ExactIndex.from(x.subarray(0, n * d), d, rows.map((r) => r.c));
          return suggest(index, x.subarray(n * d), { k, numClasses: 3, weighting });
        };
        expect(run(enc(c))).toEqual(run(enc(1)));
      }),
    );
  });
});
