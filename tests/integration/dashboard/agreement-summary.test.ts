// GET /api/v1/projects/{projectId}/dashboard/agreement: the headline with band and interval, on a published example.
import fs from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { makeProject, makeRoleWorld, makeToken, makeUser } from "../../support/fixtures";
import { api } from "../../support/http";
import { insertItems, insertLabels } from "./world";

let w: Awaited<ReturnType<typeof makeRoleWorld>>;
let labelCount = 0;

beforeAll(async () => {
  // Krippendorff (2011), "Computing Krippendorff's Alpha-Reliability", nominal example: 4 observers × 12 units
  // with missing values, α = 0.743. Classes "1"…"5" are the example's values.
  const csv = fs.readFileSync(path.resolve(__dirname, "../../fixtures/agreement/krippendorff-2011-nominal.csv"), "utf8");
  const rows = csv.trim().split("\n").slice(1).map((line) => line.split(","));
  labelCount = rows.length;
  w = await makeRoleWorld();
  const observers = await Promise.all(["A", "B", "C", "D"].map((n) => makeUser({ name: `Observer ${n}` })));
  const { project, classes } = await makeProject({
    classes: ["1", "2", "3", "4", "5"],
    members: [
      { userId: w.users.owner.id, role: "owner" },
      { userId: w.users.viewer.id, role: "viewer" },
    ],
  });
  w = { ...w, project };
  const units = [...new Set(rows.map((r) => r[0]))];
  const itemIds = await insertItems(project.id, units.map(() => ({ status: "in_progress" as const, finalClassId: null, finalSource: null, leasedFor: null })));
  await insertLabels(
    project.id,
    rows.map(([unit, observer, value]) => ({
      item: itemIds[units.indexOf(unit)],
      annotator: observers["ABCD".indexOf(observer)].id,
      classId: classes.find((c) => c.name === value)!.id,
      suggestion: "none" as const,
      topClassId: null,
      took: false,
      undone: false,
      createdAt: new Date(),
    })),
  );
});

const url = () => `/api/v1/projects/${w.project.id}/dashboard/agreement`;

describe("GET /api/v1/projects/{projectId}/dashboard/agreement", () => {
  it("gives alpha = 0.743 with its bootstrap interval and the Landis & Koch band, never alone", async () => {
    const res = await api(url(), { token: w.tokens.viewer.secret });
    expect(res.status, res.text).toBe(200);
    const s = res.json.data;
    expect(s.status).toBe("ready");
    expect(s.labels).toBe(labelCount);
    expect(s.headline.key).toBe("alpha");
    expect(s.headline.value).toBeCloseTo(0.743, 3);
    // Landis & Koch (1977), Biometrics 33:165: 0.61–0.80 reads "substantial".
    expect(s.headline.band).toBe("substantial");
    expect(s.headline.ci95.lower).toBeLessThan(0.743);
    expect(s.headline.ci95.upper).toBeGreaterThan(0.743);
    expect(s.headline.reading).toMatch(/^substantial agreement \(α = 0\.74, 95% CI /);
    expect(s.figures.map((f: { key: string }) => f.key)).toEqual(["alpha", "alphaBlind", "fleiss"]);
    // No blind items in the example: the blind figure is undefined, not zero.
    expect(s.figures[1].value).toBeNull();
    expect(s.figures[1].band).toBeNull();
  });

  it("matches the full Agreement report's headline", async () => {
    const full = await api(`/api/v1/projects/${w.project.id}/agreement`, { token: w.tokens.owner.secret });
    const summary = await api(url(), { token: w.tokens.owner.secret });
    const alpha = full.json.data.report.overall.krippendorffAlpha;
    expect(summary.json.data.headline.value).toBe(alpha.value);
    expect(summary.json.data.headline.ci95).toEqual(alpha.ci95);
  });

  it("denies outsiders (404) and signed-out callers (401); refuses unknown parameters (422)", async () => {
    const stranger = await makeUser();
    const token = await makeToken(stranger.id);
    expect((await api(url(), { token: token.secret })).status).toBe(404);
    expect((await api(url(), { token: w.tokens.outsider.secret })).status).toBe(404);
    expect((await api(url())).status).toBe(401);
    expect((await api(`${url()}?scope=all`, { token: w.tokens.viewer.secret })).status).toBe(422);
  });
});
