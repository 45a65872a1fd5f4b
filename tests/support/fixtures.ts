// Real rows in the test database for integration tests (no mocks).
import { randomUUID } from "node:crypto";
import { db } from "@/db";
import { apiTokens, knnState, labelClasses, projectMembers, projects, users, type ProjectRole } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { apiTokenPrefix, hashSecret, newSecret } from "@/lib/auth/tokens";
import { defaultProjectSettings, type ProjectSettings } from "@/lib/projects/settings";

export const testPassword = "test-password-1234";
let cachedHash: string | undefined;

export async function makeUser(opts: { email?: string; name?: string; isAdmin?: boolean } = {}) {
  cachedHash ??= await hashPassword(testPassword);
  const email = opts.email ?? `user-${randomUUID().slice(0, 8)}@example.test`;
  const [user] = await db.insert(users).values({ email, name: opts.name ?? email.split("@")[0], passwordHash: cachedHash, isAdmin: opts.isAdmin ?? false }).returning();
  return user;
}

export async function makeToken(userId: string) {
  const secret = newSecret(apiTokenPrefix);
  const [row] = await db.insert(apiTokens).values({ userId, name: "test", tokenHash: hashSecret(secret), prefix: secret.slice(0, 10) }).returning();
  return { secret, id: row.id };
}

export async function makeProject(opts: { name?: string; classes?: string[]; settings?: Partial<ProjectSettings>; members?: Array<{ userId: string; role: ProjectRole }> } = {}) {
  const [project] = await db
    .insert(projects)
    .values({ name: opts.name ?? `Project ${randomUUID().slice(0, 6)}`, settings: { ...defaultProjectSettings, ...opts.settings } })
    .returning();
  const classes = await db
    .insert(labelClasses)
    .values((opts.classes ?? ["alpha", "beta", "gamma"]).map((name, i) => ({ projectId: project.id, name, colour: "#2f7f86", keyHint: i + 1, position: i })))
    .returning();
  await db.insert(knnState).values({ projectId: project.id });
  for (const m of opts.members ?? []) await db.insert(projectMembers).values({ projectId: project.id, userId: m.userId, role: m.role });
  return { project, classes };
}

/** A project with one user per role plus an outsider (member of another project) and a site admin, each with an API token. */
export async function makeRoleWorld() {
  const admin = await makeUser({ isAdmin: true });
  const owner = await makeUser();
  const reviewer = await makeUser();
  const annotator = await makeUser();
  const viewer = await makeUser();
  const outsider = await makeUser();
  const { project, classes } = await makeProject({
    members: [
      { userId: owner.id, role: "owner" },
      { userId: reviewer.id, role: "reviewer" },
      { userId: annotator.id, role: "annotator" },
      { userId: viewer.id, role: "viewer" },
    ],
  });
  const other = await makeProject({ members: [{ userId: outsider.id, role: "owner" }] });
  const tokens = {
    admin: await makeToken(admin.id),
    owner: await makeToken(owner.id),
    reviewer: await makeToken(reviewer.id),
    annotator: await makeToken(annotator.id),
    viewer: await makeToken(viewer.id),
    outsider: await makeToken(outsider.id),
  };
  return { users: { admin, owner, reviewer, annotator, viewer, outsider }, project, classes, other, tokens };
}
