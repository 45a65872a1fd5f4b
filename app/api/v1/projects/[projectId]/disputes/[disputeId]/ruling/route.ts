import { db } from "@/db";
import { requireRole } from "@/lib/auth/authorize";
import { json, parseId, readJson, route } from "@/lib/http/route";
import { getRulingByDisputeId, issueRuling } from "@/lib/labelling/ruling";
import { rulingSchema } from "./schema";

type P = { projectId: string; disputeId: string };

/** Issues the Ruling (reviewer+). Of two reviewers at once exactly one gets 201; the other 409 with the ruling that stands. */
export const POST = route<P>(async (req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "reviewer");
  const disputeId = parseId(params.disputeId, "dispute");
  const body = await readJson(req, rulingSchema);
  await issueRuling({ projectId: access.project.id, disputeId, reviewerId: access.user.id, classId: body.classId, reason: body.reason });
  return json({ data: await getRulingByDisputeId(db, disputeId) }, { status: 201 });
});
