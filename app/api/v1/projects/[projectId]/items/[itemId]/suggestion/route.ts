import { requireRole } from "@/lib/auth/authorize";
import { json, parseId, route } from "@/lib/http/route";
import { getSuggestionWithItem } from "@/lib/suggest";
import type { SuggestionResponse } from "./schema";

type P = { projectId: string; itemId: string };

export const dynamic = "force-dynamic";

/** The Suggestion for one item (annotator and up). Blind-share items show none to annotators. */
export const GET = route<P>(async (_req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "annotator");
  const projectId = access.project.id;
  const itemId = parseId(params.itemId, "item");
  const role = access.isAdmin ? "owner" : access.role;
  // The item's project and blind flag are checked in the suggestion's own item query (404 for another project's item).
  const { suggestion: s } = await getSuggestionWithItem({ projectId, itemId }, { skipBlind: role === "annotator" });
  const body: SuggestionResponse = s ? { ...s, blind: false } : { itemId, blind: true };
  return json({ data: body });
});
