import "server-only";
import { and, asc, count, eq, sql } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import { items, knnState, labelClasses, projectMembers, projects, type ProjectRole } from "@/db/schema";
import { writeAudit } from "@/lib/audit";
import { AppError } from "@/lib/errors";
import { defaultProjectSettings, type ProjectSettings } from "@/lib/projects/settings";

export type NewClassInput = { name: string; colour: string; keyHint?: number };

export async function createProject({ ownerId, name, description, classes, settings }: { ownerId: string; name: string; description: string; classes: NewClassInput[]; settings: Partial<ProjectSettings> }) {
  return db.transaction(async (tx) => {
    const [project] = await tx
      .insert(projects)
      .values({ name, description, settings: { ...defaultProjectSettings, ...settings }, createdBy: ownerId })
      .returning();
    await tx.insert(projectMembers).values({ projectId: project.id, userId: ownerId, role: "owner" });
    await tx.insert(labelClasses).values(
      classes.map((c, i) => ({ projectId: project.id, name: c.name, colour: c.colour, keyHint: c.keyHint ?? i + 1, position: i })),
    );
    await tx.insert(knnState).values({ projectId: project.id });
    await writeAudit(tx, { actorId: ownerId, projectId: project.id, action: "project.create", targetType: "project", targetId: project.id, after: { name, settings: project.settings, classes } });
    return project;
  });
}

/** Projects the user is a member of (all projects for site admins), with the user's role and item counts. */
export async function listProjectsByUserId({ userId, isAdmin }: { userId: string; isAdmin: boolean }) {
  const role = sql<ProjectRole | null>`(select pm.role from project_members pm where pm.project_id = ${projects.id} and pm.user_id = ${userId})`;
  const rows = await db
    .select({
      id: projects.id,
      name: projects.name,
      description: projects.description,
      createdAt: projects.createdAt,
      role,
      itemCount: sql<number>`(select count(*)::int from items i where i.project_id = ${projects.id})`,
      decidedCount: sql<number>`(select count(*)::int from items i where i.project_id = ${projects.id} and i.final_class_id is not null)`,
      memberCount: sql<number>`(select count(*)::int from project_members pm where pm.project_id = ${projects.id})`,
    })
    .from(projects)
    .where(isAdmin ? undefined : sql`exists (select 1 from project_members pm where pm.project_id = ${projects.id} and pm.user_id = ${userId})`)
    .orderBy(asc(projects.name), asc(projects.id));
  return rows;
}

export async function listClassesByProjectId({ projectId, tx = db }: { projectId: number; tx?: DbOrTx }) {
  return tx.select().from(labelClasses).where(eq(labelClasses.projectId, projectId)).orderBy(asc(labelClasses.position));
}

export async function updateProjectSettings({ projectId, actorId, name, description, settings }: { projectId: number; actorId: string; name?: string; description?: string; settings?: Partial<ProjectSettings> }) {
  return db.transaction(async (tx) => {
    const [before] = await tx.select().from(projects).where(eq(projects.id, projectId)).for("update");
    if (!before) throw new AppError("not_found:project", "No such project.");
    const next = { ...before.settings, ...settings };
    const [after] = await tx
      .update(projects)
      .set({ name: name ?? before.name, description: description ?? before.description, settings: next, updatedAt: new Date() })
      .where(eq(projects.id, projectId))
      .returning();
    const engineKeys = ["k", "distance", "scaling", "weighting", "voters"] as const;
    const engineChanged = engineKeys.some((k) => JSON.stringify(before.settings[k]) !== JSON.stringify(next[k]));
    if (engineChanged) {
      await tx.update(knnState).set({ version: sql`${knnState.version} + 1`, updatedAt: new Date() }).where(eq(knnState.projectId, projectId));
    }
    await writeAudit(tx, {
      actorId,
      projectId,
      action: engineChanged ? "project.knn_settings" : "project.settings",
      targetType: "project",
      targetId: projectId,
      before: { name: before.name, description: before.description, settings: before.settings },
      after: { name: after.name, description: after.description, settings: after.settings },
    });
    return after;
  });
}

export async function countItemsByProjectId({ projectId }: { projectId: number }) {
  const [row] = await db.select({ n: count() }).from(items).where(eq(items.projectId, projectId));
  return row?.n ?? 0;
}

export async function getMembershipRole({ projectId, userId }: { projectId: number; userId: string }) {
  const [row] = await db
    .select({ role: projectMembers.role })
    .from(projectMembers)
    .where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.userId, userId)))
    .limit(1);
  return row?.role ?? null;
}
