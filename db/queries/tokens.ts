import "server-only";
import { and, desc, eq, isNull } from "drizzle-orm";
import { db } from "@/db";
import { apiTokens } from "@/db/schema";
import { writeAudit } from "@/lib/audit";
import { apiTokenPrefix, hashSecret, newSecret } from "@/lib/auth/tokens";
import { AppError } from "@/lib/errors";

export async function listTokensByUserId({ userId }: { userId: string }) {
  return db
    .select({ id: apiTokens.id, name: apiTokens.name, prefix: apiTokens.prefix, createdAt: apiTokens.createdAt, lastUsedAt: apiTokens.lastUsedAt, revokedAt: apiTokens.revokedAt })
    .from(apiTokens)
    .where(eq(apiTokens.userId, userId))
    .orderBy(desc(apiTokens.createdAt));
}

/** Creates a token; the secret is returned once and only its hash is kept. */
export async function createToken({ userId, name }: { userId: string; name: string }) {
  const secret = newSecret(apiTokenPrefix);
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(apiTokens)
      .values({ userId, name, tokenHash: hashSecret(secret), prefix: secret.slice(0, apiTokenPrefix.length + 6) })
      .returning({ id: apiTokens.id, name: apiTokens.name, prefix: apiTokens.prefix, createdAt: apiTokens.createdAt });
    await writeAudit(tx, { actorId: userId, action: "token.create", targetType: "api_token", targetId: row.id, after: { name, prefix: row.prefix } });
    return { ...row, secret };
  });
}

export async function revokeToken({ userId, tokenId }: { userId: string; tokenId: number }) {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .update(apiTokens)
      .set({ revokedAt: new Date() })
      .where(and(eq(apiTokens.id, tokenId), eq(apiTokens.userId, userId), isNull(apiTokens.revokedAt)))
      .returning({ id: apiTokens.id, name: apiTokens.name });
    if (!row) throw new AppError("not_found:token", "No active token with that id.");
    await writeAudit(tx, { actorId: userId, action: "token.revoke", targetType: "api_token", targetId: tokenId, before: { name: row.name } });
  });
}
