// Two app server processes on different ports against one database: after a label on either, both give the same Suggestion.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, expect, it } from "vitest";
import { appUrl } from "@/tests/support/http";
import { freePort, startSecondApp } from "@/tests/support/cluster";
import { makeLabellingWorld, member } from "../labelling/world";

let second: Awaited<ReturnType<typeof startSecondApp>>;

beforeAll(async () => {
  second = await startSecondApp(await freePort());
}, 90_000);

afterAll(async () => {
  await second?.stop();
});

async function call(base: string, path: string, token: string, body?: unknown) {
  const res = await fetch(`${base}${path}`, {
    method: body ? "POST" : "GET",
    headers: { authorization: `Bearer ${token}`, ...(body ? { "content-type": "application/json" } : {}) },
    body: body ? JSON.stringify(body) : undefined,
  });
  return { status: res.status, json: await res.json() };
}

type View = { topClassId: number | null; shares: Record<string, number>; knnVersion: number; votersCount: number; neighbours: Array<{ itemId: number; classId: number; distance: number }> };

async function suggestion(base: string, projectId: number, itemId: number, token: string): Promise<View> {
  const r = await call(base, `/api/v1/projects/${projectId}/items/${itemId}/suggestion`, token);
  expect(r.status, JSON.stringify(r.json)).toBe(200);
  const d = r.json.data;
  return { topClassId: d.topClassId, shares: d.shares, knnVersion: d.knnVersion, votersCount: d.votersCount, neighbours: d.neighbours.map((n: View["neighbours"][number]) => ({ itemId: n.itemId, classId: n.classId, distance: n.distance })) };
}

it("keeps the Suggestion of both processes in step after labels on either", async () => {
  const annotator = await member("annotator", "two apps");
  const w = await makeLabellingWorld({ n: 60, members: [annotator], settings: { overlap: 1, k: 5 } });
  const [alpha, beta] = w.classes;
  const target = w.items[0];
  const apps = [appUrl, second.url];
  const views = async () => Promise.all(apps.map((a) => suggestion(a, w.project.id, target.id, annotator.token)));

  // Both processes build their index before any label: no voters yet.
  const [a0, b0] = await views();
  expect(a0).toEqual(b0);
  expect(a0.votersCount).toBe(0);

  // Items 3, 6, 9, … sit in the target's cluster (world.ts: cluster = index mod 3); label them on alternate processes.
  const plan = [3, 6, 9, 12, 15, 18].map((i, n) => ({ item: w.items[i], cls: n % 3 === 2 ? beta : alpha, app: apps[n % 2] }));
  let previous = a0;
  for (const [n, step] of plan.entries()) {
    const r = await call(step.app, `/api/v1/projects/${w.project.id}/items/${step.item.id}/labels`, annotator.token, { clientSubmissionId: randomUUID(), classId: step.cls.id, via: "choose" });
    expect(r.status, JSON.stringify(r.json)).toBe(201);
    const [a, b] = await views();
    expect(b, `after label ${n + 1} (sent to ${step.app})`).toEqual(a);
    expect(a.votersCount).toBe(n + 1);
    expect(a.knnVersion).toBeGreaterThan(previous.knnVersion);
    if (n < 5) expect(a.neighbours.map((x) => x.itemId)).toContain(step.item.id);
    previous = a;
  }
  // Six voters, k = 5, uniform votes: the five nearest of the labelled items decide; alpha has four of six labels.
  expect(previous.neighbours).toHaveLength(5);
  const alphaVotes = previous.neighbours.filter((x) => x.classId === alpha.id).length;
  expect(previous.shares[String(alpha.id)]).toBeCloseTo(alphaVotes / 5, 6);
  expect(previous.shares[String(beta.id)]).toBeCloseTo((5 - alphaVotes) / 5, 6);
}, 60_000);
