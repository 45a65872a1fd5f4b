// A pipeline script's view of Vicinal: only fetch and API tokens after the fixtures (owner, annotator, project, tokens).
import { randomUUID } from "node:crypto";
import { sql } from "drizzle-orm";
import Papa from "papaparse";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { SYNC_SETTLE_SECONDS } from "@/lib/labelling/constants";
import { handleEdition } from "@/worker/jobs/edition";
import { makeProject, makeToken, makeUser } from "../../support/fixtures";
import { appUrl } from "../../support/http";

type Answer = { status: number; body: any };

async function call(token: string, method: string, path: string, body?: unknown): Promise<Answer> {
  const res = await fetch(`${appUrl}${path}`, {
    method,
    headers: { authorization: `Bearer ${token}`, ...(body === undefined ? {} : { "content-type": "application/json" }) },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const text = await res.text();
  return { status: res.status, body: text ? JSON.parse(text) : null };
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
// Invented readings for the demo flow; "storm" when the pressure is below 1000 hPa.
const readings = Array.from({ length: 6 }, (_, i) => ({ id: `station-${i + 1}`, pressure: 985 + i * 6, wind: 3 + i }));
const expectedClass = (pressure: number) => (pressure < 1000 ? "storm" : "calm");

let owner: string;
let annotator: string;
let annotatorId: string;
let base: string;
let classIds: Record<string, number>;

beforeAll(async () => {
  const o = await makeUser({ name: "Script Owner" });
  const a = await makeUser({ name: "Script Annotator" });
  annotatorId = a.id;
  const { project, classes } = await makeProject({
    classes: ["calm", "storm"],
    settings: { overlap: 1, blindShare: 0, controlRate: 0 },
    members: [
      { userId: o.id, role: "owner" },
      { userId: a.id, role: "annotator" },
    ],
  });
  owner = (await makeToken(o.id)).secret;
  annotator = (await makeToken(a.id)).secret;
  base = `/api/v1/projects/${project.id}`;
  classIds = Object.fromEntries(classes.map((c) => [c.name, c.id]));
});

describe("a script with an API token", () => {
  const labelled = new Map<string, string>();
  let editionId = 0;

  it("creates items in one batch, idempotently, and reads them back by cursor", async () => {
    const created = await call(owner, "POST", `${base}/items`, { items: readings });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ received: 6, created: 6, skipped: 0 });
    const again = await call(owner, "POST", `${base}/items`, { items: readings });
    expect(again.status).toBe(200);
    expect(again.body).toMatchObject({ created: 0, skipped: 6 });

    const seen: Array<{ externalId: string; fields: Record<string, unknown> }> = [];
    let cursor: string | null = null;
    do {
      const page: Answer = await call(owner, "GET", `${base}/items?limit=4${cursor ? `&cursor=${encodeURIComponent(cursor)}` : ""}`);
      expect(page.status).toBe(200);
      seen.push(...page.body.items);
      cursor = page.body.nextCursor;
    } while (cursor);
    expect(seen.map((i) => i.externalId).sort()).toEqual(readings.map((r) => r.id).sort());
    const third = seen.find((i) => i.externalId === "station-3") as unknown as { id: number };
    const one = await call(owner, "GET", `${base}/items/${third.id}`);
    expect(one.status).toBe(200);
    expect(one.body.item.features).toEqual([
      { name: "pressure", kind: "numeric", value: 997 },
      { name: "wind", kind: "numeric", value: 5 },
    ]);
  });

  it("labels four items through the Desk with the annotator's token", async () => {
    for (let n = 0; n < 4; n += 1) {
      const next = await call(annotator, "GET", `${base}/desk/next`);
      expect(next.status).toBe(200);
      const item = next.body.data;
      expect(item).not.toBeNull();
      const name = expectedClass(Number(item.fields.pressure));
      const res = await call(annotator, "POST", `${base}/items/${item.itemId}/labels`, { clientSubmissionId: randomUUID(), classId: classIds[name], via: "choose", suggestionToken: item.suggestionToken });
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      labelled.set(item.externalId, name);
    }
    const wrongRole = await call(annotator, "POST", `${base}/editions`, {});
    expect(wrongRole.status).toBe(403);
    expect(wrongRole.body.error.code).toBe("forbidden:role");
  });

  it("syncs labels with the since-cursor once they settle", async () => {
    const fresh = await call(owner, "GET", `${base}/labels`);
    expect(fresh.body.data).toHaveLength(0);
    expect(fresh.body.settleSeconds).toBe(SYNC_SETTLE_SECONDS);
    // Stands in for waiting SYNC_SETTLE_SECONDS: the labels are made older than the settle window.
    await db.execute(sql`update labels set created_at = created_at - make_interval(secs => ${SYNC_SETTLE_SECONDS + 5}) where annotator_id = ${annotatorId}`);
    const first = await call(owner, "GET", `${base}/labels?limit=3`);
    expect(first.body.data).toHaveLength(3);
    expect(first.body.more).toBe(true);
    const second = await call(owner, "GET", `${base}/labels?limit=3&since=${encodeURIComponent(first.body.next)}`);
    expect(second.body.data).toHaveLength(1);
    expect(second.body.more).toBe(false);
    const rows = [...first.body.data, ...second.body.data];
    expect(new Set(rows.map((l: { id: number }) => l.id)).size).toBe(4);
    for (const l of rows) expect(l.classId).toBe(classIds[labelled.get(l.externalId) ?? "?"]);
    const nothingNew = await call(owner, "GET", `${base}/labels?since=${encodeURIComponent(second.body.next)}`);
    expect(nothingNew.body.data).toHaveLength(0);
    const tampered = await call(owner, "GET", `${base}/labels?since=${encodeURIComponent(`${second.body.next.split(".")[0]}.AAAAAAAAAAAAAAAAAAAAAA`)}`);
    expect(tampered.status).toBe(400);
    expect(tampered.body.error.code).toBe("bad_request:cursor");
  });

  it("publishes an edition, waits for it, downloads the CSV and finds the labelled rows", async () => {
    const created = await call(owner, "POST", `${base}/editions`, {});
    expect(created.status).toBe(202);
    editionId = created.body.data.id;
    let detail = await call(owner, "GET", `${base}/editions/${editionId}`);
    for (let i = 0; i < 6 && detail.body.data.status !== "succeeded"; i += 1) {
      await sleep(500);
      detail = await call(owner, "GET", `${base}/editions/${editionId}`);
    }
    // The worker may not run edition jobs yet; then the script test runs the job itself.
    if (detail.body.data.status !== "succeeded") await handleEdition({ editionId });
    detail = await call(owner, "GET", `${base}/editions/${editionId}`);
    expect(detail.body.data.status).toBe("succeeded");
    expect(detail.body.data.rows).toBe(4);

    const link = await call(owner, "GET", `${base}/editions/${editionId}/download?format=csv`);
    expect(link.status).toBe(200);
    const file = await fetch(link.body.url);
    expect(file.status).toBe(200);
    const parsed = Papa.parse<Record<string, string>>(await file.text(), { header: true, skipEmptyLines: true });
    expect(parsed.data).toHaveLength(4);
    for (const row of parsed.data) {
      expect(row.final_label).toBe(labelled.get(row.external_id));
      expect(row.label_source).toBe("single");
      expect(row[`label:${annotatorId}`]).toBe(row.final_label);
      const reading = readings.find((r) => r.id === row.external_id);
      expect(Number(row["feature:pressure"])).toBe(reading?.pressure);
    }
  });

  it("finds the new edition in the list and reads the document that describes all this", async () => {
    const list = await call(owner, "GET", `${base}/editions?limit=1`);
    expect(list.body.data[0].id).toBe(editionId);
    const res = await fetch(`${appUrl}/api/v1/openapi.json`);
    expect(res.status).toBe(200);
    const doc = await res.json();
    expect(doc.openapi).toBe("3.1.0");
    expect(Object.keys(doc.paths)).toContain("/api/v1/projects/{projectId}/labels");
  });
});
