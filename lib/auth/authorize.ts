import "server-only";
import { and, eq, isNull, sql } from "drizzle-orm";
import { headers } from "next/headers";
import { auth } from "@/auth";
import { db } from "@/db";
import { apiTokens, projectMembers, projects, users, type ApiToken, type Project, type ProjectRole, type User } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { roleAtLeast } from "./roles";
import { apiTokenPrefix, hashSecret } from "./tokens";
import { limitToken } from "./rate-limit";

export type Caller = { user: User; via: "session" | "token"; tokenId?: number };

type ProjectRow = { project: Project | null; role: ProjectRole | null };

/** A valid project id for a lookup, or 0 (which matches no project). */
const lookupId = (projectId: number) => (Number.isSafeInteger(projectId) && projectId > 0 && projectId <= 2_147_483_647 ? projectId : 0);

/** The API's hot path as a named statement: PostgreSQL plans it once per connection, drizzle builds its SQL once. */
let tokenAccessStatement: ReturnType<typeof buildTokenAccess> | undefined;
function buildTokenAccess() {
  return db
    .select({ token: apiTokens, user: users, project: projects, role: projectMembers.role })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .leftJoin(projects, eq(projects.id, sql.placeholder("projectId")))
    .leftJoin(projectMembers, and(eq(projectMembers.projectId, projects.id), eq(projectMembers.userId, users.id)))
    .where(and(eq(apiTokens.tokenHash, sql.placeholder("hash")), isNull(apiTokens.revokedAt)))
    .limit(1)
    .prepare("vicinal_token_access");
}

/**
 * The token's user; with `projectId`, also that project and the user's role in it, read in the same query (the API's hot
 * path pays one round trip for authentication and membership together). The checks keep their order either way.
 */
async function callerFromToken(authorization: string, projectId?: number): Promise<Caller & { membership?: ProjectRow }> {
  const secret = authorization.slice("Bearer ".length).trim();
  if (!secret.startsWith(apiTokenPrefix)) throw new AppError("unauthorized:token", "The API token is malformed.");
  const hash = hashSecret(secret);
  const rows: Array<{ token: ApiToken; user: User; project?: Project | null; role?: ProjectRole | null }> =
    projectId === undefined
      ? await db
          .select({ token: apiTokens, user: users })
          .from(apiTokens)
          .innerJoin(users, eq(users.id, apiTokens.userId))
          .where(and(eq(apiTokens.tokenHash, hash), isNull(apiTokens.revokedAt)))
          .limit(1)
      : await (tokenAccessStatement ??= buildTokenAccess()).execute({ projectId: lookupId(projectId), hash });
  const row = rows[0];
  if (!row || row.user.deactivatedAt) throw new AppError("unauthorized:token", "The API token is unknown or revoked.");
  await limitToken(row.token.id);
  // last_used_at at minute resolution keeps hot token traffic from rewriting the row on every request.
  const last = row.token.lastUsedAt?.getTime() ?? 0;
  if (Date.now() - last > 60_000) {
    await db.update(apiTokens).set({ lastUsedAt: new Date() }).where(eq(apiTokens.id, row.token.id));
  }
  const membership = projectId === undefined ? undefined : { project: row.project ?? null, role: row.role ?? null };
  return { user: row.user, via: "token", tokenId: row.token.id, membership };
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
  const authorization = (await headers()).get("authorization");
  const viaToken = authorization?.startsWith("Bearer ") ? await callerFromToken(authorization, projectId) : null;
  const { membership, ...caller }: Caller & { membership?: ProjectRow } = viaToken ?? (await requireUser());
  if (!lookupId(projectId)) throw new AppError("not_found:project", "No such project.");
  let row: ProjectRow | undefined = membership;
  if (!row) {
    [row] = await db
      .select({ project: projects, role: projectMembers.role })
      .from(projects)
      .leftJoin(projectMembers, and(eq(projectMembers.projectId, projects.id), eq(projectMembers.userId, caller.user.id)))
      .where(eq(projects.id, projectId))
      .limit(1);
  }
  const isAdmin = caller.user.isAdmin;
  if (!row?.project || (!row.role && !isAdmin)) throw new AppError("not_found:project", "No such project.");
  const effective: ProjectRole | null = isAdmin ? "owner" : row.role;
  if (!roleAtLeast(effective, needed)) {
    throw new AppError("forbidden:role", `This needs the ${needed} role in this project.`);
  }
  return { ...caller, project: row.project, role: row.role, isAdmin };
}
