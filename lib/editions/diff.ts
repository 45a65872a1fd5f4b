import { csvLine } from "./csv";

/** One line of an edition's index: external id, final label (null when disputed), label source. */
export type IndexEntry = { id: string; label: string | null; source: string };
export type DiffChange = { externalId: string; change: "added" | "removed" | "relabelled"; before: IndexEntry | null; after: IndexEntry | null };
export type DiffCounts = { before: number; after: number; added: number; removed: number; relabelled: number; unchanged: number };

export const indexLine = (e: IndexEntry) => `${JSON.stringify([e.id, e.label, e.source])}\n`;

export function parseIndexLine(line: string): IndexEntry {
  const [id, label, source] = JSON.parse(line) as [string, string | null, string];
  return { id, label, source };
}

/** Maps a UTF-16 code unit so that plain comparison gives code-point order (surrogates after U+E000–U+FFFF). */
const fix = (c: number) => (c >= 0xd800 && c <= 0xdfff ? c + 0x2000 : c >= 0xe000 ? c - 0x800 : c);

/** Compares strings by code point, which is the byte order of their UTF-8 (PostgreSQL's `collate "C"` on a UTF8 database). */
export function compareUtf8(a: string, b: string): number {
  const n = Math.min(a.length, b.length);
  for (let i = 0; i < n; i += 1) {
    const x = a.charCodeAt(i);
    const y = b.charCodeAt(i);
    if (x !== y) return fix(x) - fix(y);
  }
  return a.length - b.length;
}

/**
 * Merges two indexes sorted by `compareUtf8`: items only in `after` are added, only in `before` removed,
 * in both with another final label relabelled (a new source with the same label counts as unchanged).
 */
export async function diffIndexes(before: AsyncIterable<IndexEntry>, after: AsyncIterable<IndexEntry>, onChange: (c: DiffChange) => void | Promise<void>): Promise<DiffCounts> {
  const counts: DiffCounts = { before: 0, after: 0, added: 0, removed: 0, relabelled: 0, unchanged: 0 };
  const a = before[Symbol.asyncIterator]();
  const b = after[Symbol.asyncIterator]();
  let x = await a.next();
  let y = await b.next();
  let lastA: string | null = null;
  let lastB: string | null = null;
  const ordered = (prev: string | null, id: string) => {
    if (prev !== null && compareUtf8(prev, id) >= 0) throw new Error(`edition index out of order at ${JSON.stringify(id)}`);
    return id;
  };
  while (!x.done || !y.done) {
    const cmp = x.done ? 1 : y.done ? -1 : compareUtf8(x.value.id, y.value.id);
    if (cmp < 0 && !x.done) {
      lastA = ordered(lastA, x.value.id);
      counts.before += 1;
      counts.removed += 1;
      await onChange({ externalId: x.value.id, change: "removed", before: x.value, after: null });
      x = await a.next();
    } else if (cmp > 0 && !y.done) {
      lastB = ordered(lastB, y.value.id);
      counts.after += 1;
      counts.added += 1;
      await onChange({ externalId: y.value.id, change: "added", before: null, after: y.value });
      y = await b.next();
    } else if (!x.done && !y.done) {
      lastA = ordered(lastA, x.value.id);
      lastB = ordered(lastB, y.value.id);
      counts.before += 1;
      counts.after += 1;
      if (x.value.label !== y.value.label) {
        counts.relabelled += 1;
        await onChange({ externalId: y.value.id, change: "relabelled", before: x.value, after: y.value });
      } else counts.unchanged += 1;
      x = await a.next();
      y = await b.next();
    }
  }
  return counts;
}

export const diffCsvHeader = () => csvLine(["external_id", "change", "label_before", "label_after", "source_before", "source_after"]);
export const diffCsvLine = (c: DiffChange) => csvLine([c.externalId, c.change, c.before?.label ?? null, c.after?.label ?? null, c.before?.source ?? null, c.after?.source ?? null]);
