import "server-only";
import { and, eq, isNull } from "drizzle-orm";
import { headers } from "next/headers";
import { auth } from "@/auth";
import { db } from "@/db";
import { apiTokens, projectMembers, projects, users, type Project, type ProjectRole, type User } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { roleAtLeast } from "./roles";
import { apiTokenPrefix, hashSecret } from "./tokens";
import { limitToken } from "./rate-limit";

export type Caller = { user: User; via: "session" | "token"; tokenId?: number };

async function callerFromToken(authorization: string): Promise<Caller> {
  const secret = authorization.slice("Bearer ".length).trim();
  if (!secret.startsWith(apiTokenPrefix)) throw new AppError("unauthorized:token", "The API token is malformed.");
  const rows = await db
    .select({ token: apiTokens, user: users })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(and(eq(apiTokens.tokenHash, hashSecret(secret)), isNull(apiTokens.revokedAt)))
    .limit(1);
  const row = rows[0];
  if (!row || row.user.deactivatedAt) throw new AppError("unauthorized:token", "The API token is unknown or revoked.");
  await limitToken(row.token.id);
  // last_used_at at minute resolution keeps hot token traffic from rewriting the row on every request.
  const last = row.token.lastUsedAt?.getTime() ?? 0;
  if (Date.now() - last > 60_000) {
    await db.update(apiTokens).set({ lastUsedAt: new Date() }).where(eq(apiTokens.id, row.token.id));
  }
  return { user: row.user, via: "token", tokenId: row.token.id };
}

/** The signed-in user (session cookie or `Authorization: Bearer` API token), or null. */
export async function getCaller(): Promise<Caller | null> {
  const h = await headers();
  const authorization = h.get("authorization");
  if (authorization?.startsWith("Bearer ")) return callerFromToken(authorization);
  const session = await auth();
  const id = session?.user?.id;
  if (!id) return null;
  const [user] = await db.select().from(users).where(eq(users.id, id)).limit(1);
  if (!user || user.deactivatedAt) return null;
  return { user, via: "session" };
}

export async function requireUser(): Promise<Caller> {
  const caller = await getCaller();
  if (!caller) throw new AppError("unauthorized:auth", "Sign in to continue.");
  return caller;
}

export async function requireAdmin(): Promise<Caller> {
  const caller = await requireUser();
  if (!caller.user.isAdmin) throw new AppError("forbidden:admin", "Only site admins may do this.");
  return caller;
}

export type ProjectAccess = Caller & { project: Project; role: ProjectRole | null; isAdmin: boolean };

/**
 * The one gate for project data: the caller must hold at least `needed` in this project.
 * Site admins pass as owners. Non-members get 404, so project ids reveal nothing.
 */
export async function requireRole(projectId: number, needed: ProjectRole): Promise<ProjectAccess> {
  const caller = await requireUser();
  if (!Number.isSafeInteger(projectId) || projectId <= 0) throw new AppError("not_found:project", "No such project.");
  const rows = await db
    .select({ project: projects, role: projectMembers.role })
    .from(projects)
    .leftJoin(projectMembers, and(eq(projectMembers.projectId, projects.id), eq(projectMembers.userId, caller.user.id)))
    .where(eq(projects.id, projectId))
    .limit(1);
  const row = rows[0];
  const isAdmin = caller.user.isAdmin;
  if (!row || (!row.role && !isAdmin)) throw new AppError("not_found:project", "No such project.");
  const effective: ProjectRole | null = isAdmin ? "owner" : row.role;
  if (!roleAtLeast(effective, needed)) {
    throw new AppError("forbidden:role", `This needs the ${needed} role in this project.`);
  }
  return { ...caller, project: row.project, role: row.role, isAdmin };
}
