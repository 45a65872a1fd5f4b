// No "server-only" here: the worker (plain Node) runs this module too.
import { and, eq, inArray, isNull, sql } from "drizzle-orm";
import { db } from "@/db";
import { auditLog, projectMembers, projects, users } from "@/db/schema";
import { enqueue } from "@/lib/jobs/boss";
import { disputeDigestMail } from "@/lib/mail/templates";
import { DIGEST_MIN_INTERVAL_MINUTES } from "./constants";

const digestAction = "disputes.digest";

async function openCount(projectId: number): Promise<number> {
  const res = await db.execute<{ n: number }>(sql`select count(*)::int as n from disputes where project_id = ${projectId} and status = 'open'`);
  return res.rows[0]?.n ?? 0;
}

async function sentRecently(projectId: number, exec: Pick<typeof db, "execute"> = db): Promise<boolean> {
  const res = await exec.execute<{ recent: boolean }>(sql`
    select exists (select 1 from audit_log where project_id = ${projectId} and action = ${digestAction}
      and at > now() - make_interval(mins => ${DIGEST_MIN_INTERVAL_MINUTES})) as recent`);
  return Boolean(res.rows[0]?.recent);
}

/** After a label opens a dispute: queue one digest per project when open disputes reach the threshold (at most hourly). */
export async function maybeEnqueueDigest(projectId: number, threshold: number): Promise<boolean> {
  if ((await openCount(projectId)) < threshold) return false;
  if (await sentRecently(projectId)) return false;
  await enqueue("dispute-digest", { projectId }, { singletonKey: `dispute-digest:${projectId}` });
  return true;
}

export type DigestResult = { sent: string[]; open: number; skipped?: "below_threshold" | "sent_recently" | "no_project" };

/**
 * The digest job: under a per-project advisory lock, re-checks the threshold and the hourly limit, records the
 * digest in the audit log, then queues one e-mail per reviewer (owners when the project has no reviewer).
 */
export async function runDisputeDigest(projectId: number): Promise<DigestResult> {
  const plan = await db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext('dispute-digest'), ${projectId})`);
    const [project] = await tx.select().from(projects).where(eq(projects.id, projectId));
    if (!project) return { skipped: "no_project" as const, open: 0, to: [] as string[] };
    const open = await openCount(projectId);
    if (open < project.settings.disputeDigestThreshold) return { skipped: "below_threshold" as const, open, to: [] };
    if (await sentRecently(projectId, tx)) return { skipped: "sent_recently" as const, open, to: [] };
    const members = await tx
      .select({ email: users.email, role: projectMembers.role })
      .from(projectMembers)
      .innerJoin(users, eq(users.id, projectMembers.userId))
      .where(and(eq(projectMembers.projectId, projectId), inArray(projectMembers.role, ["reviewer", "owner"]), isNull(users.deactivatedAt)));
    const reviewers = members.filter((m) => m.role === "reviewer");
    const to = (reviewers.length ? reviewers : members).map((m) => m.email);
    await tx.insert(auditLog).values({ actorId: null, projectId, action: digestAction, targetType: "project", targetId: String(projectId), after: { open, to } });
    return { open, to, project, skipped: undefined };
  });
  if (plan.skipped || !("project" in plan) || !plan.project) return { sent: [], open: plan.open, skipped: plan.skipped };
  const mail = disputeDigestMail({ projectName: plan.project.name, open: plan.open, projectId });
  for (const address of plan.to) await enqueue("mail", { to: address, ...mail });
  return { sent: plan.to, open: plan.open };
}
