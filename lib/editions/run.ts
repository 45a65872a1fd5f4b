// No "server-only" here: the worker (plain Node) runs this module.
import { mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { db, pool, type Tx } from "@/db";
import { getAgreementReportByProjectId } from "@/db/queries/agreement";
import {
  completeEditionById,
  findEditionForJob,
  getSnapshotProject,
  getSnapshotShape,
  getUserContactById,
  setEditionStatusById,
  streamIndexEntries,
  streamSnapshotItems,
  streamSplitKeys,
  tryLockEditionById,
} from "@/db/queries/editions";
import type { Edition } from "@/db/schema";
import { computeProjectAgreement, isStoredAgreement } from "@/lib/agreement-server/compute";
import type { StoredAgreement } from "@/lib/agreement-server/types";
import { enqueue } from "@/lib/jobs/boss";
import { editionReadyMail } from "@/lib/mail/templates";
import { featureSchemaSchema } from "@/lib/projects/settings";
import { csvHeader, featureHeader, planFeatureColumns } from "./columns";
import { csvLine } from "./csv";
import { indexLine } from "./diff";
import { CountTally, type EditionManifest, type FileEntry, agreementSummary, personalDataCaution } from "./manifest";
import { type EditionOptions, readEditionOptions } from "./options";
import { ParquetSink } from "./parquet";
import { type RowContext, buildRow, csvRow, jsonlRow } from "./rows";
import { TextSink } from "./sink";
import { assignSplits, splitCodes } from "./split";
import { contentTypes, deleteEditionObjects, editionObjectKeys, sha256File, uploadFile } from "./storage";

export type PublishResult = { status: "published"; manifest: EditionManifest } | { status: "skipped"; reason: string };

/** Reads the split input (id, stratum) in id order into typed arrays and assigns each row its part. */
async function splitFor(tx: Tx, projectId: number, options: EditionOptions) {
  if (!options.split) return null;
  let ids = new Int32Array(1024);
  let strata = new Int32Array(1024);
  let n = 0;
  for await (const rows of streamSplitKeys({ tx, projectId, include: options.include })) {
    if (n + rows.length > ids.length) {
      const size = Math.max(ids.length * 2, n + rows.length);
      const grow = (a: Int32Array) => {
        const b = new Int32Array(size);
        b.set(a.subarray(0, n));
        return b;
      };
      ids = grow(ids);
      strata = grow(strata);
    }
    for (const r of rows) {
      ids[n] = r.id;
      strata[n] = r.class_id;
      n += 1;
    }
  }
  ids = ids.subarray(0, n);
  return { ids, parts: assignSplits({ ids, strata: strata.subarray(0, n), options: options.split }) };
}

/** Cached agreement figures when they cover this snapshot's labels, else computed from the snapshot itself. */
async function agreementFor(tx: Tx, projectId: number, knnVersion: number): Promise<StoredAgreement> {
  const cached = await getAgreementReportByProjectId({ projectId, tx });
  if (cached && cached.knnVersion === knnVersion && isStoredAgreement(cached.result)) return cached.result;
  return computeProjectAgreement({ projectId, tx });
}

async function buildInTransaction(tx: Tx, edition: Edition, dir: string, uploaded: string[]): Promise<EditionManifest> {
  const options = readEditionOptions(edition.options);
  const project = await getSnapshotProject({ tx, projectId: edition.projectId });
  const schema = featureSchemaSchema.safeParse(project.featureSchema);
  const shape = await getSnapshotShape({ tx, projectId: project.id, include: options.include });
  const features = planFeatureColumns({ schema: schema.success ? schema.data : null, fieldKeys: shape.fieldKeys, hasVector: shape.hasVector });
  const annotators = [...new Set(shape.annotators.map((a) => (options.annotatorIdentity === "email" ? a.email : a.id)))].sort();
  const ctx: RowContext = { classNames: new Map(project.classes.map((c) => [c.id, c.name])), features, identity: options.annotatorIdentity };
  const split = await splitFor(tx, project.id, options);

  const keys = editionObjectKeys(project.id, edition.id, edition.number);
  const local = { csv: path.join(dir, "edition.csv"), jsonl: path.join(dir, "edition.jsonl"), parquet: path.join(dir, "edition.parquet"), index: path.join(dir, "index.jsonl") };
  const csv = new TextSink(local.csv);
  const jsonl = new TextSink(local.jsonl);
  const parquet = new ParquetSink(local.parquet, features, annotators, 20_000, { "vicinal.project": String(project.id), "vicinal.edition": String(edition.number) });
  const tally = new CountTally(project.classes.map((c) => c.name), split !== null, annotators.length);
  await csv.write(csvLine(csvHeader(features, annotators)));
  let at = 0;
  for await (const batch of streamSnapshotItems({ tx, projectId: project.id, include: options.include })) {
    for (const item of batch) {
      let part = null;
      if (split) {
        if (split.ids[at] !== item.id) throw new Error(`edition snapshot changed under the job (item ${item.id})`);
        part = splitCodes[split.parts[at]];
      }
      at += 1;
      const row = buildRow(item, part, ctx);
      tally.add(row);
      await csv.write(csvRow(row, features, annotators));
      await jsonl.write(jsonlRow(row));
      parquet.add(row);
    }
  }
  await csv.close();
  await jsonl.close();
  parquet.close();

  const index = new TextSink(local.index);
  for await (const rows of streamIndexEntries({ tx, projectId: project.id, include: options.include })) {
    for (const r of rows) await index.write(indexLine({ id: r.external_id, label: r.class_id === null ? null : (ctx.classNames.get(r.class_id) ?? null), source: r.source }));
  }
  await index.close();

  const agreement = await agreementFor(tx, project.id, project.knnVersion);
  const files = {} as EditionManifest["files"];
  for (const format of ["csv", "jsonl", "parquet"] as const) {
    uploaded.push(keys[format]);
    const bytes = await uploadFile(keys[format], local[format], contentTypes[format]);
    files[format] = { name: path.basename(keys[format]), bytes, sha256: await sha256File(local[format]), contentType: contentTypes[format] } satisfies FileEntry;
  }
  uploaded.push(keys.index);
  await uploadFile(keys.index, local.index, contentTypes.index);

  const s = project.settings;
  const creatorEmail = options.annotatorIdentity === "email" && edition.createdBy ? (await getUserContactById({ tx, userId: edition.createdBy }))?.email : undefined;
  const manifest: EditionManifest = {
    format: "vicinal-edition/1",
    project: { id: project.id, name: project.name },
    edition: edition.number,
    editionId: edition.id,
    createdBy: { id: edition.createdBy, ...(creatorEmail ? { email: creatorEmail } : {}) },
    createdAt: edition.createdAt.toISOString(),
    snapshotAt: new Date().toISOString(),
    options,
    classes: project.classes,
    counts: tally.counts,
    knn: { version: project.knnVersion, k: s.k, distance: s.distance, scaling: s.scaling, weighting: s.weighting, voters: s.voters },
    agreement: agreement.overall.ratings > 0 ? agreementSummary(agreement) : null,
    featureSchema: project.featureSchema ?? null,
    featureColumns: features.map((c) => ({ column: featureHeader(c), kind: c.kind })),
    annotatorIdentity: options.annotatorIdentity,
    split: options.split
      ? {
          seed: options.split.seed,
          fractions: { train: options.split.train, validation: options.split.validation, test: options.split.test },
          method: "stratified by final label; within a label, rows ordered by a mulberry32 draw seeded with (seed XOR item id × 0x9e3779b1) and cut by largest remainders",
        }
      : null,
    files,
    caution: personalDataCaution,
  };
  const manifestPath = path.join(dir, "manifest.json");
  await writeFile(manifestPath, `${JSON.stringify(manifest, null, 2)}\n`);
  uploaded.push(keys.manifest);
  await uploadFile(keys.manifest, manifestPath, contentTypes.manifest);
  const stored = await completeEditionById({ tx, editionId: edition.id, manifest: manifest as unknown as Record<string, unknown>, objectKeys: keys });
  if (!stored) throw new Error("the edition was deleted while it was being built");
  return manifest;
}

/**
 * The `edition` job: freezes the chosen final labels into CSV, JSON Lines and Parquet plus a manifest.
 * Everything is read in one REPEATABLE READ transaction, so the files, counts and agreement figures all
 * describe the same snapshot; rows stream through server-side cursors and temporary files.
 */
export async function publishEdition(editionId: number): Promise<PublishResult> {
  // One builder per edition: a session-level advisory lock on its own connection, taken before anything is
  // written, so a second worker (a retry, a duplicate job) skips instead of racing the snapshot transaction.
  const lock = await pool.connect();
  try {
    const got = await lock.query<{ ok: boolean }>("select pg_try_advisory_lock(hashtext('vicinal:edition-build'), $1) as ok", [editionId]);
    if (!got.rows[0]?.ok) return { status: "skipped", reason: "another worker is building it" };
    try {
      return await buildLocked(editionId);
    } finally {
      await lock.query("select pg_advisory_unlock(hashtext('vicinal:edition-build'), $1)", [editionId]).catch(() => undefined);
    }
  } finally {
    lock.release();
  }
}

async function buildLocked(editionId: number): Promise<PublishResult> {
  const first = await findEditionForJob({ editionId });
  if (!first) return { status: "skipped", reason: "no such edition" };
  if (first.status === "succeeded") return { status: "skipped", reason: "already published" };
  await setEditionStatusById({ editionId, status: "running" });
  const dir = await mkdtemp(path.join(tmpdir(), `vicinal-edition-${editionId}-`));
  const uploaded: string[] = [];
  try {
    const result = await db.transaction(
      async (tx): Promise<PublishResult> => {
        if (!(await tryLockEditionById({ tx, editionId }))) return { status: "skipped", reason: "another worker is building it" };
        const edition = await findEditionForJob({ editionId, tx });
        if (!edition) return { status: "skipped", reason: "no such edition" };
        if (edition.status === "succeeded") return { status: "skipped", reason: "already published" };
        return { status: "published", manifest: await buildInTransaction(tx, edition, dir, uploaded) };
      },
      { isolationLevel: "repeatable read" },
    );
    if (result.status === "published") await mailOwner(first, result.manifest);
    return result;
  } catch (error) {
    if (uploaded.length) await deleteEditionObjects(first.projectId, editionId).catch(() => undefined);
    await setEditionStatusById({ editionId, status: "failed", message: (error instanceof Error ? error.message : String(error)).slice(0, 2000) }).catch(() => undefined);
    throw error;
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

async function mailOwner(edition: Edition, manifest: EditionManifest) {
  if (!edition.createdBy) return;
  const user = await getUserContactById({ userId: edition.createdBy });
  if (!user || user.deactivated) return;
  const mail = editionReadyMail({ projectName: manifest.project.name, number: manifest.edition, projectId: manifest.project.id });
  await enqueue("mail", { to: user.email, subject: mail.subject, text: mail.text });
}
