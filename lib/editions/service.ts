// No "server-only" here: integration tests and scripts call these directly too.
import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import type { EditionWithCreator } from "@/db/queries/editions";
import { AppError } from "@/lib/errors";
import { env } from "@/lib/env";
import { headObject, presignGet } from "@/lib/storage/s3";
import { type DiffChange, type DiffCounts, diffCsvHeader, diffCsvLine, diffIndexes, parseIndexLine } from "./diff";
import { TextSink } from "./sink";
import { type EditionFormat, contentTypes, diffObjectKey, downloadName, objectLines, uploadFile } from "./storage";

export type DownloadLink = { url: string; expiresAt: string };
export type EditionDiff = { from: { id: number; number: number }; to: { id: number; number: number }; counts: DiffCounts; changes: DiffChange[]; truncated: boolean };

function keysOf(e: EditionWithCreator): Record<string, string> {
  if (e.status !== "succeeded" || !e.objectKeys) throw new AppError("conflict:edition_not_ready", `Edition ${e.number} is ${e.status}; its files are not ready.`);
  return e.objectKeys;
}

async function link(key: string, name: string): Promise<DownloadLink> {
  const seconds = env.PRESIGN_SECONDS;
  return { url: await presignGet(key, seconds, name), expiresAt: new Date(Date.now() + seconds * 1000).toISOString() };
}

/** A short-lived GET URL for one file of a published edition. */
export async function editionDownloadLink(e: EditionWithCreator, projectName: string, format: EditionFormat): Promise<DownloadLink> {
  const key = keysOf(e)[format];
  if (!key) throw new AppError("not_found:edition_file", `This edition has no ${format} file.`);
  return link(key, downloadName(projectName, e.number, format));
}

const entries = (key: string) => (async function* () {
  for await (const line of objectLines(key)) yield parseIndexLine(line);
})();

/** What changed from edition `from` to edition `to`: counts, and the first `limit` changes in external-id order. */
export async function diffEditions({ from, to, limit = 200 }: { from: EditionWithCreator; to: EditionWithCreator; limit?: number }): Promise<EditionDiff> {
  const a = keysOf(from).index;
  const b = keysOf(to).index;
  const changes: DiffChange[] = [];
  const counts = await diffIndexes(entries(a), entries(b), (c) => {
    if (changes.length < limit) changes.push(c);
  });
  const total = counts.added + counts.removed + counts.relabelled;
  return { from: { id: from.id, number: from.number }, to: { id: to.id, number: to.number }, counts, changes, truncated: total > changes.length };
}

/** The full list of changes as CSV in the bucket (written once per pair, editions being immutable), as a download link. */
export async function diffCsvLink({ projectId, projectName, from, to }: { projectId: number; projectName: string; from: EditionWithCreator; to: EditionWithCreator }): Promise<DownloadLink> {
  const a = keysOf(from).index;
  const b = keysOf(to).index;
  const key = diffObjectKey(projectId, to.id, from.id);
  const exists = await headObject(key).then(() => true, () => false);
  if (!exists) {
    const dir = await mkdtemp(path.join(tmpdir(), "vicinal-diff-"));
    try {
      const file = path.join(dir, "diff.csv");
      const sink = new TextSink(file);
      await sink.write(diffCsvHeader());
      await diffIndexes(entries(a), entries(b), (c) => sink.write(diffCsvLine(c)));
      await sink.close();
      await uploadFile(key, file, contentTypes.diff);
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  }
  const slug = downloadName(projectName, to.number, "csv").replace(/\.csv$/, "");
  return link(key, `${slug}-changes-since-${from.number}.csv`);
}
