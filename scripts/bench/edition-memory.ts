// Memory and time of one edition build at two sizes (peak heap and RSS over the baseline), printed as JSON lines.
// For the lead to move under scripts/bench/: run with `node scripts/run-with-services.mjs --services --fresh -- node --expose-gc node_modules/tsx/dist/cli.mjs <this file>`.
import { sql } from "drizzle-orm";
import { db, pool } from "@/db";
import { editions } from "@/db/schema";
import { publishEdition } from "@/lib/editions/run";
import { makeProject, makeUser } from "@/tests/support/fixtures";

async function world(n: number) {
  const a = await makeUser();
  const b = await makeUser();
  const { project, classes } = await makeProject({ name: `bench ${n}` });
  const schema = { source: "table", dimension: 16, columns: Array.from({ length: 16 }, (_, j) => ({ name: `f${j}`, kind: "numeric", width: 1 })) };
  await db.execute(sql`update projects set feature_schema = ${JSON.stringify(schema)}::jsonb where id = ${project.id}`);
  const c = classes.map((x) => x.id);
  await db.execute(sql`insert into items (project_id, external_id, fields, vector, status, final_class_id, final_source, is_blind)
    select ${project.id}, 'it-' || g, jsonb_build_object('district', 'd' || (g % 7)),
      (select string_agg(decode(lpad(to_hex((random() * 1000000000)::int), 8, '0'), 'hex'), ''::bytea) from generate_series(1, 16)),
      'agreed', (array[${c[0]}::int, ${c[1]}::int, ${c[2]}::int])[1 + g % 3], 'agreed', g % 10 = 0
    from generate_series(1, ${n}) g`);
  for (const u of [a.id, b.id]) {
    await db.execute(sql`insert into labels (project_id, item_id, annotator_id, class_id, suggestion, took_suggestion, client_submission_id)
      select project_id, id, ${u}::text, final_class_id,
        jsonb_build_object('shown', true, 'topClassId', final_class_id, 'shares', jsonb_build_object(${String(c[0])}::text, 0.5, ${String(c[1])}::text, 0.3, ${String(c[2])}::text, 0.2), 'k', 7, 'distance', 'euclidean', 'engineVersion', 'b', 'knnVersion', 1),
        true, gen_random_uuid() from items where project_id = ${project.id}`);
  }
  const [e] = await db.insert(editions).values({ projectId: project.id, number: 1, options: { split: { seed: 3, train: 0.8, validation: 0.1, test: 0.1 } }, createdBy: a.id }).returning();
  return e.id;
}

async function main() {
const out: Record<string, unknown> = {};
for (const n of [100_000, 400_000]) {
  const id = await world(n);
  global.gc?.();
  const base = process.memoryUsage();
  let peakRss = base.rss;
  let peakHeap = base.heapUsed;
  const timer = setInterval(() => {
    const m = process.memoryUsage();
    peakRss = Math.max(peakRss, m.rss);
    peakHeap = Math.max(peakHeap, m.heapUsed);
  }, 20);
  const t0 = performance.now();
  const r = await publishEdition(id);
  const seconds = (performance.now() - t0) / 1000;
  clearInterval(timer);
  const m = r.status === "published" ? r.manifest : null;
  out[n] = { seconds: Number(seconds.toFixed(1)), rows: m?.counts.rows, csvMB: m ? +(m.files.csv.bytes / 1e6).toFixed(1) : null, parquetMB: m ? +(m.files.parquet.bytes / 1e6).toFixed(1) : null, peakHeapOverBaseMB: +((peakHeap - base.heapUsed) / 1e6).toFixed(0), peakRssOverBaseMB: +((peakRss - base.rss) / 1e6).toFixed(0) };
  console.log(JSON.stringify({ n, ...(out[n] as object) }));
}
await pool.end();
process.exit(0);
}
void main();
