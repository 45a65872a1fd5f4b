// k-NN benchmark: exact search against a memory-pass floor and ml-knn, then pool re-ranking of
// 1 000 000 unlabelled items against 100 000 labelled ones on every core, with measured recall@10.
// Progress on stderr; one JSON line on stdout. Sizes can be reduced with BENCH_POOL / BENCH_N;
// BENCH_METHOD forces a pool method; BENCH_COMPARE_POOL = m also ranks the first m pool rows
// one row at a time and batched, back to back (same run, same load), and reports both per query.
import { availableParallelism, loadavg } from "node:os";
import KNN from "ml-knn";
import { ExactIndex, mulberry32 } from "@/lib/knn";
import type { ClusterIndex } from "@/lib/knn/cluster-index";
import { measureRecall, type HnswIndex } from "@/lib/knn/hnsw-index";
import { rankPool } from "@/lib/knn/pool";

const N = Number(process.env.BENCH_N ?? 100_000);
const D = 64;
const POOL = Number(process.env.BENCH_POOL ?? 1_000_000);
const QUERIES = 300;
const ML_KNN_QUERIES = 20;
const K = 10;
const COMPONENTS = 100;
const EF = Number(process.env.BENCH_EF ?? 64);
const COMPARE_POOL = Number(process.env.BENCH_COMPARE_POOL ?? 0);

const log = (message: string) => process.stderr.write(`[bench:knn] ${message}\n`);

/**
 * Seeded Gaussian mixture: COMPONENTS centres drawn from N(0, 3²·I); each row = a random centre +
 * N(0, I) noise in all 64 dimensions; class = component mod 5.
 */
function makeMixture(seed: number) {
  const rand = mulberry32(seed);
  const gauss = () => Math.sqrt(-2 * Math.log(1 - rand())) * Math.cos(2 * Math.PI * rand());
  const centres = Float64Array.from({ length: COMPONENTS * D }, () => 3 * gauss());
  return (out: Float32Array, classes?: Int32Array) => {
    const n = out.length / D;
    for (let i = 0; i < n; i += 1) {
      const c = Math.floor(rand() * COMPONENTS);
      if (classes) classes[i] = c % 5;
      for (let j = 0; j < D; j += 1) out[i * D + j] = centres[c * D + j] + gauss();
    }
  };
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};

const r = (x: number, p = 3) => Number(x.toFixed(p));

async function main() {
  const fill = makeMixture(20240501);
  const labelled = new Float32Array(N * D);
  const classes = new Int32Array(N);
  fill(labelled, classes);
  const queries = new Float32Array(QUERIES * D);
  fill(queries);
  log(`data: ${N} labelled × ${D}, ${COMPONENTS}-component Gaussian mixture`);

  const index = ExactIndex.from(labelled, D, classes);
  const exactTimes: number[] = [];
  let sink = 0;
  for (let q = 0; q < QUERIES; q += 1) {
    const t = performance.now();
    sink += index.search(queries.subarray(q * D, (q + 1) * D), K)[0].distance;
    exactTimes.push(performance.now() - t);
  }
  const exactQueryMs = median(exactTimes);
  const floorTimes: number[] = [];
  for (let r = 0; r < 50; r += 1) {
    const t = performance.now();
    // Four accumulators, as the scan uses: the fastest plain-JS pass over the same array.
    let s0 = 0;
    let s1 = 0;
    let s2 = 0;
    let s3 = 0;
    for (let i = 0; i < labelled.length; i += 4) {
      s0 += labelled[i];
      s1 += labelled[i + 1];
      s2 += labelled[i + 2];
      s3 += labelled[i + 3];
    }
    sink += s0 + s1 + s2 + s3;
    floorTimes.push(performance.now() - t);
  }
  const floorMs = median(floorTimes);
  log(`exact: ${exactQueryMs.toFixed(2)} ms/query (median of ${QUERIES}); floor (one summing pass): ${floorMs.toFixed(2)} ms`);

  const rows = Array.from({ length: N }, (_, i) => Array.from(labelled.subarray(i * D, (i + 1) * D)));
  let t = performance.now();
  const knn = new KNN(rows, Array.from(classes), { k: K });
  log(`ml-knn build: ${((performance.now() - t) / 1000).toFixed(1)} s`);
  const mlTimes: number[] = [];
  for (let q = 0; q < ML_KNN_QUERIES; q += 1) {
    t = performance.now();
    sink += knn.predict(Array.from(queries.subarray(q * D, (q + 1) * D)));
    mlTimes.push(performance.now() - t);
  }
  const mlKnnQueryMs = median(mlTimes);
  log(`ml-knn: ${mlKnnQueryMs.toFixed(1)} ms/query (median of ${ML_KNN_QUERIES})`);

  const pool = new Float32Array(new SharedArrayBuffer(POOL * D * 4));
  fill(pool);
  log(`pool: ${POOL} unlabelled rows generated`);
  const labelledSet = { vectors: labelled, dim: D, classes, numClasses: 5 };
  let compare: Record<string, number> | undefined;
  if (COMPARE_POOL > 0) {
    const part = pool.subarray(0, Math.min(POOL, COMPARE_POOL) * D);
    const rows = part.length / D;
    const perQuery: Record<string, number> = {};
    for (const batched of [false, true]) {
      const run = await rankPool({ labelled: labelledSet, pool: part, k: K, method: "clustered", batched });
      perQuery[batched ? "batched" : "oneRow"] = (run.searchSeconds * 1e6) / rows;
      log(`compare ${rows} rows, clustered, ${batched ? "batched" : "one row at a time"}: ${perQuery[batched ? "batched" : "oneRow"].toFixed(1)} µs/row (search ${run.searchSeconds.toFixed(1)} s)`);
    }
    compare = { rows, oneRowUsPerQuery: r(perQuery.oneRow, 1), batchedUsPerQuery: r(perQuery.batched, 1), speedup: r(perQuery.oneRow / perQuery.batched, 2) };
  }
  let recallAt10 = Number.NaN;
  let used: HnswIndex | ClusterIndex | undefined;
  t = performance.now();
  const cpu0 = process.cpuUsage();
  const ranked = await rankPool({
    labelled: labelledSet,
    pool,
    k: K,
    hnsw: { ef: EF },
    onProgress: log,
    method: (process.env.BENCH_METHOD as "auto" | "hnsw" | "clustered" | undefined) ?? "auto",
    onIndex: (built) => (used = built),
  });
  const poolSeconds = (performance.now() - t) / 1000;
  // CPU of every thread of this process (workers included): a figure the other jobs on a shared machine do not inflate much.
  const cpu = process.cpuUsage(cpu0);
  const poolCpuSeconds = (cpu.user + cpu.system) / 1e6;
  log(`pool ranked by ${ranked.method}: build ${ranked.buildSeconds.toFixed(1)} s + search ${ranked.searchSeconds.toFixed(1)} s = ${poolSeconds.toFixed(1)} s`);
  const sample = pool.subarray(0, 500 * D);
  recallAt10 = used ? measureRecall({ search: (q, k) => used!.search(q, k) }, index, sample, 10) : 1;
  log(`recall@10 of the pool method against exact search on 500 pool rows: ${recallAt10.toFixed(4)}`);
  if (Number.isNaN(sink)) log("unreachable");

  process.stdout.write(
    `${JSON.stringify({
      n: N, d: D, exactQueryMs: r(exactQueryMs), floorMs: r(floorMs), ratioToFloor: r(exactQueryMs / floorMs, 2),
      mlKnnQueryMs: r(mlKnnQueryMs, 1), speedupVsMlKnn: r(mlKnnQueryMs / exactQueryMs, 1),
      poolItems: POOL, poolSeconds: r(poolSeconds, 1), recallAt10: r(recallAt10, 4),
      poolMethod: ranked.method, poolBuildSeconds: r(ranked.buildSeconds, 1), poolSearchSeconds: r(ranked.searchSeconds, 1), poolCpuSeconds: r(poolCpuSeconds, 1),
      cpus: availableParallelism(), loadAverage1m: r(loadavg()[0], 2), ...(compare ? { compare } : {}),
    })}\n`,
  );
}

void main();
