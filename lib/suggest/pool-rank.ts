// Worker side only: imports the thread pool and hnswlib-node through lib/knn/pool.
import { pool as pg } from "@/db";
import { ExactIndex, entropy, leastConfident, margin, vote } from "@/lib/knn";
import { measureRecall } from "@/lib/knn/hnsw-index";
import { rankPool } from "@/lib/knn/pool";
import type { ClusterIndex } from "@/lib/knn/cluster-index";
import type { HnswIndex } from "@/lib/knn/hnsw-index";
import { loadProjectSet, votersOnly } from "./project-set";

/** Rows written per UPDATE … FROM unnest(…) statement. */
export const POOL_WRITE_BATCH = 5_000;
/** Below this many pool × voter pairs the ranking runs in this thread (starting worker threads costs more). */
const THREADS_MIN_WORK = 20_000_000;

export type PoolRankSummary = {
  projectId: number;
  poolItems: number;
  voters: number;
  method: string;
  recallAt10: number | null;
  seconds: number;
  knnVersion: number;
};

type Scores = { ids: number[]; top: number[]; shares: string[]; topShare: number[]; lc: number[]; margin: number[]; entropy: number[] };

/**
 * Vote shares and ordering scores for every item still to be labelled (status unlabelled or
 * in_progress): items that do not vote yet are ranked with lib/knn's pool ranking (worker threads;
 * cluster-pruned exact search or HNSW above its threshold); items that already vote with a single
 * label are searched exactly with themselves excluded. Written in batches to items.pool_*.
 */
export async function runPoolRank(projectId: number, options: { threads?: number } = {}): Promise<PoolRankSummary> {
  const t0 = performance.now();
  const before = await pg.query("select labels_since_pool_rank from knn_state where project_id = $1", [projectId]);
  const counted = Number(before.rows[0]?.labels_since_pool_rank ?? 0);
  const ps = await loadProjectSet(projectId, { includeNonVoters: true });
  if (!ps) return { projectId, poolItems: 0, voters: 0, method: "none", recallAt10: null, seconds: 0, knnVersion: 0 };
  const { set, status, state } = ps;
  const { k, distance, weighting } = state.settings;
  const C = set.numClasses;
  const d = set.dim;
  const voters = votersOnly(ps);
  // Nothing votes yet (e.g. right after the first import): every share would be 0, so there is nothing to rank.
  if (voters.classes.length === 0) return { projectId, poolItems: 0, voters: 0, method: "none", recallAt10: null, seconds: (performance.now() - t0) / 1000, knnVersion: state.version };
  const open = (i: number) => status[i] === "unlabelled" || status[i] === "in_progress";
  const plain: number[] = [];
  const selfVoting: number[] = [];
  for (let i = 0; i < status.length; i += 1) if (open(i)) (set.classes[i] >= 0 ? selfVoting : plain).push(i);
  const out: Scores = { ids: [], top: [], shares: [], topShare: [], lc: [], margin: [], entropy: [] };
  const push = (id: number, top: number, shares: ArrayLike<number>) => {
    out.ids.push(id);
    out.top.push(top >= 0 ? state.classIds[top] : -1);
    out.shares.push(`{${Array.from(shares, (s) => Number(s).toPrecision(6)).join(",")}}`);
    out.topShare.push(top >= 0 ? shares[top] : 0);
    out.lc.push(leastConfident(shares));
    out.margin.push(margin(shares));
    out.entropy.push(entropy(shares));
  };
  let method = "exact";
  let recallAt10: number | null = null;
  if (plain.length) {
    const poolVectors = new Float32Array(plain.length * d);
    plain.forEach((r, i) => poolVectors.set(set.vectors.subarray(r * d, (r + 1) * d), i * d));
    let built: HnswIndex | ClusterIndex | undefined;
    const threads = options.threads ?? (plain.length * voters.classes.length < THREADS_MIN_WORK ? 0 : undefined);
    const ranked = await rankPool({ labelled: voters, pool: poolVectors, k, distance, weighting, threads, onIndex: (ix) => (built = ix) });
    method = ranked.method;
    if (built && ranked.method === "hnsw") {
      const exact = ExactIndex.from(voters.vectors, d, voters.classes, distance, voters.ids);
      recallAt10 = measureRecall(built, exact, poolVectors.subarray(0, Math.min(plain.length, 200) * d), 10);
    }
    plain.forEach((r, i) => push(set.ids[r], ranked.top[i], ranked.shares.subarray(i * C, (i + 1) * C)));
  }
  if (selfVoting.length) {
    const exact = ExactIndex.from(voters.vectors, d, voters.classes, distance, voters.ids);
    for (const r of selfVoting) {
      const v = vote(exact.search(set.vectors.subarray(r * d, (r + 1) * d), k, { excludeId: set.ids[r] }), C, weighting);
      push(set.ids[r], v.top, v.shares);
    }
  }
  await writeScores(projectId, out, state.version);
  await pg.query("update knn_state set labels_since_pool_rank = greatest(0, labels_since_pool_rank - $2), updated_at = now() where project_id = $1", [projectId, counted]);
  return { projectId, poolItems: out.ids.length, voters: voters.classes.length, method, recallAt10, seconds: (performance.now() - t0) / 1000, knnVersion: state.version };
}

async function writeScores(projectId: number, s: Scores, version: number) {
  for (let start = 0; start < s.ids.length; start += POOL_WRITE_BATCH) {
    const end = Math.min(s.ids.length, start + POOL_WRITE_BATCH);
    const part = <T>(a: T[]) => a.slice(start, end);
    await pg.query(
      `update items i set pool_shares = u.shares::real[], pool_top_class_id = nullif(u.top, -1), pool_top_share = u.top_share,
         score_least_confident = u.lc, score_margin = u.margin, score_entropy = u.entropy, pool_version = $9
       from unnest($2::int[], $3::int[], $4::text[], $5::real[], $6::real[], $7::real[], $8::real[])
         as u(id, top, shares, top_share, lc, margin, entropy)
       where i.id = u.id and i.project_id = $1`,
      [projectId, part(s.ids), part(s.top), part(s.shares), part(s.topShare), part(s.lc), part(s.margin), part(s.entropy), version],
    );
  }
}
