// Hostile values through the pipeline batch API and hostile query strings: refused whole (4xx), nothing stored.
import { count, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { labels } from "@/db/schema";
import { makeProject } from "@/tests/support/fixtures";
import { api } from "@/tests/support/http";
import { expectClean, itemCount, tablesIntact } from "./support";
import { makeHostileWorld, type HostileWorld } from "./world";

let w: HostileWorld;
let other: { project: { id: number }; classes: Array<{ id: number }> };
beforeAll(async () => {
  w = await makeHostileWorld();
  other = await makeProject();
});

type BatchCase = { name: string; raw: string; contentType?: string; code: string; says?: RegExp; fresh?: boolean };
const row = (extra: string) => `{"id":"b-${Math.random().toString(36).slice(2, 8)}","a":1,"b":2${extra}}`;

const batchCases: BatchCase[] = [
  { name: "1e999 (parses to Infinity) in a numeric column", raw: `[${row("")},{"id":"inf-1","a":1e999,"b":2}]`, code: "bad_request:items", says: /row 2, column `a`/ },
  { name: "\"NaN\" as a number", raw: `[${row("")},{"id":"nan-1","a":"NaN","b":2}]`, code: "bad_request:items", says: /row 2, column `a`/ },
  { name: "a number as an object ({\"$gt\": 0})", raw: `[{"id":"obj-1","a":{"$gt":0},"b":2}]`, code: "bad_request:items", says: /row 1, column `a`/ },
  { name: "an id of 1 MB", raw: `[{"id":"${"i".repeat(1_000_000)}","a":1,"b":2}]`, code: "bad_request:items", says: /row 1, column `id`/ },
  { name: "the same id twice in one batch", raw: `[{"id":"dup-1","a":1,"b":2},{"id":"dup-1","a":3,"b":4}]`, code: "bad_request:items", says: /row 2, column `id`/ },
  { name: "an unknown prior label", raw: `[{"id":"lab-1","a":1,"b":2,"priorLabel":"zebra"}]`, code: "bad_request:items", says: /'zebra' is not in the label set/ },
  { name: "a non-object item", raw: `[${row("")},"just a string"]`, code: "bad_request:items", says: /Item 2 is not a JSON object/ },
  { name: "NDJSON with one broken line", raw: `${row("")}\n{"id":"x",\n`, contentType: "application/x-ndjson", code: "bad_request:json", says: /Line 2 is not valid JSON/ },
  { name: "an empty batch", raw: "[]", code: "bad_request:items" },
  { name: "ragged vectors (fresh project)", raw: `[{"id":"v-1","embedding":[1,2,3]},{"id":"v-2","embedding":[1,2]}]`, code: "bad_request:items", says: /row 2, column `embedding`: the vector has 2 values/, fresh: true },
  { name: "NaN hidden in a vector (fresh project)", raw: `[{"id":"v-1","embedding":[1,2,3]},{"id":"v-2","embedding":[1,"NaN",3]}]`, code: "bad_request:items", says: /row 2, column `embedding`/, fresh: true },
];

describe("hostile item batches are refused whole", () => {
  for (const c of batchCases) {
    it(c.name, async () => {
      const projectId = c.fresh ? (await makeProject({ members: [{ userId: w.users.owner.id, role: "owner" }] })).project.id : w.project.id;
      const before = await itemCount(projectId);
      const res = await api(`/api/v1/projects/${projectId}/items`, { token: w.tokens.owner.secret, method: "POST", raw: c.raw, headers: { "content-type": c.contentType ?? "application/json" } });
      expectClean(res, c.name);
      expect(res.json?.error?.code, res.text.slice(0, 300)).toBe(c.code);
      if (c.says) expect(`${res.json.error.message}\n${JSON.stringify(res.json.error.details ?? "")}`).toMatch(c.says);
      expect(await itemCount(projectId)).toBe(before);
    });
  }

  it("a NUL character in a text field: refused with a 4xx or stored exactly, never a 500", async () => {
    const before = await itemCount(w.project.id);
    const res = await api(`${w.base}/items`, { token: w.tokens.owner.secret, body: [{ id: "nul-1", a: 1, b: 2, note: "before\u0000after" }] });
    expectClean(res, "NUL in a field");
    if (res.status >= 400) expect(await itemCount(w.project.id)).toBe(before);
    else {
      const list = await api(`${w.base}/items?q=nul-1`, { token: w.tokens.owner.secret });
      const item = await api(`${w.base}/items/${list.json.items[0].id}`, { token: w.tokens.owner.secret });
      expect(item.json.item.fields.note).toBe("before\u0000after");
    }
  });

  it("a __proto__ key is data, not a prototype: refused or stored as a plain field", async () => {
    const res = await api(`${w.base}/items`, { token: w.tokens.owner.secret, method: "POST", raw: '[{"id":"proto-1","a":1,"b":2,"__proto__":{"isAdmin":true}}]', headers: { "content-type": "application/json" } });
    expectClean(res, "__proto__");
    const me = await api("/api/v1/me", { token: w.tokens.owner.secret });
    expect(me.status).toBe(200);
    expect(JSON.stringify(me.json)).not.toMatch(/"isAdmin":true/);
  });
});

describe("references to things outside the project", () => {
  it("a label with another project's class is refused, nothing stored", async () => {
    const item = await w.item();
    const res = await api(`${w.base}/items/${item.id}/labels`, { token: w.tokens.annotator.secret, body: { clientSubmissionId: crypto.randomUUID(), classId: other.classes[0].id } });
    expectClean(res, "foreign class");
    expect(res.status).toBeGreaterThanOrEqual(400);
    const [n] = await db.select({ n: count() }).from(labels).where(eq(labels.itemId, item.id));
    expect(n.n).toBe(0);
  });

  it("a ruling with an unknown class is refused", async () => {
    const { dispute } = await w.dispute();
    const res = await api(`${w.base}/disputes/${dispute.id}/ruling`, { token: w.tokens.reviewer.secret, body: { classId: 2_000_000_000, reason: "a plain reason" } });
    expectClean(res, "unknown class in ruling");
    expect(res.status).toBeGreaterThanOrEqual(400);
  });
});

describe("hostile query strings", () => {
  const q = (s: string) => encodeURIComponent(s);
  const cases: Array<{ name: string; path: () => string; status: number; code?: string }> = [
    { name: "item search `'; drop table items; --`", path: () => `${w.base}/items?q=${q("'; drop table items; --")}`, status: 200 },
    { name: "item search `1 or 1=1`", path: () => `${w.base}/items?q=${q("1 or 1=1")}`, status: 200 },
    { name: "item search with LIKE wildcards `%_%`", path: () => `${w.base}/items?q=${q("%_%")}`, status: 200 },
    { name: "sort by an SQL fragment", path: () => `${w.base}/items?sort=${q("seq; drop table items")}`, status: 422, code: "bad_request:validation" },
    { name: "limit = 1e999", path: () => `${w.base}/items?limit=1e999`, status: 422, code: "bad_request:validation" },
    { name: "a forged cursor", path: () => `${w.base}/items?cursor=${q(Buffer.from('{"seq":"0 or 1=1"}').toString("base64url"))}.AAAAAAAAAAAAAAAAAAAAAA`, status: 400, code: "bad_request:cursor" },
    { name: "time zone `UTC'; drop table labels; --`", path: () => `${w.base}/dashboard?tz=${q("UTC'; drop table labels; --")}`, status: 422, code: "bad_request:validation" },
    { name: "Desk exclude list `1;drop`", path: () => `${w.base}/desk/next?exclude=${q("1;drop")}`, status: 422, code: "bad_request:validation" },
    { name: "a project id `1 or 1=1`", path: () => `/api/v1/projects/${q("1 or 1=1")}`, status: 404, code: "not_found:project" },
  ];
  for (const c of cases) {
    it(c.name, async () => {
      const res = await api(c.path(), { token: w.tokens.owner.secret });
      expectClean(res, c.name);
      expect(res.status, res.text.slice(0, 200)).toBe(c.status);
      if (c.code) expect(res.json.error.code).toBe(c.code);
      if (c.status === 200 && res.json.total !== undefined) expect(res.json.total).toBe(0);
    });
  }

  it("the tables are all still there", async () => {
    await tablesIntact();
    expect(await itemCount(w.project.id)).toBeGreaterThan(0);
  });
});
