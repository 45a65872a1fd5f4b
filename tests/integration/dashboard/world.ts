// A project with items in every status, leases, labels over six weeks and disputes of every age,
// written straight to the database (real PostgreSQL, no mocks). The tests count the same facts from
// these specs in plain JavaScript, independently of the SQL under test.
import { randomUUID } from "node:crypto";
import { db } from "@/db";
import { assignments, disputes, items, type ItemStatus } from "@/db/schema";
import { createRandom } from "@/lib/agreement";
import { insertLabels as insertSharedLabels, type LabelSpec as SharedLabelSpec } from "../../support/labels";

export type Source = "agreed" | "ruling" | "single" | "control";
export type ItemSpec = { status: ItemStatus; finalClassId: number | null; finalSource: Source | null; leasedFor: number | null };
/** Every label has its own `createdAt`; an undone one is undone 1 s later. */
export type LabelSpec = Required<SharedLabelSpec>;
export type DisputeSpec = { item: number; reason: "disagreement" | "doubt"; status: "open" | "ruled"; ageHours: number };

const HOUR = 3_600_000;

/**
 * 150 items: statuses drawn with fixed weights; final labels mostly class 0, some class 1, rarely class 2
 * (so class 2 falls under the 5% rare line); leases (live and expired) on a few open items.
 */
export function itemSpecs(seed: number, classIds: number[]): ItemSpec[] {
  const random = createRandom(seed);
  const statuses: ItemStatus[] = ["unlabelled", "unlabelled", "in_progress", "agreed", "agreed", "agreed", "disputed", "ruled", "control"];
  return Array.from({ length: 150 }, (_, i) => {
    const status = statuses[Math.floor(random() * statuses.length)];
    const pick = random();
    const cls = pick < 0.7 ? classIds[0] : pick < 0.975 ? classIds[1] : classIds[2];
    const finalSource: Source | null = status === "agreed" ? (i % 5 === 0 ? "single" : "agreed") : status === "ruled" ? "ruling" : status === "control" ? "control" : null;
    const leasedFor = (status === "unlabelled" || status === "in_progress") && i % 3 === 0 ? (i % 2 === 0 ? 2 : -2) : null;
    return { status, finalClassId: finalSource ? cls : null, finalSource, leasedFor };
  });
}

export async function insertItems(projectId: number, specs: ItemSpec[]): Promise<number[]> {
  const rows = await db
    .insert(items)
    .values(specs.map((s, i) => ({ projectId, externalId: `d-${i}-${randomUUID().slice(0, 6)}`, status: s.status, isControl: s.status === "control", finalClassId: s.finalClassId, finalSource: s.finalSource })))
    .returning({ id: items.id });
  return rows.map((r) => r.id);
}

/** Leases: `leasedFor` hours from now (negative: an expired lease, which must not count). */
export async function insertLeases(projectId: number, itemIds: number[], specs: ItemSpec[], userIds: string[]) {
  const values = specs.flatMap((s, i) =>
    s.leasedFor === null ? [] : [{ projectId, itemId: itemIds[i], userId: userIds[i % userIds.length], leasedUntil: new Date(Date.now() + s.leasedFor * HOUR) }],
  );
  if (values.length) await db.insert(assignments).values(values);
}

/** Up to three labels on every third item, created 0–42 days ago, with every suggestion situation. */
export function labelSpecs(seed: number, itemIds: number[], annotators: string[], classIds: number[]): LabelSpec[] {
  const random = createRandom(seed);
  const out: LabelSpec[] = [];
  itemIds.forEach((item, i) => {
    if (i % 3 === 2) return;
    const raters = annotators.filter(() => random() < 0.75);
    for (const annotator of raters) {
      const kind = random();
      const suggestion: LabelSpec["suggestion"] = kind < 0.65 ? "shown" : kind < 0.85 ? "hidden" : "none";
      const topClassId = suggestion === "none" ? null : classIds[Math.floor(random() * classIds.length)];
      const act = random();
      const took = suggestion === "shown" && act < 0.55;
      const classId = took ? topClassId! : act < 0.7 && topClassId !== null ? topClassId : classIds[Math.floor(random() * classIds.length)];
      const createdAt = new Date(Date.now() - random() * 42 * 24 * HOUR);
      out.push({ item, annotator, classId, suggestion, topClassId, took, undone: false, createdAt });
    }
  });
  // An undone label is kept as a row but counts nowhere; its item gets no replacement here.
  for (let j = 0; j < out.length; j += 11) out[j].undone = true;
  return out;
}

export const insertLabels: (projectId: number, specs: LabelSpec[]) => Promise<void> = insertSharedLabels;

/** Ages chosen well inside the buckets (under 1 day, 1–3 days, 3–7 days, 1–4 weeks, over 4 weeks). */
export const disputeAges = [2, 5, 30, 50, 100, 120, 150, 200, 400, 700, 1000];

export function disputeSpecs(itemIds: number[]): DisputeSpec[] {
  const open = disputeAges.map((ageHours, i) => ({ item: itemIds[i], reason: i % 3 === 0 ? ("doubt" as const) : ("disagreement" as const), status: "open" as const, ageHours }));
  const ruled = [3, 80].map((ageHours, i) => ({ item: itemIds[disputeAges.length + i], reason: "disagreement" as const, status: "ruled" as const, ageHours }));
  return [...open, ...ruled];
}

export async function insertDisputes(projectId: number, specs: DisputeSpec[]) {
  await db.insert(disputes).values(
    specs.map((s) => ({
      projectId,
      itemId: s.item,
      reason: s.reason,
      status: s.status,
      openedAt: new Date(Date.now() - s.ageHours * HOUR),
      closedAt: s.status === "ruled" ? new Date() : null,
    })),
  );
}
