// SQL- and script-looking strings in every text field the API accepts: stored exactly as sent (or refused with a 4xx
// where the field has a grammar, e.g. e-mail addresses), read back unchanged, and every table still exists.
import { eq, inArray } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { disputes, itemFlags, rulings } from "@/db/schema";
import { makeUser, testPassword } from "@/tests/support/fixtures";
import { api, signInCookie } from "@/tests/support/http";
import { expectClean, itemCount, payloads, scriptPayloads, tablesIntact } from "./support";
import { makeHostileWorld, type HostileWorld } from "./world";

let w: HostileWorld;
beforeAll(async () => {
  w = await makeHostileWorld();
});
const palette = ["#2f7f86", "#c8922a"];

describe("payloads are stored inertly", () => {
  for (const p of payloads) {
    it(`project name, description and label names: ${p}`, async () => {
      const colours = (await api(`${w.base}`, { token: w.tokens.owner.secret })).json.data.classes.map((c: { colour: string }) => c.colour);
      const colour = colours[0] ?? palette[0];
      const created = await api("/api/v1/projects", { token: w.tokens.owner.secret, body: { name: p, description: p, classes: payloads.map((name) => ({ name, colour })) } });
      expect(created.status, created.text).toBe(201);
      const id = created.json.data.id;
      const read = await api(`/api/v1/projects/${id}`, { token: w.tokens.owner.secret });
      expect(read.json.data.name).toBe(p);
      expect(read.json.data.description).toBe(p);
      expect(read.json.data.classes.map((c: { name: string }) => c.name)).toEqual([...payloads]);
      const patched = await api(`/api/v1/projects/${id}`, { token: w.tokens.owner.secret, method: "PATCH", body: { name: `${p} (renamed)`, description: `again ${p}` } });
      expect(patched.status, patched.text).toBe(200);
      const again = await api(`/api/v1/projects/${id}`, { token: w.tokens.owner.secret });
      expect([again.json.data.name, again.json.data.description]).toEqual([`${p} (renamed)`, `again ${p}`]);
      const list = await api("/api/v1/projects?limit=200", { token: w.tokens.owner.secret });
      expect(list.json.data.map((x: { name: string }) => x.name)).toContain(`${p} (renamed)`);
    });
  }

  it("item ids and fields through the batch API", async () => {
    const before = await itemCount(w.project.id);
    const batch = payloads.map((p, i) => ({ id: p, a: i, b: i, note: p }));
    const res = await api(`${w.base}/items`, { token: w.tokens.owner.secret, body: { items: batch, columns: [{ name: "id", role: "id" }, { name: "a", role: "numeric" }, { name: "b", role: "numeric" }, { name: "note", role: "text" }] } });
    expect(res.status, res.text).toBe(201);
    expect(await itemCount(w.project.id)).toBe(before + payloads.length);
    for (const p of payloads) {
      const found = await api(`${w.base}/items?q=${encodeURIComponent(p)}`, { token: w.tokens.viewer.secret });
      expect(found.json.items.map((i: { externalId: string }) => i.externalId)).toEqual([p]);
      const detail = await api(`${w.base}/items/${found.json.items[0].id}`, { token: w.tokens.viewer.secret });
      expect(detail.json.item.fields.note).toBe(p);
    }
  });

  it("flag comments", async () => {
    const ids: number[] = [];
    for (const p of payloads) {
      const item = await w.item();
      const res = await api(`${w.base}/items/${item.id}/flags`, { token: w.tokens.annotator.secret, body: { kind: "flag", comment: p } });
      expect(res.status, res.text).toBe(201);
      expect(res.json.data.comment).toBe(p);
      ids.push(res.json.data.id);
    }
    const rows = await db.select({ comment: itemFlags.comment }).from(itemFlags).where(inArray(itemFlags.id, ids)).orderBy(itemFlags.id);
    expect(rows.map((r) => r.comment)).toEqual([...payloads]);
  });

  it("ruling reasons", async () => {
    for (const p of payloads) {
      const { dispute } = await w.dispute();
      const res = await api(`${w.base}/disputes/${dispute.id}/ruling`, { token: w.tokens.reviewer.secret, body: { classId: w.classes[0].id, reason: p } });
      expect(res.status, res.text).toBe(201);
      expect(res.json.data.reason).toBe(p);
      const [row] = await db.select({ reason: rulings.reason }).from(rulings).where(eq(rulings.disputeId, dispute.id));
      expect(row.reason).toBe(p);
    }
  });

  it("notes on doubts sent to Disputes", async () => {
    for (const p of payloads) {
      const item = await w.item();
      const res = await api(`${w.base}/doubts/${item.id}/dispute`, { token: w.tokens.owner.secret, body: { note: p } });
      expect(res.status, res.text).toBe(201);
      const [row] = await db.select({ note: disputes.note }).from(disputes).where(eq(disputes.id, res.json.data.disputeId));
      expect(row.note).toBe(p);
    }
  });

  it("API token names (session only)", async () => {
    const user = await makeUser();
    const cookie = await signInCookie(user.email, testPassword);
    for (const p of payloads) {
      const res = await api("/api/v1/tokens", { cookie, body: { name: p } });
      expect(res.status, res.text).toBe(201);
      expect(res.json.data.name).toBe(p);
    }
    const list = await api("/api/v1/tokens", { cookie });
    expect(list.json.data.map((t: { name: string }) => t.name).sort()).toEqual([...payloads].sort());
  });

  it("upload file names", async () => {
    for (const p of payloads) {
      const res = await api(`${w.base}/uploads`, { token: w.tokens.owner.secret, body: { fileName: `${p}.csv`, size: 10, contentType: "text/csv" } });
      expect(res.status, res.text).toBe(201);
      expect(res.json.upload.fileName).toBe(`${p}.csv`);
      expect(decodeURIComponent(new URL(res.json.url).pathname)).not.toMatch(/[<>'"; ]/);
    }
  });

  it("invitation e-mails: script-looking addresses are refused (422), quote-and-dash addresses are stored exactly", async () => {
    for (const p of [...scriptPayloads, "'; drop table items; --@example.test", "1 or 1=1@example.test"]) {
      const res = await api(`${w.base}/members`, { token: w.tokens.owner.secret, body: { email: p, role: "viewer" } });
      expect(res.status, `${p}: ${res.text}`).toBe(422);
      expect(res.json.error.code).toBe("bad_request:validation");
      expect(res.json.error.fields[0].path).toBe("email");
    }
    for (const p of ["'--@example.test", "o'brien+or-1@example.test"]) {
      const res = await api(`${w.base}/members`, { token: w.tokens.owner.secret, body: { email: p, role: "viewer" } });
      expect(res.status, res.text).toBe(201);
    }
    const list = await api(`${w.base}/members`, { token: w.tokens.owner.secret });
    expect(list.json.invitations.map((i: { email: string }) => i.email)).toEqual(expect.arrayContaining(["'--@example.test", "o'brien+or-1@example.test"]));
  });

  it("a NUL character in text fields is refused with a 4xx (or stored exactly), never a 500", async () => {
    const nul = "before\u0000after";
    const item = await w.item();
    const { dispute } = await w.dispute();
    const calls: Array<[string, string, Record<string, unknown>, string]> = [
      ["project name", "/api/v1/projects", { name: nul, classes: [{ name: "a", colour: palette[0] }, { name: "b", colour: palette[1] }] }, "POST"],
      ["label name", "/api/v1/projects", { name: "nul labels", classes: [{ name: nul, colour: palette[0] }, { name: "b", colour: palette[1] }] }, "POST"],
      ["project description", w.base, { description: nul }, "PATCH"],
      ["flag comment", `${w.base}/items/${item.id}/flags`, { kind: "flag", comment: nul }, "POST"],
      ["ruling reason", `${w.base}/disputes/${dispute.id}/ruling`, { classId: w.classes[0].id, reason: nul }, "POST"],
      ["upload file name", `${w.base}/uploads`, { fileName: `${nul}.csv`, size: 10 }, "POST"],
    ];
    const failures: string[] = [];
    for (const [name, path, body, method] of calls) {
      const token = name === "flag comment" ? w.tokens.annotator.secret : name === "ruling reason" ? w.tokens.reviewer.secret : w.tokens.owner.secret;
      const res = await api(path, { token, method, body });
      if (res.status >= 500) failures.push(`${name}: ${res.status} ${res.text.slice(0, 120)}`);
    }
    expect(failures).toEqual([]);
  });

  it("the audit trail carries the payloads as data, and the tables still exist", async () => {
    const audit = await api(`${w.base}/audit`, { token: w.tokens.owner.secret });
    expectClean(audit, "audit");
    expect(audit.status).toBe(200);
    await tablesIntact();
  });
});
