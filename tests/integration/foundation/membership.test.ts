// Membership rules against the real database (no mocks).
import { and, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { acceptInvitation, inviteMember, removeMember, setMemberRole } from "@/db/queries/members";
import { createProject, updateProjectSettings } from "@/db/queries/projects";
import { createToken, revokeToken } from "@/db/queries/tokens";
import { updateUserByAdmin } from "@/db/queries/users";
import { auditLog, invitations, knnState, projectMembers, users } from "@/db/schema";
import { hashSecret } from "@/lib/auth/tokens";
import { AppError } from "@/lib/errors";
import { makeUser } from "../../support/fixtures";

async function newProject(ownerId: string) {
  return createProject({ ownerId, name: "Membership rules", description: "", classes: [{ name: "x", colour: "#2f7f86" }, { name: "y", colour: "#c8922a" }], settings: {} });
}

describe("membership rules", () => {
  it("a project always keeps one owner", async () => {
    const owner = await makeUser();
    const project = await newProject(owner.id);
    await expect(setMemberRole({ projectId: project.id, userId: owner.id, role: "viewer", actorId: owner.id })).rejects.toMatchObject({ code: "conflict:last_owner" });
    await expect(removeMember({ projectId: project.id, userId: owner.id, actorId: owner.id })).rejects.toBeInstanceOf(AppError);
    const second = await makeUser();
    await setMemberRole({ projectId: project.id, userId: second.id, role: "owner", actorId: owner.id });
    await setMemberRole({ projectId: project.id, userId: owner.id, role: "reviewer", actorId: owner.id });
    const [row] = await db.select().from(projectMembers).where(and(eq(projectMembers.projectId, project.id), eq(projectMembers.userId, owner.id)));
    expect(row.role).toBe("reviewer");
  });

  it("role changes are audit-logged with before and after", async () => {
    const owner = await makeUser();
    const project = await newProject(owner.id);
    const u = await makeUser();
    await setMemberRole({ projectId: project.id, userId: u.id, role: "annotator", actorId: owner.id });
    await setMemberRole({ projectId: project.id, userId: u.id, role: "reviewer", actorId: owner.id });
    const rows = await db.select().from(auditLog).where(and(eq(auditLog.projectId, project.id), eq(auditLog.targetId, u.id)));
    const change = rows.find((r) => r.action === "member.role_change");
    expect(change?.before).toEqual({ role: "annotator" });
    expect(change?.after).toEqual({ role: "reviewer" });
  });

  it("an invitation to an unknown e-mail creates the account on accepting, once", async () => {
    const owner = await makeUser();
    const project = await newProject(owner.id);
    const email = `new-${Date.now()}@example.test`;
    await inviteMember({ projectId: project.id, email, role: "annotator", actor: { id: owner.id, name: owner.name, email: owner.email } });
    const [inv] = await db.select().from(invitations).where(eq(invitations.email, email));
    // The secret is only e-mailed; stand in a known one for the test.
    const secret = "known-secret-for-test-0001";
    await db.update(invitations).set({ tokenHash: hashSecret(secret) }).where(eq(invitations.id, inv.id));
    await expect(acceptInvitation({ secret })).rejects.toMatchObject({ code: "bad_request:account" });
    const result = await acceptInvitation({ secret, name: "New Person", password: "a-long-password" });
    expect(result.created).toBe(true);
    const [member] = await db.select().from(projectMembers).where(and(eq(projectMembers.projectId, project.id), eq(projectMembers.userId, result.userId)));
    expect(member.role).toBe("annotator");
    await expect(acceptInvitation({ secret, name: "Again", password: "a-long-password" })).rejects.toMatchObject({ code: "conflict:invitation" });
  });

  it("an invitation cannot be accepted by another signed-in account", async () => {
    const owner = await makeUser();
    const project = await newProject(owner.id);
    const invited = await makeUser();
    const intruder = await makeUser();
    await inviteMember({ projectId: project.id, email: invited.email, role: "viewer", actor: { id: owner.id, name: owner.name, email: owner.email } });
    const secret = "known-secret-for-test-0002";
    await db.update(invitations).set({ tokenHash: hashSecret(secret) }).where(eq(invitations.email, invited.email));
    await expect(acceptInvitation({ secret, signedInUserId: intruder.id })).rejects.toMatchObject({ code: "forbidden:invitation" });
  });

  it("inviting an existing member is refused", async () => {
    const owner = await makeUser();
    const project = await newProject(owner.id);
    await expect(inviteMember({ projectId: project.id, email: owner.email, role: "viewer", actor: { id: owner.id, name: owner.name, email: owner.email } })).rejects.toMatchObject({ code: "conflict:member" });
  });

  it("changing k or distance bumps the neighbour-state version and is audit-logged as a k-NN settings change", async () => {
    const owner = await makeUser();
    const project = await newProject(owner.id);
    const [before] = await db.select().from(knnState).where(eq(knnState.projectId, project.id));
    await updateProjectSettings({ projectId: project.id, actorId: owner.id, settings: { k: 11 } });
    const [after] = await db.select().from(knnState).where(eq(knnState.projectId, project.id));
    expect(after.version).toBe(before.version + 1);
    await updateProjectSettings({ projectId: project.id, actorId: owner.id, description: "only text" });
    const [same] = await db.select().from(knnState).where(eq(knnState.projectId, project.id));
    expect(same.version).toBe(after.version);
    const actions = (await db.select().from(auditLog).where(eq(auditLog.projectId, project.id))).map((r) => r.action);
    expect(actions).toContain("project.knn_settings");
  });

  it("tokens: secret returned once, only the hash stored; revocation audit-logged", async () => {
    const u = await makeUser();
    const t = await createToken({ userId: u.id, name: "pipeline" });
    expect(t.secret).toMatch(/^vcn_/);
    const stored = await db.select().from(auditLog).where(and(eq(auditLog.actorId, u.id), eq(auditLog.action, "token.create")));
    expect(JSON.stringify(stored)).not.toContain(t.secret);
    await revokeToken({ userId: u.id, tokenId: t.id });
    await expect(revokeToken({ userId: u.id, tokenId: t.id })).rejects.toMatchObject({ code: "not_found:token" });
  });

  it("admins cannot deactivate themselves; deactivation is recorded", async () => {
    const admin = await makeUser({ isAdmin: true });
    const u = await makeUser();
    await expect(updateUserByAdmin({ userId: admin.id, actorId: admin.id, deactivated: true })).rejects.toMatchObject({ code: "conflict:self" });
    await updateUserByAdmin({ userId: u.id, actorId: admin.id, deactivated: true });
    const [row] = await db.select().from(users).where(eq(users.id, u.id));
    expect(row.deactivatedAt).not.toBeNull();
  });
});
