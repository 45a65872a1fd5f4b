// A small project for the API cases: one user per role, a few items with vectors, and an open dispute.
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { disputes, items, projects } from "@/db/schema";
import type { FeatureSchema } from "@/lib/projects/settings";
import { packFloat32 } from "@/lib/random";
import { makeRoleWorld } from "@/tests/support/fixtures";

export async function makeHostileWorld() {
  const w = await makeRoleWorld();
  const featureSchema: FeatureSchema = { source: "table", dimension: 2, columns: [{ name: "a", kind: "numeric", width: 1 }, { name: "b", kind: "numeric", width: 1 }] };
  await db.update(projects).set({ featureSchema }).where(eq(projects.id, w.project.id));
  let seq = 0;
  const item = async () => {
    seq += 1;
    const [row] = await db
      .insert(items)
      .values({ projectId: w.project.id, externalId: `H-${seq}-${Math.random().toString(36).slice(2, 7)}`, fields: { a: seq, b: seq % 3 }, vector: packFloat32([seq, seq % 3]), status: "unlabelled" })
      .returning();
    return row;
  };
  const dispute = async () => {
    const it = await item();
    await db.update(items).set({ status: "disputed", labelCount: 2 }).where(eq(items.id, it.id));
    const [d] = await db.insert(disputes).values({ projectId: w.project.id, itemId: it.id, reason: "doubt" }).returning();
    return { item: it, dispute: d };
  };
  return { ...w, item, dispute, base: `/api/v1/projects/${w.project.id}` };
}

export type HostileWorld = Awaited<ReturnType<typeof makeHostileWorld>>;
