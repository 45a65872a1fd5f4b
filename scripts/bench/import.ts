// `npm run --silent bench:import`: 1 000 000 rows × 64 numeric features + id through the real import path,
// against a plain PostgreSQL COPY of the same file into a bare table, in the same run. Prints one JSON line last.
import { once } from "node:events";
import fs from "node:fs";
import path from "node:path";
import { pipeline } from "node:stream/promises";
import { PutObjectCommand } from "@aws-sdk/client-s3";
import { eq } from "drizzle-orm";
import { from as copyFrom } from "pg-copy-streams";
import { db, pool } from "@/db";
import { imports, labelClasses, projects, uploads, users } from "@/db/schema";
import { uploadKey } from "@/lib/imports/storage";
import { runImport } from "@/lib/imports/run";
import { defaultProjectSettings } from "@/lib/projects/settings";
import { bucket, s3 } from "@/lib/storage/s3";
import { mulberry32 } from "@/lib/random";

const ROWS = Number(process.env.BENCH_ROWS ?? 1_000_000);
const FEATURES = 64;
const dataDir = process.env.VICINAL_BENCH_DATA ?? path.join(process.cwd(), ".data/bench");
const file = path.join(dataDir, `import-${ROWS}x${FEATURES}.csv`);

async function generate() {
  if (fs.existsSync(file)) return;
  fs.mkdirSync(dataDir, { recursive: true });
  const out = fs.createWriteStream(file);
  const rand = mulberry32(20240611);
  const header = ["id", ...Array.from({ length: FEATURES }, (_, j) => `f${j}`)].join(",");
  out.write(`${header}\n`);
  let buf = "";
  for (let i = 0; i < ROWS; i += 1) {
    let line = `item-${i}`;
    const centre = (i % 5) * 2;
    for (let j = 0; j < FEATURES; j += 1) line += `,${(centre + (rand() - 0.5) * 4).toFixed(4)}`;
    buf += `${line}\n`;
    if (buf.length > 1 << 20) {
      if (!out.write(buf)) await once(out, "drain");
      buf = "";
    }
  }
  out.end(buf);
  await once(out, "finish");
}

async function baselineCopy(): Promise<number> {
  const client = await pool.connect();
  try {
    const cols = Array.from({ length: FEATURES }, (_, j) => `f${j} real`).join(", ");
    await client.query(`DROP TABLE IF EXISTS bench_copy; CREATE TABLE bench_copy (id text, ${cols})`);
    const t0 = performance.now();
    await pipeline(fs.createReadStream(file, { highWaterMark: 1 << 20 }), client.query(copyFrom("COPY bench_copy FROM STDIN (FORMAT csv, HEADER true)")));
    const seconds = (performance.now() - t0) / 1000;
    await client.query("DROP TABLE bench_copy");
    await client.query("CHECKPOINT");
    return seconds;
  } finally {
    client.release();
  }
}

async function main() {
  const tGen = performance.now();
  await generate();
  const size = fs.statSync(file).size;
  process.stderr.write(`[bench] file ${path.relative(process.cwd(), file)} (${(size / 1e6).toFixed(0)} MB) ready in ${((performance.now() - tGen) / 1000).toFixed(1)} s\n`);
  const copyBefore = await baselineCopy();
  process.stderr.write(`[bench] plain COPY (before): ${copyBefore.toFixed(2)} s\n`);

  const [user] = await db.insert(users).values({ email: `bench-${Date.now()}@example.test`, name: "bench" }).returning();
  const [project] = await db.insert(projects).values({ name: "Import bench", settings: defaultProjectSettings, createdBy: user.id }).returning();
  await db.insert(labelClasses).values([{ projectId: project.id, name: "a", colour: "#2f7f86", keyHint: 1, position: 0 }]);

  const t0 = performance.now();
  const [upload] = await db.insert(uploads).values({ projectId: project.id, objectKey: "pending", fileName: path.basename(file), size, contentType: "text/csv", createdBy: user.id }).returning();
  const key = uploadKey(project.id, upload.id, upload.fileName);
  await s3.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: fs.createReadStream(file, { highWaterMark: 1 << 20 }), ContentLength: size, ContentType: "text/csv" }));
  await db.update(uploads).set({ objectKey: key, status: "uploaded" }).where(eq(uploads.id, upload.id));
  const uploadSeconds = (performance.now() - t0) / 1000;
  process.stderr.write(`[bench] upload to the bucket: ${uploadSeconds.toFixed(2)} s\n`);

  const columns = [{ name: "id", role: "id" as const }, ...Array.from({ length: FEATURES }, (_, j) => ({ name: `f${j}`, role: "numeric" as const }))];
  const [imp] = await db.insert(imports).values({ projectId: project.id, uploadIds: [upload.id], format: "csv", options: { columns }, createdBy: user.id }).returning();
  const t1 = performance.now();
  await runImport(imp.id, { phase: (name) => process.stderr.write(`[bench]   ${name} at ${((performance.now() - t1) / 1000).toFixed(2)} s\n`) });
  const seconds = (performance.now() - t1) / 1000;
  const [done] = await db.select().from(imports).where(eq(imports.id, imp.id));
  if (done.status !== "succeeded" || done.itemsCreated !== ROWS) {
    throw new Error(`import ended ${done.status}: ${done.itemsCreated} items; ${done.message ?? ""} ${JSON.stringify(done.errors.slice(0, 3))}`);
  }
  process.stderr.write(`[bench] import job: ${seconds.toFixed(2)} s (${done.itemsCreated} items)\n`);
  // The machine is shared: the baseline is the mean of a COPY just before and just after the import.
  const copyAfter = await baselineCopy();
  process.stderr.write(`[bench] plain COPY (after): ${copyAfter.toFixed(2)} s\n`);
  const copySeconds = (copyBefore + copyAfter) / 2;
  await pool.end();
  const r = (x: number) => Math.round(x * 100) / 100;
  console.log(JSON.stringify({ rows: ROWS, seconds: r(seconds), rowsPerSecond: Math.round(ROWS / seconds), copySeconds: r(copySeconds), ratioToCopy: r(seconds / copySeconds), uploadSeconds: r(uploadSeconds) }));
  process.exit(0);
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
