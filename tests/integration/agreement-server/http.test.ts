// GET /api/v1/projects/{projectId}/agreement through the real app server: roles, names, shape.
import { beforeAll, describe, expect, it } from "vitest";
import { makeRoleWorld, makeUser } from "../../support/fixtures";
import { api } from "../../support/http";
import { insertItems, insertLabels, type LabelSpec } from "./world";

describe("GET /api/v1/projects/{projectId}/agreement", () => {
  let world: Awaited<ReturnType<typeof makeRoleWorld>>;
  let raters: Array<{ id: string; name: string | null }>;
  beforeAll(async () => {
    world = await makeRoleWorld();
    raters = [world.users.annotator, await makeUser({ name: "Second Rater" }), await makeUser({ name: "Third Rater" })];
    const ids = world.classes.map((c) => c.id);
    const itemIds = await insertItems(world.project.id, Array.from({ length: 12 }, (_, i) => ({ externalId: `h-${i}`, isBlind: i < 4, finalClassId: ids[i % 3] })));
    const specs: LabelSpec[] = itemIds.flatMap((item, i) =>
      raters.map((r, j) => ({
        item,
        annotator: r.id,
        classId: ids[(i + (j === 2 && i % 4 === 0 ? 1 : 0)) % 3],
        suggestion: i < 4 ? ("hidden" as const) : ("shown" as const),
        topClassId: ids[i % 3],
        took: i >= 4 && j === 0,
      })),
    );
    await insertLabels(world.project.id, specs);
  });

  const path = () => `/api/v1/projects/${world.project.id}/agreement`;

  it("answers 200 with the report to every member role and site admins", async () => {
    for (const role of ["admin", "owner", "reviewer", "annotator", "viewer"] as const) {
      const res = await api(path(), { token: world.tokens[role].secret });
      expect(res.status, role).toBe(200);
      expect(res.json.data.status).toBe("ready");
      expect(res.json.data.report.labels).toBe(36);
      expect(res.json.data.report.overall.krippendorffAlpha.ci95).not.toBeNull();
      expect(res.json.data.report.blind.ratings).toBe(12);
      expect(res.headers.get("cache-control")).toBe("no-store");
    }
  });

  it("denies outsiders (404), signed-out callers (401), and unknown or malformed project ids (404)", async () => {
    expect((await api(path(), { token: world.tokens.outsider.secret })).status).toBe(404);
    expect((await api(path())).status).toBe(401);
    expect((await api(`/api/v1/projects/999999999/agreement`, { token: world.tokens.owner.secret })).status).toBe(404);
    expect((await api(`/api/v1/projects/abc/agreement`, { token: world.tokens.owner.secret })).status).toBe(404);
    expect((await api(`/api/v1/projects/${world.other.project.id}/agreement`, { token: world.tokens.viewer.secret })).status).toBe(404);
  });

  it("names annotators for owners and reviewers, never for viewers or annotators", async () => {
    for (const role of ["owner", "reviewer", "admin"] as const) {
      const res = await api(path(), { token: world.tokens[role].secret });
      expect(res.json.data.namesVisible, role).toBe(true);
      expect(res.text).toContain("Second Rater");
      expect(res.text).toContain(raters[1].id);
    }
    for (const role of ["viewer", "annotator"] as const) {
      const res = await api(path(), { token: world.tokens[role].secret });
      expect(res.json.data.namesVisible, role).toBe(false);
      expect(res.text).not.toContain("Second Rater");
      for (const r of raters) expect(res.text).not.toContain(r.id);
      expect(res.json.data.report.annotators.map((a: { name: string }) => a.name)).toEqual(["Annotator 1", "Annotator 2", "Annotator 3"]);
    }
    const own = await api(path(), { token: world.tokens.annotator.secret });
    expect(own.json.data.report.annotators.filter((a: { you: boolean }) => a.you)).toHaveLength(1);
  });
});
