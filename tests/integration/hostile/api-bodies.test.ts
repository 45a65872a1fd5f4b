// Hostile request bodies to every JSON route family: 10 000-level nesting, bodies over the limit, broken JSON.
// Expected for each: a 4xx with a stable `kind:subject` code, never a 5xx, and no item written.
import { beforeAll, describe, expect, it } from "vitest";
import { makeUser, testPassword } from "@/tests/support/fixtures";
import { api, signInCookie } from "@/tests/support/http";
import { deepJson, expectClean, itemCount } from "./support";
import { makeHostileWorld, type HostileWorld } from "./world";

/** `lenient`: every field is optional and unknown keys are dropped, so `{"a": <deep>}` is a no-op request (2xx, nothing deep kept). */
type Target = { family: string; method: string; path: (w: HostileWorld) => Promise<string> | string; as: "owner" | "annotator" | "reviewer" | "admin" | "session"; field: string; lenient?: boolean };

const targets: Target[] = [
  { family: "projects (create)", method: "POST", path: () => "/api/v1/projects", as: "owner", field: "name" },
  { family: "project (update)", method: "PATCH", path: (w) => w.base, as: "owner", field: "description", lenient: true },
  { family: "members (invite)", method: "POST", path: (w) => `${w.base}/members`, as: "owner", field: "email" },
  { family: "member (change role)", method: "PATCH", path: (w) => `${w.base}/members/${w.users.viewer.id}`, as: "owner", field: "role" },
  { family: "tokens (create)", method: "POST", path: () => "/api/v1/tokens", as: "session", field: "name" },
  { family: "admin user (update)", method: "PATCH", path: (w) => `/api/v1/admin/users/${w.users.viewer.id}`, as: "admin", field: "isAdmin" },
  { family: "item flags", method: "POST", path: async (w) => `${w.base}/items/${(await w.item()).id}/flags`, as: "annotator", field: "comment" },
  { family: "item labels", method: "POST", path: async (w) => `${w.base}/items/${(await w.item()).id}/labels`, as: "annotator", field: "clientSubmissionId" },
  { family: "ruling", method: "POST", path: async (w) => `${w.base}/disputes/${(await w.dispute()).dispute.id}/ruling`, as: "reviewer", field: "reason" },
  { family: "desk next", method: "POST", path: (w) => `${w.base}/desk/next`, as: "annotator", field: "exclude", lenient: true },
  { family: "doubts (recompute)", method: "POST", path: (w) => `${w.base}/doubts`, as: "owner", field: "x" },
  { family: "doubt to disputes", method: "POST", path: async (w) => `${w.base}/doubts/${(await w.item()).id}/dispute`, as: "owner", field: "note" },
  { family: "tuning", method: "POST", path: (w) => `${w.base}/tuning`, as: "owner", field: "x" },
  { family: "editions", method: "POST", path: (w) => `${w.base}/editions`, as: "owner", field: "include", lenient: true },
  { family: "uploads", method: "POST", path: (w) => `${w.base}/uploads`, as: "owner", field: "fileName" },
  { family: "upload complete", method: "POST", path: (w) => `${w.base}/uploads/00000000-0000-4000-8000-000000000000/complete`, as: "owner", field: "parts" },
  { family: "imports (start)", method: "POST", path: (w) => `${w.base}/imports`, as: "owner", field: "uploadIds" },
  { family: "imports (preview)", method: "POST", path: (w) => `${w.base}/imports/preview`, as: "owner", field: "uploadIds" },
  { family: "items (batch)", method: "POST", path: (w) => `${w.base}/items`, as: "owner", field: "items" },
];

let w: HostileWorld;
let cookie = "";
beforeAll(async () => {
  w = await makeHostileWorld();
  const sessionUser = await makeUser();
  cookie = await signInCookie(sessionUser.email, testPassword);
});

function authFor(t: Target) {
  if (t.as === "session") return { cookie };
  return { token: w.tokens[t.as].secret };
}

async function send(t: Target, raw: string, path?: string) {
  return api(path ?? (await t.path(w)), { ...authFor(t), method: t.method, raw, headers: { "content-type": "application/json" } });
}

describe("10 000-level nesting to every JSON route family", () => {
  const arr = deepJson(10_000, "array");
  const obj = deepJson(10_000, "object");
  for (const t of targets) {
    it(`${t.method} ${t.family}`, async () => {
      const path = await t.path(w);
      const before = await itemCount(w.project.id);
      const bodies = { "top-level array": arr, "top-level object": obj, [`inside \`${t.field}\``]: `{"${t.field}":${arr}}` };
      for (const [shape, raw] of Object.entries(bodies)) {
        const res = await send(t, raw, path);
        expectClean(res, `${t.family}, ${shape}`);
        if (t.lenient && shape === "top-level object" && res.status < 300) expect(res.text).not.toContain('{"a":{"a":');
        else expect(res.status, `${t.family}, ${shape}: ${res.text.slice(0, 200)}`).toBeGreaterThanOrEqual(400);
      }
      expect(await itemCount(w.project.id)).toBe(before);
    });
  }

  it("100 000-level nesting is refused the same way", async () => {
    const res = await send(targets[0], deepJson(100_000, "array"));
    expectClean(res, "100k");
    expect(res.status).toBe(422);
    expect(res.json.error.code).toBe("bad_request:validation");
  });
});

describe("bodies over the size limit", () => {
  const cases = [
    { name: "1.5 MB project (limit 1 MB)", target: "projects (create)", bytes: 1_500_000 },
    { name: "20 kB edition options (limit 10 kB)", target: "editions", bytes: 20_000 },
    { name: "6 MB import request (limit 5 MB)", target: "imports (start)", bytes: 6_000_000 },
    { name: "65 MiB item batch (limit 64 MiB)", target: "items (batch)", bytes: 65 * 1024 * 1024 },
  ];
  for (const c of cases) {
    it(c.name, async () => {
      const t = targets.find((x) => x.family === c.target)!;
      const before = await itemCount(w.project.id);
      const raw = `{"${t.field}":"${"x".repeat(c.bytes)}"}`;
      const res = await send(t, raw);
      expect(res.status, res.text.slice(0, 200)).toBe(413);
      expect(res.json.error.code).toBe("too_large:body");
      expect(await itemCount(w.project.id)).toBe(before);
    });
  }
});

describe("broken JSON", () => {
  for (const t of targets.filter((x) => ["projects (create)", "item flags", "ruling", "items (batch)", "imports (start)"].includes(x.family))) {
    it(`${t.family}: a body cut in the middle is 400 bad_request:json`, async () => {
      const res = await send(t, `{"${t.field}": "abc`);
      expect(res.status, res.text).toBe(400);
      expect(res.json.error.code).toBe("bad_request:json");
    });
  }
});
