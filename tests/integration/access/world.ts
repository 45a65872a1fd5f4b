import { eq } from "drizzle-orm";
import { db } from "@/db";
import { apiTokens, invitations, projectMembers, type ProjectRole } from "@/db/schema";
import { hashSecret, newSecret } from "@/lib/auth/tokens";
import { makeRoleWorld, makeToken, makeUser, testPassword } from "../../support/fixtures";
import { signInCookie } from "../../support/http";

export const roles = ["admin", "owner", "reviewer", "annotator", "viewer", "outsider", "signedOut", "revokedToken"] as const;
export type Role = (typeof roles)[number];

export async function makeWorld() {
  const base = await makeRoleWorld();
  const revoked = await makeUser();
  const revokedToken = await makeToken(revoked.id);
  await db.insert(projectMembers).values({ projectId: base.project.id, userId: revoked.id, role: "owner" });
  await db.update(apiTokens).set({ revokedAt: new Date() }).where(eq(apiTokens.id, revokedToken.id));
  const cookies: Partial<Record<Role, string>> = {};
  const users = base.users as Record<string, { id: string; email: string }>;
  return {
    ...base,
    revokedToken,
    async addMember(userId: string, role: ProjectRole) {
      await db.insert(projectMembers).values({ projectId: base.project.id, userId, role });
    },
    async makeInvitation() {
      const [inv] = await db
        .insert(invitations)
        .values({ projectId: base.project.id, email: `inv-${Math.random().toString(36).slice(2, 8)}@example.test`, role: "viewer", tokenHash: hashSecret(newSecret()), expiresAt: new Date(Date.now() + 86_400_000) })
        .returning();
      return inv.id;
    },
    async freshTokenId(role: Role) {
      const user = users[role];
      if (!user) return 999_999;
      return (await makeToken(user.id)).id;
    },
    /** Auth headers for a role: an API token, or (sessionOnly) a signed-in session cookie. */
    async auth(role: Role, session = false): Promise<{ token?: string; cookie?: string }> {
      if (role === "signedOut") return {};
      if (role === "revokedToken") return { token: revokedToken.secret };
      if (!session) return { token: (base.tokens as Record<string, { secret: string }>)[role].secret };
      cookies[role] ??= await signInCookie(users[role].email, testPassword);
      return { cookie: cookies[role] };
    },
  };
}

export type World = Awaited<ReturnType<typeof makeWorld>>;
