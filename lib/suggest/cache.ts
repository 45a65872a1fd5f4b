import { ExactIndex } from "@/lib/knn";
import { categoricalColumns, ensurePreprocessor, hasFeatures, transformRows, type StoredPreprocessor } from "./features";
import { readEngineState, type EngineState, type StateItem } from "./state";
import { queryChangedItemIds, queryVotingRows, type VotingRow } from "./voting-sql";

/** A process rebuilds its index from scratch at the next version change after this long (catches anything an incremental pass cannot see, e.g. deleted items). */
export const FULL_REBUILD_MS = 15 * 60_000;

export type EngineEntry = {
  state: EngineState;
  fingerprint: string;
  classIndex: Map<number, number>;
  prep: StoredPreprocessor | null;
  /** Voting items only; null when the project has no features. */
  index: ExactIndex | null;
  syncedAt: Date;
  builtAt: number;
  stats: { rebuilds: number; incremental: number; changedRows: number };
};

const entries = new Map<number, EngineEntry>();
const locks = new Map<number, Promise<EngineEntry>>();

function fingerprintOf(s: EngineState) {
  return `${s.shapeKey}|${s.maxSeq}`;
}

/** Forget this process's cached index (one project, or all): the next answer rebuilds it. */
export function clearEngineCache(projectId?: number) {
  if (projectId === undefined) entries.clear();
  else entries.delete(projectId);
}

/** The cached entry without any check (tests and diagnostics). */
export function peekEngine(projectId: number): EngineEntry | undefined {
  return entries.get(projectId);
}

/**
 * The project's in-memory index, current as of knn_state.version: one cheap query when nothing
 * changed; an incremental pass over the labels/rulings changed since the last sync when only the
 * version moved; a rebuild when settings, the label set, the feature schema or the items changed.
 */
export async function getEngine(projectId: number): Promise<EngineEntry> {
  return engineFor(await readEngineState(projectId));
}

/** As getEngine, with the item to answer for read in the same round trip as the version check. */
export async function getEngineWithItem(projectId: number, itemId: number): Promise<{ entry: EngineEntry; item: StateItem | null }> {
  const { item, ...state } = await readEngineState(projectId, itemId);
  return { entry: await engineFor(state), item };
}

async function engineFor(state: EngineState): Promise<EngineEntry> {
  const projectId = state.projectId;
  const fingerprint = fingerprintOf(state);
  const fresh = (e: EngineEntry | undefined): e is EngineEntry => !!e && e.state.version >= state.version && e.fingerprint === fingerprint;
  for (;;) {
    const cur = entries.get(projectId);
    if (fresh(cur)) return cur;
    const pending = locks.get(projectId);
    if (!pending) break;
    // Another request is syncing: its result serves this one too when it reached the version read above.
    const done = await pending.catch(() => undefined);
    if (fresh(done)) return done;
  }
  const job = sync(state).finally(() => locks.delete(projectId));
  locks.set(projectId, job);
  return job;
}

async function sync(state: EngineState): Promise<EngineEntry> {
  const cur = entries.get(state.projectId);
  const fingerprint = fingerprintOf(state);
  const stale = !cur || cur.fingerprint !== fingerprint || state.version < cur.state.version || Date.now() - cur.builtAt > FULL_REBUILD_MS;
  const entry = stale ? await rebuild(state, fingerprint, cur) : await incremental(cur, state);
  entries.set(state.projectId, entry);
  return entry;
}

function classMap(state: EngineState) {
  return new Map(state.classIds.map((id, i) => [id, i]));
}

async function rebuild(state: EngineState, fingerprint: string, prev?: EngineEntry): Promise<EngineEntry> {
  const classIndex = classMap(state);
  const stats = { rebuilds: (prev?.stats.rebuilds ?? 0) + 1, incremental: prev?.stats.incremental ?? 0, changedRows: prev?.stats.changedRows ?? 0 };
  const base = { state, fingerprint, classIndex, syncedAt: state.now, builtAt: Date.now(), stats };
  const hasSchema = (state.schema?.dimension ?? 0) > 0 || (state.schema?.columns ?? []).some((c) => c.kind === "categorical");
  if (!hasSchema) return { ...base, prep: null, index: null };
  const prep = await ensurePreprocessor(state.projectId, state.settings, state.schema, state.maxSeq);
  if (prep.state.width === 0) return { ...base, prep, index: null };
  const rows = (await queryVotingRows(state.projectId, state.settings, { kind: "voters" }, categoricalColumns(state.schema))).filter(
    (r) => hasFeatures(state.schema, r) && classIndex.has(r.voteClassId!),
  );
  const vectors = transformRows(state.schema, prep.state, rows);
  const classes = Int32Array.from(rows, (r) => classIndex.get(r.voteClassId!)!);
  const ids = Int32Array.from(rows, (r) => r.id);
  const index = ExactIndex.from(vectors, prep.state.width, classes, state.settings.distance, ids);
  return { ...base, prep, index };
}

async function incremental(entry: EngineEntry, state: EngineState): Promise<EngineEntry> {
  if (entry.index && entry.prep) {
    const ids = await queryChangedItemIds(state.projectId, entry.state.version, state.version);
    // A gap in the change log, or a bulk change (more than a quarter of the voters), rebuilds.
    if (ids === null || ids.length > Math.max(2_000, entry.index.size / 4)) return rebuild(state, entry.fingerprint, entry);
    const rows = ids.length ? await queryVotingRows(state.projectId, state.settings, { kind: "ids", ids }, categoricalColumns(state.schema)) : [];
    applyRows(entry, rows);
    entry.stats.changedRows += rows.length;
  }
  entry.stats.incremental += 1;
  entry.state = state;
  entry.syncedAt = state.now;
  return entry;
}

/** Puts each row's current vote into the index: added, re-classed or removed. */
function applyRows(entry: EngineEntry, rows: VotingRow[]) {
  const { index, prep, classIndex, state } = entry;
  if (!index || !prep) return;
  const add: VotingRow[] = [];
  for (const r of rows) {
    const c = r.voteClassId === null ? undefined : classIndex.get(r.voteClassId);
    if (c === undefined || !hasFeatures(state.schema, r)) {
      index.remove(r.id);
      continue;
    }
    if (index.has(r.id)) index.setClass(r.id, c);
    else add.push(r);
  }
  if (!add.length) return;
  const vectors = transformRows(state.schema, prep.state, add);
  const w = prep.state.width;
  add.forEach((r, i) => index.upsert(r.id, vectors.subarray(i * w, (i + 1) * w), classIndex.get(r.voteClassId!)!));
}
