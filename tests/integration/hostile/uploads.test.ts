// Hostile files through the real upload path (presigned PUT → complete → preview → import by the worker).
// Each case names its expected outcome; every failed case must leave zero items in its project.
import { beforeAll, describe, expect, it } from "vitest";
import { makeProject, makeToken, makeUser } from "@/tests/support/fixtures";
import { api } from "@/tests/support/http";
import { expectClean, hostileFixture, importAndWait, importFixture, itemCount, tablesIntact, uploadBytes } from "./support";

type Col = { name: string; role: string; width?: number };
type Outcome = { fail: RegExp } | { succeed: number };
type Case = { name: string; file: string; bytes: () => Uint8Array; format: "csv" | "jsonl" | "parquet" | "images"; columns?: Col[]; outcome: Outcome; check?: (projectId: number) => Promise<void> };

const idDepth: Col[] = [{ name: "id", role: "id" }, { name: "depth_m", role: "numeric" }];
const idDepthNote: Col[] = [...idDepth, { name: "note", role: "text" }];
const vector3: Col[] = [{ name: "id", role: "id" }, { name: "embedding", role: "vector", width: 3 }];
const h = (f: string) => () => hostileFixture(f);
const m = (f: string) => () => importFixture(`malformed/${f}`);

// 3 MiB in one quoted field, and a 9 MiB first line with no newline and no delimiter.
const giantField = () => Buffer.from(`id,depth_m,note\ng-1,1,"${"x".repeat(3 * 1024 * 1024)}"\ng-2,2,short\n`);
const giantLine = () => Buffer.from("a".repeat(9 * 1024 * 1024));

const cases: Case[] = [
  { name: "truncated Parquet (footer cut off)", file: "truncated.parquet", bytes: h("truncated.parquet"), format: "parquet", columns: [{ name: "id", role: "id" }, { name: "width_cm", role: "numeric" }], outcome: { fail: /not a readable Parquet file/ } },
  { name: "Parquet magic around garbage", file: "garbage.parquet", bytes: h("garbage.parquet"), format: "parquet", columns: [{ name: "id", role: "id" }, { name: "width_cm", role: "numeric" }], outcome: { fail: /not a readable Parquet file/ } },
  { name: "CSV with a quote that never closes", file: "unterminated-quote.csv", bytes: h("unterminated-quote.csv"), format: "csv", columns: idDepthNote, outcome: { fail: /Row 1: a quoted field opens but never closes/ } },
  { name: "ragged vectors (JSON Lines)", file: "ragged-vectors.jsonl", bytes: h("ragged-vectors.jsonl"), format: "jsonl", columns: vector3, outcome: { fail: /row 3, column `embedding`: the vector has 2 values/ } },
  { name: "NaN and Infinity inside vectors", file: "nan-vector.csv", bytes: h("nan-vector.csv"), format: "csv", columns: vector3, outcome: { fail: /row 2, column `embedding`/ } },
  { name: "NUL byte inside a text field", file: "nul-byte.csv", bytes: h("nul-byte.csv"), format: "csv", columns: idDepthNote, outcome: { fail: /row 1, column `note`/ } },
  { name: "binary noise named .csv", file: "binary-noise.csv", bytes: h("binary-noise.csv"), format: "csv", columns: idDepth, outcome: { fail: /not valid UTF-8 \(the first bad byte, 0xfc, is at byte 1/ } },
  { name: "a 3 MiB field (no per-field limit: stored whole)", file: "giant-field.csv", bytes: giantField, format: "csv", columns: idDepthNote, outcome: { succeed: 2 }, check: async (projectId) => {
    const list = await api(`/api/v1/projects/${projectId}/items?q=g-1`, { token });
    const item = await api(`/api/v1/projects/${projectId}/items/${list.json.items[0].id}`, { token });
    expect(item.json.item.fields.note).toBe("x".repeat(3 * 1024 * 1024));
  } },
  { name: "a 9 MiB line without newline or delimiter", file: "giant-line.csv", bytes: giantLine, format: "csv", columns: idDepth, outcome: { fail: /The column `id` is in the role mapping but not in the file/ } },
  { name: "unknown label in the prior-label column", file: "unknown-label.csv", bytes: m("unknown-label.csv"), format: "csv", columns: [...idDepth, { name: "label", role: "prior_label" }], outcome: { fail: /'zebra' is not in the label set/ } },
  { name: "PNG header claiming 100 000 × 100 000 pixels", file: "huge-pixels.png", bytes: h("huge-pixels.png"), format: "images", outcome: { fail: /`huge-pixels\.png` is not an image Vicinal can read/ } },
  { name: "SVG with a script, named .png", file: "svg-script.png", bytes: h("svg-script.png"), format: "images", outcome: { fail: /`svg-script\.png` is not an image Vicinal can read/ } },
  { name: "GIF (not an accepted format)", file: "tiny.gif", bytes: h("tiny.gif"), format: "images", outcome: { fail: /`tiny\.gif` is not an image Vicinal can read/ } },
  { name: "PNG cut after 60 bytes", file: "truncated-image.png", bytes: h("truncated-image.png"), format: "images", outcome: { fail: /`truncated-image\.png` is not an image Vicinal can read/ } },
  { name: "text file named .png", file: "not-an-image.png", bytes: m("not-an-image.png"), format: "images", outcome: { fail: /`not-an-image\.png` is not an image Vicinal can read/ } },
  { name: "zip bomb (30 MiB of zeros)", file: "bomb.zip", bytes: m("bomb.zip"), format: "images", outcome: { fail: /decompression bomb/ } },
  { name: "zip entry ../../etc/evil.png", file: "traversal.zip", bytes: m("traversal.zip"), format: "images", outcome: { fail: /unsafe path \(`\.\.\/\.\.\/etc\/evil\.png`\)/ } },
  { name: "zip entry with an absolute path", file: "absolute-path.zip", bytes: h("absolute-path.zip"), format: "images", outcome: { fail: /unsafe path \(`\/etc\/evil\.png`\)/ } },
  { name: "zip cut in the middle", file: "truncated.zip", bytes: h("truncated.zip"), format: "images", outcome: { fail: /`truncated\.zip` is not a readable zip/ } },
  { name: "zip inside a zip", file: "zip-in-zip.zip", bytes: h("zip-in-zip.zip"), format: "images", outcome: { fail: /`inner\.zip` is not an image Vicinal can read/ } },
  { name: "SQL- and script-looking ids and text (stored inertly)", file: "script-and-sql.csv", bytes: h("script-and-sql.csv"), format: "csv", columns: idDepthNote, outcome: { succeed: 3 } },
];

let token = "";
beforeAll(async () => {
  const owner = await makeUser();
  token = (await makeToken(owner.id)).secret;
  (globalThis as { hostileOwner?: string }).hostileOwner = owner.id;
});

async function freshProject() {
  const ownerId = (globalThis as { hostileOwner?: string }).hostileOwner!;
  return (await makeProject({ members: [{ userId: ownerId, role: "owner" }] })).project;
}

describe("hostile files: a clear error or inert storage, never a partial import", () => {
  for (const c of cases) {
    it(c.name, async () => {
      const project = await freshProject();
      const before = await itemCount(project.id);
      expect(before).toBe(0);
      const up = await uploadBytes(project.id, token, c.file, c.bytes());
      expect(up.done?.status, up.done?.text).toBe(200);
      const preview = await api(`/api/v1/projects/${project.id}/imports/preview`, { token, body: { uploadIds: [up.id] } });
      expectClean(preview, `${c.name} (preview)`);
      if (preview.status >= 400) expect(preview.json.error.code).toBe("bad_request:file");
      const { started, final } = await importAndWait(project.id, token, { uploadIds: [up.id], format: c.format, columns: c.columns ?? [] });
      expect(started.status, started.text).toBe(202);
      const said = [final!.message ?? "", ...((final!.errors as Array<{ message: string; row: number | null; column: string | null }>) ?? []).map((e) => `row ${e.row}, column \`${e.column}\`: ${e.message}`)].join("\n");
      if ("fail" in c.outcome) {
        expect(final!.status, said).toBe("failed");
        expect(said).toMatch(c.outcome.fail);
        expect(final!.itemsCreated).toBe(0);
        expect(await itemCount(project.id)).toBe(0);
      } else {
        expect(final!.status, said).toBe("succeeded");
        expect(await itemCount(project.id)).toBe(c.outcome.succeed);
        await c.check?.(project.id);
      }
    });
  }

  it("stores SQL- and script-looking ids and text exactly as sent, and the tables survive", async () => {
    const project = await freshProject();
    const up = await uploadBytes(project.id, token, "script-and-sql.csv", hostileFixture("script-and-sql.csv"));
    await importAndWait(project.id, token, { uploadIds: [up.id], format: "csv", columns: idDepthNote });
    const list = await api(`/api/v1/projects/${project.id}/items?limit=10`, { token });
    expect(list.status).toBe(200);
    expect(list.json.items.map((i: { externalId: string }) => i.externalId)).toEqual(["'; drop table items; --", "1 or 1=1", "<b>bold</b>"]);
    const notes = [];
    for (const it of list.json.items) notes.push((await api(`/api/v1/projects/${project.id}/items/${it.id}`, { token })).json.item.fields.note);
    expect(notes).toEqual(["<script>window.__pwned=1</script>", '"><img src=x onerror=window.__pwned=1>', "Robert'); DROP TABLE labels;--"]);
    await tablesIntact();
  });
});

describe("hostile upload requests", () => {
  it("an empty file is refused at registration (400 bad_request:empty_file)", async () => {
    const project = await freshProject();
    const res = await api(`/api/v1/projects/${project.id}/uploads`, { token, body: { fileName: "empty.csv", size: 0 } });
    expect(res.status).toBe(400);
    expect(res.json.error.code).toBe("bad_request:empty_file");
  });

  it("a file bigger than announced is refused at completion (409 conflict:upload) and cannot be imported", async () => {
    const project = await freshProject();
    const base = `/api/v1/projects/${project.id}`;
    const start = await api(`${base}/uploads`, { token, body: { fileName: "lies.csv", size: 10, contentType: "text/csv" } });
    await fetch(start.json.url, { method: "PUT", body: "id,depth_m\nx-1,1\nx-2,2\n", headers: { "content-type": "text/csv" } });
    const done = await api(`${base}/uploads/${start.json.upload.id}/complete`, { token, body: {} });
    expect(done.status).toBe(409);
    expect(done.json.error.code).toBe("conflict:upload");
    const imp = await api(`${base}/imports`, { token, body: { uploadIds: [start.json.upload.id], format: "csv", columns: idDepth } });
    expectClean(imp, "import of a failed upload");
    expect(imp.status).toBeGreaterThanOrEqual(400);
    expect(await itemCount(project.id)).toBe(0);
  });

  it("a path-traversal file name is stored as a name only; the object key stays inside the upload's folder", async () => {
    const project = await freshProject();
    const up = await uploadBytes(project.id, token, "../../../etc/passwd.csv", Buffer.from("id,depth_m\np-1,1\n"), "text/csv");
    expect(up.done?.status).toBe(200);
    expect(up.done?.json.upload.fileName).toBe("../../../etc/passwd.csv");
    const url = new URL(up.start.json.url);
    expect(decodeURIComponent(url.pathname)).toMatch(new RegExp(`/projects/${project.id}/uploads/${up.id}/[^/]*passwd\\.csv$`));
    expect(decodeURIComponent(url.pathname).split("/")).not.toContain("..");
  });
});
