// ≥ 20 simulated annotators labelling at once through the HTTP API against the real server and database.
import { randomUUID } from "node:crypto";
import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { mulberry32 } from "@/lib/random";
import { api } from "../../support/http";
import { member, makeLabellingWorld } from "./world";

const ANNOTATORS = 22;
const OVERLAP = 2;
const ITEMS = 100;

describe("the labelling loop under concurrency", () => {
  let world: Awaited<ReturnType<typeof makeLabellingWorld>>;
  let crew: Array<Awaited<ReturnType<typeof member>>>;
  const acknowledged = new Set<number>();
  const problems: string[] = [];
  let retries = 0;

  beforeAll(async () => {
    crew = await Promise.all(Array.from({ length: ANNOTATORS }, (_, i) => member("annotator", `Annotator ${i + 1}`)));
    world = await makeLabellingWorld({ n: ITEMS, members: crew, controlEvery: 25, settings: { overlap: OVERLAP, controlRate: 0.1, queueOrder: "random" } });
  });
  afterAll(async () => {
    await pool.end();
  });

  async function annotate(who: (typeof crew)[number], seed: number) {
    const rand = mulberry32(seed);
    const base = `/api/v1/projects/${world.project.id}`;
    for (let step = 0; step < 200; step += 1) {
      const next = await api(`${base}/desk/next`, { token: who.token });
      if (next.status !== 200) {
        problems.push(`next ${next.status} ${next.text.slice(0, 120)}`);
        return;
      }
      const item = next.json.data;
      if (!item) return;
      const classId = world.classes[Math.floor(rand() * world.classes.length)].id;
      const body = { clientSubmissionId: randomUUID(), classId, via: "choose", suggestionToken: item.suggestionToken };
      const url = `${base}/items/${item.itemId}/labels`;
      // Some submissions are retried, as a client does after a lost response: once in parallel, once afterwards.
      const retry = rand() < 0.2;
      const first = retry ? await Promise.all([api(url, { token: who.token, body }), api(url, { token: who.token, body })]) : [await api(url, { token: who.token, body })];
      if (retry) {
        retries += 1;
        first.push(await api(url, { token: who.token, body }));
      }
      const ids = new Set<number>();
      for (const r of first) {
        if (r.status !== 201 && r.status !== 200) problems.push(`label ${r.status} ${r.text.slice(0, 160)}`);
        else ids.add(r.json.data.label.id);
      }
      if (ids.size > 1) problems.push(`one submission stored as ${[...ids].join(", ")}`);
      for (const id of ids) acknowledged.add(id);
    }
  }

  it("stores each acknowledged submission once, never over overlap, never twice per annotator, every disagreement in Disputes", async () => {
    const t0 = Date.now();
    await Promise.all(crew.map((who, i) => annotate(who, 1000 + i)));
    console.log(JSON.stringify({ annotators: ANNOTATORS, overlap: OVERLAP, labels: acknowledged.size, retriedSubmissions: retries, seconds: (Date.now() - t0) / 1000 }));
    expect(problems).toEqual([]);
    expect(retries).toBeGreaterThan(0);

    const p = world.project.id;
    const stored = await db.execute<{ n: number }>(sql`select count(*)::int as n from labels where project_id = ${p}`);
    expect(stored.rows[0].n).toBe(acknowledged.size);

    const over = await db.execute(sql`
      select i.id from items i where i.project_id = ${p} and not i.is_control
        and (select count(*) from labels l where l.item_id = i.id and l.undone_at is null) > ${OVERLAP}`);
    expect(over.rows).toEqual([]);

    const twice = await db.execute(sql`select item_id, annotator_id from labels where project_id = ${p} group by 1, 2 having count(*) > 1`);
    expect(twice.rows).toEqual([]);

    // With 22 annotators and overlap 2, every regular item ends with exactly 2 labels and a matching counter.
    const counts = await db.execute<{ id: number; label_count: number; live: number; distinct_classes: number; status: string; final_class_id: number | null; open_disputes: number; is_control: boolean }>(sql`
      select i.id, i.label_count, i.status, i.final_class_id, i.is_control,
        (select count(*)::int from labels l where l.item_id = i.id) as live,
        (select count(distinct l.class_id)::int from labels l where l.item_id = i.id) as distinct_classes,
        (select count(*)::int from disputes d where d.item_id = i.id and d.status = 'open' and d.reason = 'disagreement') as open_disputes
      from items i where i.project_id = ${p}`);
    const regular = counts.rows.filter((r) => !r.is_control);
    expect(regular).toHaveLength(ITEMS - ITEMS / 25);
    for (const r of regular) {
      expect(r.live).toBe(OVERLAP);
      expect(r.label_count).toBe(r.live);
      if (r.distinct_classes > 1) {
        expect(r.status).toBe("disputed");
        expect(r.open_disputes).toBe(1);
        expect(r.final_class_id).toBeNull();
      } else {
        expect(r.status).toBe("agreed");
        expect(r.open_disputes).toBe(0);
        expect(r.final_class_id).not.toBeNull();
      }
    }
    // Random classes from 3 with 2 labels: P(unanimous) = 1/3, so both outcomes occur among 96 items.
    expect(regular.some((r) => r.status === "agreed")).toBe(true);
    expect(regular.some((r) => r.status === "disputed")).toBe(true);

    const controls = counts.rows.filter((r) => r.is_control);
    for (const r of controls) {
      expect(r.status).toBe("control");
      expect(r.open_disputes).toBe(0);
      expect(r.label_count).toBe(r.live);
    }
    const leases = await db.execute<{ n: number }>(sql`select count(*)::int as n from assignments where project_id = ${p} and leased_until > now()`);
    expect(leases.rows[0].n).toBe(0);
  }, 120_000);
});
