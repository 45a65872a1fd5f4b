import { eq } from "drizzle-orm";
import { db } from "@/db";
import { items } from "@/db/schema";
import { requireRole } from "@/lib/auth/authorize";
import { AppError } from "@/lib/errors";
import { json, parseId, route } from "@/lib/http/route";
import { getSuggestion } from "@/lib/suggest";
import type { SuggestionResponse } from "./schema";

type P = { projectId: string; itemId: string };

export const dynamic = "force-dynamic";

/** The Suggestion for one item (annotator and up). Blind-share items show none to annotators. */
export const GET = route<P>(async (_req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "annotator");
  const projectId = access.project.id;
  const itemId = parseId(params.itemId, "item");
  // By primary key, then the project check: a project_id condition can make the planner scan the project's items.
  const [item] = await db.select({ id: items.id, projectId: items.projectId, isBlind: items.isBlind }).from(items).where(eq(items.id, itemId)).limit(1);
  if (!item || item.projectId !== projectId) throw new AppError("not_found:item", "No such item in this project.");
  const role = access.isAdmin ? "owner" : access.role;
  if (item.isBlind && role === "annotator") {
    const body: SuggestionResponse = { itemId, blind: true };
    return json({ data: body });
  }
  const s = await getSuggestion({ projectId, itemId });
  const body: SuggestionResponse = { ...s, blind: false };
  return json({ data: body });
});
