import { eq } from "drizzle-orm";
import { db } from "@/db";
import { apiTokens, disputes, editions, invitations, items, projectMembers, projects, type ProjectRole } from "@/db/schema";
import { publishEdition } from "@/lib/editions/run";
import type { FeatureSchema } from "@/lib/projects/settings";
import { packFloat32 } from "@/lib/random";
import { hashSecret, newSecret } from "@/lib/auth/tokens";
import { makeRoleWorld, makeToken, makeUser, testPassword } from "../../support/fixtures";
import { api, signInCookie } from "../../support/http";

export const roles = ["admin", "owner", "reviewer", "annotator", "viewer", "outsider", "signedOut", "revokedToken"] as const;
export type Role = (typeof roles)[number];

export async function makeWorld() {
  const base = await makeRoleWorld();
  const revoked = await makeUser();
  const revokedToken = await makeToken(revoked.id);
  await db.insert(projectMembers).values({ projectId: base.project.id, userId: revoked.id, role: "owner" });
  await db.update(apiTokens).set({ revokedAt: new Date() }).where(eq(apiTokens.id, revokedToken.id));
  const cookies: Partial<Record<Role, string>> = {};
  const featureSchema: FeatureSchema = { source: "table", dimension: 2, columns: [{ name: "a", kind: "numeric", width: 1 }, { name: "b", kind: "numeric", width: 1 }] };
  await db.update(projects).set({ featureSchema }).where(eq(projects.id, base.project.id));
  let seq = 0;
  let failed: string | undefined;
  /** A new unlabelled item (or a decided one) in the world project, with a feature vector. */
  const freshItem = async (decided?: number) => {
    seq += 1;
    const [row] = await db
      .insert(items)
      .values({
        projectId: base.project.id,
        externalId: `W-${seq}-${Math.random().toString(36).slice(2, 7)}`,
        fields: { a: seq % 7, b: seq % 5 },
        vector: packFloat32([seq % 7, seq % 5]),
        status: decided === undefined ? "unlabelled" : "agreed",
        finalClassId: decided === undefined ? null : base.classes[decided % base.classes.length].id,
        finalSource: decided === undefined ? null : "agreed",
      })
      .returning();
    return row;
  };
  for (let i = 0; i < 12; i += 1) await freshItem(i);
  const sampleItem = await freshItem();
  // Numbers far apart, so editions the API numbers (max + 1) never collide with these.
  let editionNumber = 0;
  const newEdition = async () => {
    editionNumber += 1;
    const [e] = await db.insert(editions).values({ projectId: base.project.id, number: editionNumber * 1000, status: "pending" }).returning();
    return e.id;
  };
  const publishedEdition = await newEdition();
  await publishEdition(publishedEdition);
  const users = base.users as Record<string, { id: string; email: string }>;
  return {
    ...base,
    revokedToken,
    async addMember(userId: string, role: ProjectRole) {
      await db.insert(projectMembers).values({ projectId: base.project.id, userId, role });
    },
    freshItem,
    sampleItem,
    publishedEdition,
    newEdition,
    /** A small CSV uploaded by the owner through the presigned-URL path; `complete` marks it uploaded. */
    async uploadCsv(complete = true, text = "id,a,b\nu1,1,2\nu2,3,4\n") {
      const bytes = new TextEncoder().encode(text);
      const start = await api(`/api/v1/projects/${base.project.id}/uploads`, { token: base.tokens.owner.secret, body: { fileName: "m.csv", size: bytes.length, contentType: "text/csv" } });
      await fetch(start.json.url, { method: "PUT", body: bytes, headers: { "content-type": "text/csv" } });
      if (complete) await api(`/api/v1/projects/${base.project.id}/uploads/${start.json.upload.id}/complete`, { token: base.tokens.owner.secret, body: {} });
      return start.json.upload.id as string;
    },
    /** An import that failed validation and has an error report (made once, then reused). */
    async failedImport() {
      if (failed) return failed;
      const uploadId = await this.uploadCsv(true, "id,a,b\nf1,n/a,2\n");
      const res = await api(`/api/v1/projects/${base.project.id}/imports`, {
        token: base.tokens.owner.secret,
        body: { uploadIds: [uploadId], format: "csv", columns: [{ name: "id", role: "id" }, { name: "a", role: "numeric" }, { name: "b", role: "numeric" }] },
      });
      const id = res.json.import.id as string;
      for (let i = 0; i < 120; i += 1) {
        const r = await api(`/api/v1/projects/${base.project.id}/imports/${id}`, { token: base.tokens.owner.secret });
        if (r.json.import.status === "failed") break;
        await new Promise((done) => setTimeout(done, 250));
      }
      failed = id;
      return id;
    },
    async startImport() {
      const uploadId = await this.uploadCsv();
      const res = await api(`/api/v1/projects/${base.project.id}/imports`, {
        token: base.tokens.owner.secret,
        body: { uploadIds: [uploadId], format: "csv", columns: [{ name: "id", role: "id" }, { name: "a", role: "numeric" }, { name: "b", role: "numeric" }] },
      });
      return res.json.import.id as string;
    },
    async freshDispute() {
      const item = await freshItem();
      await db.update(items).set({ status: "disputed", labelCount: 2 }).where(eq(items.id, item.id));
      const [d] = await db.insert(disputes).values({ projectId: base.project.id, itemId: item.id, reason: "doubt" }).returning();
      return { item, dispute: d };
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
