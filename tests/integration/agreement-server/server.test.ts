// The server side of agreement: SQL → typed arrays → lib/agreement → cache, against a real PostgreSQL.
import { sql } from "drizzle-orm";
import { alpha as referenceAlpha } from "krippendorff";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { type AgreementInput, computeAgreement, createRandom } from "@/lib/agreement";
import { AGREEMENT_OPTIONS, getAgreementView, getProjectAgreement, queueProjectAgreement } from "@/lib/agreement-server";
import { handleAgreement } from "@/worker/jobs/agreement";
import { makeProject, makeUser } from "../../support/fixtures";
import { krippendorff2011Classes, krippendorff2011Labels, readKrippendorff2011 } from "../../support/krippendorff-2011";
import { bumpVersion, insertItems, insertLabels, type LabelSpec, seededLabels } from "./world";

type World = { projectId: number; annotators: string[]; classIds: number[]; itemIds: number[]; specs: LabelSpec[]; blind: Map<number, boolean>; known: Map<number, number>; final: Map<number, number> };

/** The arrays lib/agreement should receive, built here from the specs without the server's code. */
function expectedInput(w: World, onlyBlindItems = false): AgreementInput {
  const live = w.specs.filter((s) => !s.undone);
  const annotators = [...new Set(live.map((s) => s.annotator))].sort();
  const itemIds = [...new Set(live.map((s) => s.item))].sort((a, b) => a - b);
  const cls = (id: number | null | undefined) => (id == null ? -1 : w.classIds.indexOf(id));
  const rows = live
    .filter((s) => !onlyBlindItems || w.blind.get(s.item))
    .map((s) => ({ s, i: itemIds.indexOf(s.item), a: annotators.indexOf(s.annotator) }))
    .sort((x, y) => x.i - y.i || x.a - y.a);
  return {
    itemCount: itemIds.length,
    annotatorCount: annotators.length,
    classCount: w.classIds.length,
    item: Int32Array.from(rows.map((r) => r.i)),
    annotator: Int32Array.from(rows.map((r) => r.a)),
    label: Int32Array.from(rows.map((r) => cls(r.s.classId))),
    tookSuggestion: Uint8Array.from(rows.map((r) => (r.s.suggestion === "shown" && r.s.took ? 1 : 0))),
    blind: Uint8Array.from(rows.map((r) => (r.s.suggestion === "shown" ? 0 : 1))),
    suggestionTop: Int32Array.from(rows.map((r) => cls(r.s.topClassId))),
    finalLabel: Int32Array.from(itemIds.map((id) => cls(w.final.get(id)))),
    controlLabel: Int32Array.from(itemIds.map((id) => cls(w.known.get(id)))),
  };
}

async function buildWorld(seed: number): Promise<World> {
  const people = await Promise.all([1, 2, 3, 4].map((n) => makeUser({ name: `Rater ${n}` })));
  const { project, classes } = await makeProject({ classes: ["cat", "dog", "fox"], members: people.map((p) => ({ userId: p.id, role: "annotator" as const })) });
  const classIds = [...classes].sort((a, b) => a.position - b.position).map((c) => c.id);
  const random = createRandom(seed);
  const n = 60;
  const truth = Array.from({ length: n }, () => Math.floor(random() * 3));
  const blindFlags = Array.from({ length: n }, (_, i) => i % 4 === 0);
  const control = Array.from({ length: n }, (_, i) => i % 7 === 3);
  const finalFlags = Array.from({ length: n }, (_, i) => i % 5 !== 2);
  const itemIds = await insertItems(
    project.id,
    truth.map((t, i) => ({ externalId: `it-${i}`, isBlind: blindFlags[i], isControl: control[i], knownClassId: control[i] ? classIds[t] : null, finalClassId: finalFlags[i] ? classIds[t] : null })),
  );
  const specs = seededLabels({ seed, itemIds, blind: blindFlags, annotators: people.map((p) => p.id), classIds, truth });
  await insertLabels(project.id, specs);
  return {
    projectId: project.id,
    annotators: people.map((p) => p.id),
    classIds,
    itemIds,
    specs,
    blind: new Map(itemIds.map((id, i) => [id, blindFlags[i]])),
    known: new Map(itemIds.flatMap((id, i) => (control[i] ? [[id, classIds[truth[i]]] as const] : []))),
    final: new Map(itemIds.flatMap((id, i) => (finalFlags[i] ? [[id, classIds[truth[i]]] as const] : []))),
  };
}

describe("agreement computed on the server", () => {
  let w: World;
  beforeAll(async () => {
    w = await buildWorld(7);
    // Another project's labels must not leak in.
    const other = await buildWorld(8);
    expect(other.projectId).not.toBe(w.projectId);
  });

  it("gives the same figures as lib/agreement on the same arrays, overall and on blind items", async () => {
    const found = await getProjectAgreement({ projectId: w.projectId });
    expect(found.stale).toBe(false);
    const stored = found.stored!;
    expect(stored.labels).toBe(w.specs.filter((s) => !s.undone).length);
    expect(w.specs.some((s) => s.undone)).toBe(true);
    expect(stored.annotatorIds).toEqual([...w.annotators].sort());
    expect(stored.classIds).toEqual(w.classIds);
    expect(stored.overall).toEqual(computeAgreement(expectedInput(w), AGREEMENT_OPTIONS));
    expect(stored.blind).toEqual(computeAgreement(expectedInput(w, true), AGREEMENT_OPTIONS));
    expect(stored.blind.ratings).toBeLessThan(stored.overall.ratings);
    expect(stored.blind.ratings).toBeGreaterThan(0);
    expect(stored.overall.control.total).toBeGreaterThan(0);
    expect(stored.overall.suggestions!.blind.topClassAccuracy.total).toBeGreaterThan(0);
    const counts = stored.suggestionCounts;
    const live = w.specs.filter((s) => !s.undone);
    expect(counts).toEqual({ shown: live.filter((s) => s.suggestion === "shown").length, hidden: live.filter((s) => s.suggestion === "hidden").length, none: live.filter((s) => s.suggestion === "none").length });
  });

  it("agrees with the npm package krippendorff 0.1.0 on alpha (missing ratings as undefined, full rows)", async () => {
    const stored = (await getProjectAgreement({ projectId: w.projectId })).stored!;
    const live = w.specs.filter((s) => !s.undone);
    const units = [...new Set(live.map((s) => s.item))];
    const matrix = w.annotators.map((a) => units.map((u) => live.find((s) => s.item === u && s.annotator === a)?.classId));
    expect(stored.overall.krippendorffAlpha.value).toBeCloseTo(referenceAlpha(matrix), 10);
  });

  it("reuses the cached report until knn_state.version changes, then recomputes", async () => {
    const first = await getProjectAgreement({ projectId: w.projectId });
    const again = await getProjectAgreement({ projectId: w.projectId });
    expect(again.stored!.computedAt).toBe(first.stored!.computedAt);
    const rows = await db.execute<{ n: number }>(sql`select count(*)::int as n from reports where project_id = ${w.projectId} and kind = 'agreement'`);
    expect(rows.rows[0].n).toBe(1);

    // A new label (as the labelling code does: insert, then bump the version) changes the figures.
    const spare = w.itemIds.find((id) => !w.specs.some((s) => s.item === id && s.annotator === w.annotators[0] && !s.undone))!;
    const extra: LabelSpec = { item: spare, annotator: w.annotators[0], classId: w.classIds[0], suggestion: "shown", topClassId: w.classIds[1], took: false };
    await insertLabels(w.projectId, [extra]);
    const unchanged = await getProjectAgreement({ projectId: w.projectId });
    expect(unchanged.stored!.computedAt).toBe(first.stored!.computedAt);
    await bumpVersion(w.projectId);
    w.specs.push(extra);
    const fresh = await getProjectAgreement({ projectId: w.projectId });
    expect(fresh.stored!.computedAt).not.toBe(first.stored!.computedAt);
    expect(fresh.stored!.knnVersion).toBe(first.stored!.knnVersion + 1);
    expect(fresh.stored!.labels).toBe(first.stored!.labels + 1);
    expect(fresh.stored!.overall).toEqual(computeAgreement(expectedInput(w), AGREEMENT_OPTIONS));
  });

  it("past the inline limit answers with the stale report, queues one job per version, and the job refreshes it", async () => {
    const before = (await getProjectAgreement({ projectId: w.projectId })).stored!;
    await bumpVersion(w.projectId);
    const queued = await getProjectAgreement({ projectId: w.projectId, inlineLimit: 1 });
    expect(queued).toMatchObject({ stale: true, queued: true, currentVersion: before.knnVersion + 1 });
    expect(queued.stored!.computedAt).toBe(before.computedAt);
    expect(await queueProjectAgreement({ projectId: w.projectId, version: before.knnVersion + 1 })).toBe(false);
    const row = await db.execute<{ status: string }>(sql`select status from reports where project_id = ${w.projectId} and kind = 'agreement'`);
    expect(row.rows.map((r) => r.status)).toEqual(["pending"]);
    await handleAgreement({ projectId: w.projectId });
    const after = await getProjectAgreement({ projectId: w.projectId, inlineLimit: 1 });
    expect(after).toMatchObject({ stale: false, queued: false });
    expect(after.stored!.knnVersion).toBe(before.knnVersion + 1);
    expect(after.stored!.computedAt).not.toBe(before.computedAt);
  });

  it("shows annotator names to owners and reviewers only; others see numbered annotators", async () => {
    const asOwner = await getAgreementView({ projectId: w.projectId, userId: "nobody", role: "owner", isAdmin: false });
    const asViewer = await getAgreementView({ projectId: w.projectId, userId: w.annotators[1], role: "viewer", isAdmin: false });
    const asAnnotator = await getAgreementView({ projectId: w.projectId, userId: w.annotators[2], role: "annotator", isAdmin: false });
    const sorted = [...w.annotators].sort();
    expect(asOwner.report!.annotators.map((a) => a.id)).toEqual(sorted);
    expect(asOwner.report!.annotators.every((a) => /^Rater \d$/.test(a.name))).toBe(true);
    for (const view of [asViewer, asAnnotator]) {
      expect(view.namesVisible).toBe(false);
      expect(view.report!.annotators.map((a) => a.name)).toEqual(sorted.map((_, i) => `Annotator ${i + 1}`));
      const text = JSON.stringify(view);
      for (const id of w.annotators) expect(text).not.toContain(id);
      expect(text).not.toContain("Rater ");
    }
    expect(asViewer.report!.annotators.find((a) => a.you)!.index).toBe(sorted.indexOf(w.annotators[1]));
    const pair = asOwner.report!.overall.cohenKappa[0];
    expect(pair.a.id).toBe(sorted[0]);
    expect(asOwner.report!.overall.perClass.map((c) => c.class.name)).toEqual(["cat", "dog", "fox"]);
  });
});

describe("the published nominal example through the database", () => {
  it("Krippendorff (2011), 'Computing Krippendorff's Alpha-Reliability', 4 observers × 12 units with missing values: α = 0.743", async () => {
    const example = readKrippendorff2011();
    const { project, classes } = await makeProject({ classes: krippendorff2011Classes });
    const itemIds = await insertItems(project.id, example.units.map((u) => ({ externalId: `unit-${u}` })));
    await insertLabels(project.id, await krippendorff2011Labels(example, itemIds, classes));
    const stored = (await getProjectAgreement({ projectId: project.id })).stored!;
    expect(stored.overall.ratings).toBe(example.rows.length);
    expect(stored.overall.krippendorffAlpha.value).toBeCloseTo(0.743, 3);
    expect(stored.blind.ratings).toBe(0);
  });

  it("an empty project gives a report with undefined coefficients, not an error", async () => {
    const { project } = await makeProject();
    const stored = (await getProjectAgreement({ projectId: project.id })).stored!;
    expect(stored.labels).toBe(0);
    expect(stored.overall.krippendorffAlpha.value).toBeNull();
    expect(stored.overall.cohenKappa).toEqual([]);
  });
});
