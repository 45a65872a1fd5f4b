import KNN from "ml-knn";
import { describe, expect, it } from "vitest";
import { ExactIndex, fitPreprocessor, transformTable, tune, vote } from "@/lib/knn";
import { loadPenguins } from "./penguins";

// Reference: ml-knn 3.0.0 (npm), uniform votes, Euclidean, on the Palmer penguins data
// (Horst, Hill & Gorman 2020, CC0; node_modules/vega-datasets/data/penguins.json).
const data = loadPenguins();
const state = fitPreprocessor({ n: data.n, numeric: data.numeric, numericWidth: 4, categorical: [] }, "zscore");
const x = transformTable(state, { n: data.n, numeric: data.numeric, numericWidth: 4, categorical: [] });
const rows = Array.from({ length: data.n }, (_, i) => Array.from(x.subarray(i * 4, i * 4 + 4)));
const labels = Array.from(data.classes);
const index = ExactIndex.from(x, 4, data.classes);

function mlKnnLeaveOneOut(k: number): number[] {
  return rows.map((row, i) => {
    const knn = new KNN(rows.filter((_, j) => j !== i), labels.filter((_, j) => j !== i), { k });
    return knn.predict(row);
  });
}

describe("agreement with ml-knn 3.0.0 on penguins (leave-one-out)", () => {
  it("keeps the 342 rows with all four measurements (vega-datasets: 344 rows, 2 without them)", () => {
    expect(data.rows.length).toBe(344);
    expect(data.n).toBe(342);
  });

  for (const k of [1, 3, 5, 7, 9, 15]) {
    it(`k = ${k}: same prediction on every query without a vote or k-th distance tie, same accuracy`, () => {
      const theirs = mlKnnLeaveOneOut(k);
      let compared = 0;
      let ours = 0;
      let mlCorrect = 0;
      for (let i = 0; i < data.n; i += 1) {
        const neighbours = index.search(rows[i], k + 1, { excludeId: i });
        const v = vote(neighbours.slice(0, k), 3);
        if (v.top === labels[i]) ours += 1;
        if (theirs[i] === labels[i]) mlCorrect += 1;
        const counts = Array.from(v.shares).map((s) => Math.round(s * k));
        const best = Math.max(...counts);
        const voteTie = counts.filter((c) => c === best).length > 1;
        const distanceTie = neighbours.length > k && neighbours[k].distance === neighbours[k - 1].distance;
        if (voteTie || distanceTie) continue;
        compared += 1;
        expect(v.top, `row ${i}`).toBe(theirs[i]);
      }
      expect(compared).toBeGreaterThan(0.9 * data.n);
      expect(ours).toBe(mlCorrect);
      const [result] = tune({ vectors: x, dim: 4, classes: data.classes, numClasses: 3 }, { ks: [k] });
      expect(result.correct).toBe(mlCorrect);
      expect(result.n).toBe(342);
    });
  }
});
