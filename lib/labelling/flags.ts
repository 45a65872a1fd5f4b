import "server-only";
import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { itemFlags, items } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { releaseLease } from "./queue";

/** Skip (no comment needed) or flag as unclear (with a comment): the item leaves this annotator's queue for good. */
export async function flagItem({ projectId, itemId, userId, kind, comment }: { projectId: number; itemId: number; userId: string; kind: "skip" | "flag"; comment: string | null }) {
  return db.transaction(async (tx) => {
    const [item] = await tx.select({ id: items.id }).from(items).where(and(eq(items.id, itemId), eq(items.projectId, projectId))).for("update");
    if (!item) throw new AppError("not_found:item", "No such item in this project.");
    const [flag] = await tx.insert(itemFlags).values({ projectId, itemId, userId, kind, comment }).returning();
    await releaseLease(tx, itemId, userId);
    return flag;
  });
}
