// Route × role matrix (OWASP ASVS V4 style): every route handler, every role, expected status; never another project's data.
import fs from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { api } from "../../support/http";
import { filesUnder, projectRoot, routeHandlersOnDisk } from "../../support/routes";
import { type Entry, matrix, type Need, serverActions } from "./route-matrix";
import { makeWorld, type Role, roles, type World } from "./world";

/** Every exported handler on disk, as "METHOD /api/…/[param]" (Auth.js's own routes aside). */
function routesOnDisk(): string[] {
  return routeHandlersOnDisk("app/api").filter((r) => !r.includes("/api/auth/"));
}

const memberRank: Record<string, number> = { viewer: 0, annotator: 1, reviewer: 2, owner: 3 };

/** What a role should get: "ok" (2xx), or the exact denial status. */
function expected(need: Need, role: Role, entry: Entry): "ok" | 401 | 403 | 404 {
  if (need === "public") return "ok";
  if (role === "signedOut" || role === "revokedToken") return 401;
  if (need === "user") return "ok";
  if (need === "admin") return role === "admin" ? "ok" : 403;
  if (role === "admin") return "ok";
  if (role === "outsider") return 404;
  void entry;
  return memberRank[role] >= memberRank[need] ? "ok" : 403;
}

describe("route × role matrix", () => {
  let world: World;
  beforeAll(async () => {
    world = await makeWorld();
  });

  it("covers every route handler on disk (add new routes to tests/integration/access/route-matrix.ts)", () => {
    const missing = routesOnDisk().filter((r) => !matrix[r]);
    expect(missing, `routes without a matrix entry:\n${missing.join("\n")}`).toEqual([]);
    const stale = Object.keys(matrix).filter((k) => !routesOnDisk().includes(k));
    expect(stale, "matrix entries whose route no longer exists").toEqual([]);
  });

  for (const [key, entry] of Object.entries(matrix)) {
    const [method] = key.split(" ");
    for (const role of roles) {
      it(`${key} as ${role}`, async () => {
        const call = await entry.call(world, role);
        const auth = await world.auth(role, Boolean(entry.sessionOnly));
        const res = await api(call.path, { method, body: call.body, raw: call.raw, headers: call.headers, ...auth });
        const want = expected(entry.need, role, entry);
        if (want === "ok") {
          expect(res.status, `${key} as ${role}: ${res.text.slice(0, 300)}`).toBeGreaterThanOrEqual(200);
          expect(res.status, `${key} as ${role}: ${res.text.slice(0, 300)}`).toBeLessThan(300);
        } else {
          expect(res.status, `${key} as ${role}: ${res.text.slice(0, 300)}`).toBe(want);
          if (res.json) expect(res.json.error?.code, "errors carry a stable code").toMatch(/^[a-z_]+:[a-z_]+$/);
        }
        // Never another project's data (site admins see every project by design).
        if (role === "outsider") expect(res.text).not.toContain(world.project.name);
        else if (role !== "admin") expect(res.text).not.toContain(world.other.project.name);
      });
    }
  }

  it("lists every server action on disk (add new ones to serverActions in route-matrix.ts)", () => {
    const found: string[] = [];
    for (const dir of ["app", "components", "lib"]) {
      for (const full of filesUnder(path.join(projectRoot, dir), (name) => /\.tsx?$/.test(name))) {
        const src = fs.readFileSync(full, "utf8");
        if (!/^\s*["']use server["']/m.test(src.split("\n").slice(0, 3).join("\n"))) continue;
        for (const m of src.matchAll(/export (?:const|async function|function) (\w+)/g)) found.push(`${path.relative(projectRoot, full).split(path.sep).join("/")}#${m[1]}`);
      }
    }
    expect(found.sort()).toEqual(Object.keys(serverActions).sort());
  });

  it("a project id from another project answers 404 even to its owner's token here", async () => {
    const res = await api(`/api/v1/projects/${world.other.project.id}`, { token: world.tokens.owner.secret });
    expect(res.status).toBe(404);
    const guessed = await api(`/api/v1/projects/999999`, { token: world.tokens.owner.secret });
    expect(guessed.status).toBe(404);
    const junk = await api(`/api/v1/projects/1%20or%201=1`, { token: world.tokens.owner.secret });
    expect(junk.status).toBe(404);
  });

  it("a token of another user cannot be revoked (404)", async () => {
    const res = await api(`/api/v1/tokens/${world.tokens.owner.id}`, { method: "DELETE", token: world.tokens.viewer.secret });
    expect(res.status).toBe(404);
  });

  it("a tampered paging cursor is rejected", async () => {
    const res = await api(`/api/v1/projects?limit=1&cursor=eyJpZCI6MH0.AAAAAAAAAAAAAAAAAAAAAA`, { token: world.tokens.owner.secret });
    expect(res.status).toBe(400);
    expect(res.json.error.code).toBe("bad_request:cursor");
  });
});
