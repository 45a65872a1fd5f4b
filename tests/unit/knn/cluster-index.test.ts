import { describe, expect, it } from "vitest";
import { ExactIndex, mulberry32 } from "@/lib/knn";
import { ClusterIndex } from "@/lib/knn/cluster-index";

/** Seeded clustered rows (Box–Muller Gaussian blobs), plus rows rounded to a coarse grid to force distance ties. */
function rows(n: number, d: number, seed: number, round: boolean) {
  const r = mulberry32(seed);
  const g = () => Math.sqrt(-2 * Math.log(1 - r())) * Math.cos(2 * Math.PI * r());
  const centres = Array.from({ length: 8 }, () => Array.from({ length: d }, () => 5 * g()));
  const x = new Float32Array(n * d);
  for (let i = 0; i < n; i += 1) {
    const c = centres[i % 8];
    for (let j = 0; j < d; j += 1) x[i * d + j] = round ? Math.round(c[j] + g()) : c[j] + g();
  }
  return x;
}

describe("ClusterIndex (exact search with triangle-inequality pruning)", () => {
  for (const metric of ["euclidean", "manhattan", "cosine"] as const) {
    for (const round of [false, true]) {
      it(`${metric}${round ? ", integer rows with many ties" : ""}: same neighbours as the exact scan`, () => {
        const d = 6;
        const n = 1500;
        const x = rows(n + 40, d, 3, round);
        const classes = Int32Array.from({ length: n }, (_, i) => (i % 5 === 0 ? -1 : i % 3));
        const ids = Int32Array.from({ length: n }, (_, i) => 10 * i + 7);
        const voters = [...ids.keys()].filter((i) => classes[i] >= 0);
        const cluster = ClusterIndex.build(
          Float32Array.from(voters.flatMap((i) => [...x.subarray(i * d, (i + 1) * d)])), d,
          voters.map((i) => ids[i]), voters.map((i) => classes[i]), metric, { lists: 30 },
        );
        const exact = ExactIndex.from(x.subarray(0, n * d), d, classes, metric, ids);
        let pruned = 0;
        for (let q = 0; q < 40; q += 1) {
          const query = x.subarray((n + q) * d, (n + q + 1) * d);
          const a = cluster.search(query, 9);
          const b = exact.search(query, 9);
          if (metric === "cosine") {
            // cosine is ranked as ‖a − b‖²/2 on unit vectors here, 1 − a·b in the scan: equal up to rounding.
            expect(a.map((n) => n.distance)).toEqual(b.map((n) => expect.closeTo(n.distance, 6)) as unknown as number[]);
            if (!round) expect(a.map((n) => n.id)).toEqual(b.map((n) => n.id));
          } else {
            expect(a).toEqual(b);
          }
          if (cluster.lastScanned < cluster.size) pruned += 1;
        }
        if (!round) expect(pruned).toBeGreaterThan(30);
        const self = ids[voters[0]];
        expect(cluster.search(x.subarray(voters[0] * d, (voters[0] + 1) * d), 3, self).map((n) => n.id)).not.toContain(self);
      });
    }
  }
});
