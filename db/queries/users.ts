import "server-only";
import { and, asc, desc, eq, gt, ilike, isNull, or, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { auditLog, passwordResets, projectMembers, projects, users } from "@/db/schema";
import { writeAudit } from "@/lib/audit";
import { hashPassword } from "@/lib/auth/password";
import { hashSecret, newSecret } from "@/lib/auth/tokens";
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { enqueue } from "@/lib/jobs/boss";
import { passwordResetMail } from "@/lib/mail/templates";

export async function listUsers({ query }: { query?: string }) {
  const where = query ? or(ilike(users.email, `%${query}%`), ilike(users.name, `%${query}%`)) : undefined;
  const rows = await db
    .select({ id: users.id, name: users.name, email: users.email, isAdmin: users.isAdmin, deactivatedAt: users.deactivatedAt, createdAt: users.createdAt })
    .from(users)
    .where(where)
    .orderBy(asc(users.email))
    .limit(500);
  const memberships = await db
    .select({ userId: projectMembers.userId, projectId: projectMembers.projectId, projectName: projects.name, role: projectMembers.role })
    .from(projectMembers)
    .innerJoin(projects, eq(projects.id, projectMembers.projectId));
  return rows.map((u) => ({ ...u, memberships: memberships.filter((m) => m.userId === u.id) }));
}

export async function listAllProjects() {
  return db.select({ id: projects.id, name: projects.name }).from(projects).orderBy(asc(projects.name));
}

export async function updateUserByAdmin({ userId, actorId, isAdmin, deactivated }: { userId: string; actorId: string; isAdmin?: boolean; deactivated?: boolean }) {
  return db.transaction(async (tx) => {
    const [before] = await tx.select().from(users).where(eq(users.id, userId)).for("update");
    if (!before) throw new AppError("not_found:user", "No such user.");
    if (userId === actorId && (isAdmin === false || deactivated === true)) {
      throw new AppError("conflict:self", "You cannot remove your own admin rights or deactivate yourself.");
    }
    const patch: Partial<typeof users.$inferInsert> = {};
    if (isAdmin !== undefined) patch.isAdmin = isAdmin;
    if (deactivated !== undefined) patch.deactivatedAt = deactivated ? before.deactivatedAt ?? new Date() : null;
    const [after] = await tx.update(users).set(patch).where(eq(users.id, userId)).returning();
    if (isAdmin !== undefined && isAdmin !== before.isAdmin) {
      await writeAudit(tx, { actorId, action: isAdmin ? "user.grant_admin" : "user.revoke_admin", targetType: "user", targetId: userId, before: { isAdmin: before.isAdmin }, after: { isAdmin } });
    }
    if (deactivated !== undefined && deactivated !== Boolean(before.deactivatedAt)) {
      await writeAudit(tx, { actorId, action: deactivated ? "user.deactivate" : "user.reactivate", targetType: "user", targetId: userId, before: { deactivatedAt: before.deactivatedAt }, after: { deactivatedAt: after.deactivatedAt } });
    }
    return { id: after.id, isAdmin: after.isAdmin, deactivatedAt: after.deactivatedAt };
  });
}

export async function listAudit({ projectId, action, actor, before, limit = 100 }: { projectId?: number; action?: string; actor?: string; before?: number; limit?: number }) {
  const where: SQL[] = [];
  if (projectId) where.push(eq(auditLog.projectId, projectId));
  if (action) where.push(ilike(auditLog.action, `${action}%`));
  if (actor) where.push(sql`${auditLog.actorId} in (select id from users where email ilike ${`%${actor}%`})`);
  if (before) where.push(sql`${auditLog.id} < ${before}`);
  return db
    .select({ id: auditLog.id, at: auditLog.at, action: auditLog.action, targetType: auditLog.targetType, targetId: auditLog.targetId, before: auditLog.before, after: auditLog.after, projectId: auditLog.projectId, projectName: projects.name, actorEmail: users.email })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.actorId))
    .leftJoin(projects, eq(projects.id, auditLog.projectId))
    .where(where.length ? and(...where) : undefined)
    .orderBy(desc(auditLog.id))
    .limit(limit);
}

/** Queues a reset link when the account exists; answers the same either way. */
export async function requestPasswordReset({ email }: { email: string }) {
  const [user] = await db.select().from(users).where(eq(users.email, email)).limit(1);
  if (!user || user.deactivatedAt) return;
  const secret = newSecret();
  await db.insert(passwordResets).values({ userId: user.id, tokenHash: hashSecret(secret), expiresAt: new Date(Date.now() + 30 * 60 * 1000) });
  await enqueue("mail", { to: user.email, ...passwordResetMail(`${env.APP_URL}/reset-password/${secret}`) });
}

export async function resetPassword({ secret, password }: { secret: string; password: string }) {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select()
      .from(passwordResets)
      .where(and(eq(passwordResets.tokenHash, hashSecret(secret)), isNull(passwordResets.usedAt), gt(passwordResets.expiresAt, new Date())))
      .for("update");
    if (!row) throw new AppError("bad_request:reset", "This reset link is invalid, used or expired. Ask for a new one.");
    await tx.update(users).set({ passwordHash: await hashPassword(password) }).where(eq(users.id, row.userId));
    await tx.update(passwordResets).set({ usedAt: new Date() }).where(eq(passwordResets.userId, row.userId));
    await writeAudit(tx, { actorId: row.userId, action: "user.password_reset", targetType: "user", targetId: row.userId });
    const [user] = await tx.select({ email: users.email }).from(users).where(eq(users.id, row.userId));
    return user;
  });
}

