import "server-only";
import { and, asc, count, desc, eq, gt, isNull } from "drizzle-orm";
import { db } from "@/db";
import { invitations, projectMembers, projects, users, type ProjectRole } from "@/db/schema";
import { writeAudit } from "@/lib/audit";
import { hashPassword } from "@/lib/auth/password";
import { hashSecret, newSecret } from "@/lib/auth/tokens";
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { enqueue } from "@/lib/jobs/boss";
import { invitationMail } from "@/lib/mail/templates";

export async function listMembersByProjectId({ projectId }: { projectId: number }) {
  return db
    .select({ userId: users.id, name: users.name, email: users.email, role: projectMembers.role, since: projectMembers.createdAt, deactivatedAt: users.deactivatedAt })
    .from(projectMembers)
    .innerJoin(users, eq(users.id, projectMembers.userId))
    .where(eq(projectMembers.projectId, projectId))
    .orderBy(asc(projectMembers.role), asc(users.email));
}

export async function listOpenInvitationsByProjectId({ projectId }: { projectId: number }) {
  return db
    .select({ id: invitations.id, email: invitations.email, role: invitations.role, expiresAt: invitations.expiresAt, createdAt: invitations.createdAt })
    .from(invitations)
    .where(and(eq(invitations.projectId, projectId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, new Date())))
    .orderBy(desc(invitations.createdAt));
}

/** Creates an invitation and queues its e-mail; returns the link (shown to the owner too). */
export async function inviteMember({ projectId, email, role, actor }: { projectId: number; email: string; role: ProjectRole; actor: { id: string; name: string | null; email: string } }) {
  const secret = newSecret();
  const url = `${env.APP_URL}/invitations/${secret}`;
  const result = await db.transaction(async (tx) => {
    const [project] = await tx.select().from(projects).where(eq(projects.id, projectId));
    if (!project) throw new AppError("not_found:project", "No such project.");
    const existing = await tx
      .select({ id: users.id })
      .from(projectMembers)
      .innerJoin(users, eq(users.id, projectMembers.userId))
      .where(and(eq(projectMembers.projectId, projectId), eq(users.email, email)));
    if (existing.length) throw new AppError("conflict:member", `${email} is already a member of this project.`);
    const [inv] = await tx
      .insert(invitations)
      .values({ projectId, email, role, tokenHash: hashSecret(secret), invitedBy: actor.id, expiresAt: new Date(Date.now() + 7 * 24 * 3600 * 1000) })
      .returning();
    await writeAudit(tx, { actorId: actor.id, projectId, action: "invitation.create", targetType: "invitation", targetId: inv.id, after: { email, role } });
    return { invitation: inv, project };
  });
  await enqueue("mail", { to: email, ...invitationMail({ projectName: result.project.name, role, inviter: actor.name ?? actor.email, url }) });
  return { id: result.invitation.id, email, role, expiresAt: result.invitation.expiresAt };
}

export async function revokeInvitation({ projectId, invitationId, actorId }: { projectId: number; invitationId: number; actorId: string }) {
  await db.transaction(async (tx) => {
    const [inv] = await tx
      .update(invitations)
      .set({ revokedAt: new Date() })
      .where(and(eq(invitations.id, invitationId), eq(invitations.projectId, projectId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)))
      .returning();
    if (!inv) throw new AppError("not_found:invitation", "No open invitation with that id.");
    await writeAudit(tx, { actorId, projectId, action: "invitation.revoke", targetType: "invitation", targetId: invitationId, before: { email: inv.email, role: inv.role } });
  });
}

export async function getInvitationBySecret({ secret }: { secret: string }) {
  const [row] = await db
    .select({ invitation: invitations, projectName: projects.name })
    .from(invitations)
    .innerJoin(projects, eq(projects.id, invitations.projectId))
    .where(eq(invitations.tokenHash, hashSecret(secret)))
    .limit(1);
  if (!row) return null;
  const inv = row.invitation;
  const usable = !inv.acceptedAt && !inv.revokedAt && inv.expiresAt > new Date();
  const [account] = await db.select({ id: users.id, hasPassword: users.passwordHash }).from(users).where(eq(users.email, inv.email)).limit(1);
  return { invitation: inv, projectName: row.projectName, usable, accountExists: Boolean(account), accountHasPassword: Boolean(account?.hasPassword) };
}

/**
 * Accepts an invitation. An unknown e-mail gets an account (name + password chosen here);
 * a known one joins as itself. Returns the user id so the caller can sign it in.
 */
export async function acceptInvitation({ secret, name, password, signedInUserId }: { secret: string; name?: string; password?: string; signedInUserId?: string | null }) {
  return db.transaction(async (tx) => {
    const [inv] = await tx.select().from(invitations).where(eq(invitations.tokenHash, hashSecret(secret))).for("update");
    if (!inv || inv.revokedAt) throw new AppError("not_found:invitation", "This invitation does not exist or was withdrawn.");
    if (inv.acceptedAt) throw new AppError("conflict:invitation", "This invitation was already accepted. Sign in to open the project.");
    if (inv.expiresAt <= new Date()) throw new AppError("conflict:invitation", "This invitation has expired. Ask the project owner for a new one.");
    let [user] = await tx.select().from(users).where(eq(users.email, inv.email)).limit(1);
    let created = false;
    if (!user) {
      if (!password || !name) throw new AppError("bad_request:account", "Choose a name and a password to create your account.");
      [user] = await tx.insert(users).values({ email: inv.email, name, passwordHash: await hashPassword(password), emailVerified: new Date() }).returning();
      created = true;
    } else if (signedInUserId && signedInUserId !== user.id) {
      throw new AppError("forbidden:invitation", `This invitation is for ${inv.email}. Sign out and accept it with that account.`);
    } else if (!signedInUserId && !user.passwordHash && password && name) {
      // An account made by an e-mail link only: the invitation lets its owner set a password.
      await tx.update(users).set({ passwordHash: await hashPassword(password), name }).where(eq(users.id, user.id));
    }
    if (user.deactivatedAt) throw new AppError("forbidden:account", "This account is deactivated.");
    await tx
      .insert(projectMembers)
      .values({ projectId: inv.projectId, userId: user.id, role: inv.role })
      .onConflictDoUpdate({ target: [projectMembers.projectId, projectMembers.userId], set: { role: inv.role } });
    await tx.update(invitations).set({ acceptedAt: new Date() }).where(eq(invitations.id, inv.id));
    await writeAudit(tx, { actorId: user.id, projectId: inv.projectId, action: "invitation.accept", targetType: "invitation", targetId: inv.id, after: { email: inv.email, role: inv.role, accountCreated: created } });
    return { userId: user.id, projectId: inv.projectId, created, email: inv.email };
  });
}

async function ownerCount(projectId: number) {
  const [row] = await db.select({ n: count() }).from(projectMembers).where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.role, "owner")));
  return row?.n ?? 0;
}

/** Sets a member's role (or adds the user, for site admins). A project always keeps one owner. */
export async function setMemberRole({ projectId, userId, role, actorId }: { projectId: number; userId: string; role: ProjectRole; actorId: string }) {
  return db.transaction(async (tx) => {
    const [user] = await tx.select({ id: users.id }).from(users).where(eq(users.id, userId));
    if (!user) throw new AppError("not_found:user", "No such user.");
    const [before] = await tx.select().from(projectMembers).where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.userId, userId))).for("update");
    if (before?.role === "owner" && role !== "owner" && (await ownerCount(projectId)) <= 1) {
      throw new AppError("conflict:last_owner", "A project needs at least one owner. Make someone else owner first.");
    }
    await tx
      .insert(projectMembers)
      .values({ projectId, userId, role })
      .onConflictDoUpdate({ target: [projectMembers.projectId, projectMembers.userId], set: { role } });
    await writeAudit(tx, { actorId, projectId, action: before ? "member.role_change" : "member.add", targetType: "user", targetId: userId, before: before ? { role: before.role } : null, after: { role } });
    return { userId, role };
  });
}

export async function removeMember({ projectId, userId, actorId }: { projectId: number; userId: string; actorId: string }) {
  return db.transaction(async (tx) => {
    const [before] = await tx.select().from(projectMembers).where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.userId, userId))).for("update");
    if (!before) throw new AppError("not_found:member", "That user is not a member of this project.");
    if (before.role === "owner" && (await ownerCount(projectId)) <= 1) {
      throw new AppError("conflict:last_owner", "A project needs at least one owner. Make someone else owner first.");
    }
    await tx.delete(projectMembers).where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.userId, userId)));
    await writeAudit(tx, { actorId, projectId, action: "member.remove", targetType: "user", targetId: userId, before: { role: before.role } });
  });
}
