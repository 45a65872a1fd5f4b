// GET /api/v1/projects/{projectId}/dashboard through the real app server: each aggregate against a count
// made here in plain JavaScript from the specs that built the data, plus roles and input checks.
import { beforeAll, describe, expect, it } from "vitest";
import { makeProject, makeRoleWorld, makeToken, makeUser } from "../../support/fixtures";
import { api } from "../../support/http";
import {
  disputeAges,
  disputeSpecs,
  insertDisputes,
  insertItems,
  insertLabels,
  insertLeases,
  itemSpecs,
  type ItemSpec,
  labelSpecs,
  type LabelSpec,
} from "./world";

type World = Awaited<ReturnType<typeof makeRoleWorld>>;
let w: World;
let classIds: number[];
let annotatorIds: string[];
let specs: ItemSpec[];
let labelRows: LabelSpec[];

beforeAll(async () => {
  w = await makeRoleWorld();
  classIds = [...w.classes].sort((a, b) => a.position - b.position).map((c) => c.id);
  const raters = await Promise.all(["Rhea Rater", "Sol Rater", "Tam Rater"].map((name) => makeUser({ name })));
  annotatorIds = [w.users.annotator.id, ...raters.map((r) => r.id)];
  specs = itemSpecs(3, classIds);
  const itemIds = await insertItems(w.project.id, specs);
  await insertLeases(w.project.id, itemIds, specs, annotatorIds);
  labelRows = labelSpecs(4, itemIds, annotatorIds, classIds);
  await insertLabels(w.project.id, labelRows);
  await insertDisputes(w.project.id, disputeSpecs(itemIds));
  // The outsider's project gets data too; none of it may show up.
  const otherClasses = w.other.classes.map((c) => c.id);
  const otherSpecs = itemSpecs(9, otherClasses);
  const otherItems = await insertItems(w.other.project.id, otherSpecs);
  await insertLeases(w.other.project.id, otherItems, otherSpecs, [w.users.outsider.id]);
  await insertLabels(w.other.project.id, labelSpecs(10, otherItems, [w.users.outsider.id, raters[0].id], otherClasses));
  await insertDisputes(w.other.project.id, disputeSpecs(otherItems));
});

const path = (query = "") => `/api/v1/projects/${w.project.id}/dashboard${query}`;
const asOwner = async (query = "") => {
  const res = await api(path(query), { token: w.tokens.owner.secret });
  expect(res.status, res.text).toBe(200);
  return res.json.data;
};

describe("GET /api/v1/projects/{projectId}/dashboard: the figures", () => {
  it("counts items per status, with unlabelled items on a live lease counted as in progress", async () => {
    const d = await asOwner();
    const live = (s: ItemSpec) => s.leasedFor !== null && s.leasedFor > 0;
    const expected = {
      unlabelled: specs.filter((s) => s.status === "unlabelled" && !live(s)).length,
      in_progress: specs.filter((s) => s.status === "in_progress" || (s.status === "unlabelled" && live(s))).length,
      agreed: specs.filter((s) => s.status === "agreed").length,
      disputed: specs.filter((s) => s.status === "disputed").length,
      ruled: specs.filter((s) => s.status === "ruled").length,
      control: specs.filter((s) => s.status === "control").length,
    };
    expect(d.progress.counts).toEqual(expected);
    expect(d.progress.total).toBe(150);
    expect(d.progress.leased).toBe(specs.filter(live).length);
    // The world must exercise the lease rule, or this test proves nothing about it.
    expect(specs.some((s) => s.status === "unlabelled" && live(s))).toBe(true);
    expect(specs.some((s) => s.status === "unlabelled" && s.leasedFor !== null && s.leasedFor < 0)).toBe(true);
  });

  it("gives final labels per class and source, and flags the rare class by the stated rule", async () => {
    const d = await asOwner();
    const finals = specs.filter((s) => s.finalClassId !== null);
    expect(d.balance.finalTotal).toBe(finals.length);
    // C = 3 classes: min(5%, 1/(3·3) = 11.1%) = 5%.
    expect(d.balance.threshold).toBeCloseTo(0.05, 12);
    expect(d.balance.classes.map((c: { classId: number }) => c.classId)).toEqual(classIds);
    for (const c of d.balance.classes) {
      const mine = finals.filter((s) => s.finalClassId === c.classId);
      expect(c.count).toBe(mine.length);
      expect(c.bySource).toEqual({
        agreed: mine.filter((s) => s.finalSource === "agreed").length,
        ruling: mine.filter((s) => s.finalSource === "ruling").length,
        single: mine.filter((s) => s.finalSource === "single").length,
        control: mine.filter((s) => s.finalSource === "control").length,
      });
      expect(c.share).toBeCloseTo(mine.length / finals.length, 12);
      expect(c.rare).toBe(mine.length / finals.length < 0.05);
    }
    expect(d.balance.classes.map((c: { rare: boolean }) => c.rare)).toEqual([false, false, true]);
  });

  it("counts live labels per annotator per day over the last 30 UTC days, numbering annotators by user id", async () => {
    const d = await asOwner();
    const dayOf = (t: Date) => t.toISOString().slice(0, 10);
    const today = new Date();
    const days = Array.from({ length: 30 }, (_, i) => dayOf(new Date(Date.UTC(today.getUTCFullYear(), today.getUTCMonth(), today.getUTCDate() - 29 + i))));
    expect(d.daily.days).toEqual(days);
    const liveRows = labelRows.filter((l) => !l.undone);
    const numbered = [...new Set(liveRows.map((l) => l.annotator))].sort();
    const expected = new Map<string, number>();
    for (const l of liveRows) {
      const day = dayOf(l.createdAt);
      if (day < days[0]) continue;
      const key = `${day}|${numbered.indexOf(l.annotator) + 1}`;
      expected.set(key, (expected.get(key) ?? 0) + 1);
    }
    const got = new Map<string, number>(d.daily.cells.map((c: { day: string; annotator: number; count: number }) => [`${c.day}|${c.annotator}`, c.count]));
    expect(got).toEqual(expected);
    expect(labelRows.some((l) => dayOf(l.createdAt) < days[0])).toBe(true);
    const owner = d.daily.annotators.find((a: { id: string }) => a.id === w.users.annotator.id);
    expect(owner.name).toBe(w.users.annotator.name);
    expect(owner.index).toBe(numbered.indexOf(w.users.annotator.id) + 1);
  });

  it("splits days at midnight in the requested time zone", async () => {
    const zone = "Asia/Kathmandu"; // UTC+05:45, so a quarter of an hour decides some days.
    const d = await asOwner(`?tz=${encodeURIComponent(zone)}&days=45`);
    const fmt = new Intl.DateTimeFormat("en-CA", { timeZone: zone, year: "numeric", month: "2-digit", day: "2-digit" });
    expect(d.daily.days).toHaveLength(45);
    expect(d.daily.days[44]).toBe(fmt.format(new Date()));
    const perDay = new Map<string, number>();
    for (const l of labelRows.filter((x) => !x.undone)) {
      const day = fmt.format(l.createdAt);
      if (day >= d.daily.days[0]) perDay.set(day, (perDay.get(day) ?? 0) + 1);
    }
    const got = new Map<string, number>();
    for (const c of d.daily.cells as Array<{ day: string; count: number }>) got.set(c.day, (got.get(c.day) ?? 0) + c.count);
    expect(got).toEqual(perDay);
  });

  it("gives take-rate and override counts by suggested class from shown suggestions only", async () => {
    const d = await asOwner();
    const live = labelRows.filter((l) => !l.undone);
    const shown = live.filter((l) => l.suggestion === "shown" && l.topClassId !== null);
    const expected = classIds
      .map((id) => {
        const mine = shown.filter((l) => l.topClassId === id);
        return {
          classId: id,
          shown: mine.length,
          took: mine.filter((l) => l.took).length,
          sameByKey: mine.filter((l) => !l.took && l.classId === id).length,
          overridden: mine.filter((l) => l.classId !== id).length,
        };
      })
      .filter((r) => r.shown > 0);
    expect(d.suggestions.byClass).toEqual(expected);
    expect(d.suggestions.liveLabels).toBe(live.length);
    expect(d.suggestions.shownLabels).toBe(live.filter((l) => l.suggestion === "shown").length);
    expect(d.suggestions.hiddenLabels).toBe(live.filter((l) => l.suggestion === "hidden").length);
    expect(d.suggestions.noSuggestion).toBe(live.filter((l) => l.suggestion === "none").length);
    expect(expected.every((r) => r.took > 0 && r.sameByKey > 0 && r.overridden > 0)).toBe(true);
  });

  it("buckets open disputes by age and reason; ruled ones and other projects' are left out", async () => {
    const d = await asOwner();
    const open = disputeSpecs(Array.from({ length: 20 }, (_, i) => i)).filter((s) => s.status === "open");
    const bounds = [24, 72, 168, 672, Infinity];
    const keys = ["day", "days3", "week", "month", "older"];
    const expected = keys.map((key, b) => {
      const inside = open.filter((s) => s.ageHours < bounds[b] && (b === 0 || s.ageHours >= bounds[b - 1]));
      return { key, disagreement: inside.filter((s) => s.reason === "disagreement").length, doubt: inside.filter((s) => s.reason === "doubt").length };
    });
    expect(d.disputes.buckets.map(({ key, disagreement, doubt }: { key: string; disagreement: number; doubt: number }) => ({ key, disagreement, doubt }))).toEqual(expected);
    expect(d.disputes.open).toBe(disputeAges.length);
    const oldestHours = (Date.now() - Date.parse(d.disputes.oldestOpenedAt)) / 3_600_000;
    expect(oldestHours).toBeGreaterThan(999);
    expect(oldestHours).toBeLessThan(1001);
    const sorted = [...disputeAges].sort((a, b) => a - b);
    expect(d.disputes.medianAgeHours).toBeCloseTo(sorted[(sorted.length - 1) / 2], 1);
  });

  it("an empty project answers zeros, not errors", async () => {
    const owner = await makeUser();
    const { project } = await makeProject({ members: [{ userId: owner.id, role: "owner" }] });
    const token = await makeToken(owner.id);
    const res = await api(`/api/v1/projects/${project.id}/dashboard`, { token: token.secret });
    expect(res.status).toBe(200);
    const d = res.json.data;
    expect(d.progress.total).toBe(0);
    expect(d.balance.finalTotal).toBe(0);
    expect(d.balance.classes.every((c: { rare: boolean; share: number | null }) => !c.rare && c.share === null)).toBe(true);
    expect(d.daily.cells).toEqual([]);
    expect(d.suggestions.byClass).toEqual([]);
    expect(d.disputes.open).toBe(0);
    expect(d.disputes.medianAgeHours).toBeNull();
  });
});

describe("GET /api/v1/projects/{projectId}/dashboard: access and input", () => {
  it("answers every member role and site admins; outsiders 404, signed-out 401", async () => {
    for (const role of ["admin", "owner", "reviewer", "annotator", "viewer"] as const) {
      const res = await api(path(), { token: w.tokens[role].secret });
      expect(res.status, role).toBe(200);
      expect(res.json.data.progress.total).toBe(150);
      expect(res.headers.get("cache-control")).toBe("no-store");
    }
    expect((await api(path(), { token: w.tokens.outsider.secret })).status).toBe(404);
    expect((await api(path())).status).toBe(401);
    expect((await api(`/api/v1/projects/abc/dashboard`, { token: w.tokens.owner.secret })).status).toBe(404);
  });

  it("shows names to owners, reviewers and admins; numbered annotators to viewers and annotators", async () => {
    for (const role of ["owner", "reviewer", "admin"] as const) {
      const res = await api(path(), { token: w.tokens[role].secret });
      expect(res.json.data.namesVisible, role).toBe(true);
      expect(res.text).toContain("Rhea Rater");
    }
    for (const role of ["viewer", "annotator"] as const) {
      const res = await api(path(), { token: w.tokens[role].secret });
      expect(res.json.data.namesVisible, role).toBe(false);
      expect(res.text).not.toContain("Rhea Rater");
      for (const id of annotatorIds) expect(res.text).not.toContain(id);
      for (const a of res.json.data.daily.annotators) expect(a.name).toBe(`Annotator ${a.index}`);
    }
    const own = await api(path(), { token: w.tokens.annotator.secret });
    expect(own.json.data.daily.annotators.filter((a: { you: boolean }) => a.you)).toHaveLength(1);
  });

  it("refuses bad query parameters with 422 and the field", async () => {
    for (const [query, field] of [["?days=3", "days"], ["?days=x", "days"], ["?tz=Mars%2FOlympus", "tz"], ["?colour=red", "(body)"]] as const) {
      const res = await api(path(query), { token: w.tokens.viewer.secret });
      expect(res.status, query).toBe(422);
      expect(res.json.error.code).toBe("bad_request:validation");
      expect(res.json.error.fields.map((f: { path: string }) => f.path).join(" "), query).toContain(field);
    }
  });
});
