// GET /api/v1/projects/{projectId}/dashboard/agreement: the headline with band and interval, on a published example
// (Krippendorff 2011 nominal, α = 0.743: tests/support/krippendorff-2011.ts).
import { beforeAll, describe, expect, it } from "vitest";
import { makeProject, makeRoleWorld, makeToken, makeUser } from "../../support/fixtures";
import { api } from "../../support/http";
import { krippendorff2011Classes, krippendorff2011Labels, readKrippendorff2011 } from "../../support/krippendorff-2011";
import { insertItems, insertLabels } from "./world";

let w: Awaited<ReturnType<typeof makeRoleWorld>>;
let labelCount = 0;

beforeAll(async () => {
  const example = readKrippendorff2011();
  labelCount = example.rows.length;
  w = await makeRoleWorld();
  const { project, classes } = await makeProject({
    classes: krippendorff2011Classes,
    members: [
      { userId: w.users.owner.id, role: "owner" },
      { userId: w.users.viewer.id, role: "viewer" },
    ],
  });
  w = { ...w, project };
  const itemIds = await insertItems(project.id, example.units.map(() => ({ status: "in_progress" as const, finalClassId: null, finalSource: null, leasedFor: null })));
  const ratings = await krippendorff2011Labels(example, itemIds, classes);
  await insertLabels(project.id, ratings.map((label) => ({ ...label, undone: false, createdAt: new Date() })));
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
