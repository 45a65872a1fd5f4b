// The foundation as a person uses it, in headless Chromium.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { projectMembers } from "@/db/schema";
import { launch, shot, signIn } from "../support/browser";
import { makeProject, makeUser, testPassword } from "../support/fixtures";
import { appUrl, firstLink, waitForMail } from "../support/http";

let browser: Awaited<ReturnType<typeof launch>>;

beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

describe("sign-in and roles in the browser", () => {
  it("redirects a signed-out visitor to sign-in, keeping where they were going", async () => {
    const page = await browser.context.newPage();
    await page.context().clearCookies();
    await page.goto(`${appUrl}/projects/1/members`);
    await page.waitForURL(/\/sign-in/);
    expect(new URL(page.url()).searchParams.get("callbackUrl")).toBe("/projects/1/members");
    await expect(page.getByRole("heading", { name: "Sign in" }).isVisible()).resolves.toBe(true);
    await shot(page, "sign-in");
    await page.close();
  });

  it("signs in with a password, refuses a wrong one, and signs out", async () => {
    const user = await makeUser({ name: "Pat Password" });
    const page = await browser.context.newPage();
    await page.context().clearCookies();
    await page.goto(`${appUrl}/sign-in`);
    await page.getByLabel("E-mail").fill(user.email);
    await page.getByLabel("Password").fill("not-the-password");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.getByText(/do not match an active account/).waitFor();
    await signIn(page, appUrl, user.email, testPassword);
    await page.waitForURL(/\/projects/);
    await expect(page.getByText("No projects yet").isVisible()).resolves.toBe(true);
    await shot(page, "projects-empty");
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL(/\/sign-in/);
    await page.close();
  });

  it("signs in with an e-mail link read from the SMTP catcher", async () => {
    const user = await makeUser({ name: "Lee Link" });
    const page = await browser.context.newPage();
    await page.context().clearCookies();
    await page.goto(`${appUrl}/sign-in`);
    await page.getByRole("tab", { name: "E-mail link" }).click();
    await page.getByLabel("E-mail").fill(user.email);
    await page.getByRole("button", { name: "Send sign-in link" }).click();
    await page.waitForURL(/check-email/);
    const mail = await waitForMail(user.email, /sign-in link/);
    await page.goto(firstLink(mail.text));
    await page.waitForURL(/\/projects/);
    await expect(page.getByText(user.email).first().isVisible()).resolves.toBe(true);
    await page.close();
  });

  it("an owner invites a new annotator who accepts from the e-mail and sees the project", async () => {
    const owner = await makeUser({ name: "Olive Owner" });
    const { project } = await makeProject({ name: "Invitation trail", members: [{ userId: owner.id, role: "owner" }] });
    const page = await browser.context.newPage();
    await page.context().clearCookies();
    await signIn(page, appUrl, owner.email, testPassword);
    await page.goto(`${appUrl}/projects/${project.id}/members`);
    const invitee = `invitee-${Date.now()}@example.test`;
    await page.getByLabel("E-mail", { exact: true }).fill(invitee);
    await page.getByLabel("Role", { exact: true }).selectOption("annotator");
    await page.getByRole("button", { name: "Send invitation" }).click();
    await page.getByText(`Invitation sent to ${invitee}.`).waitFor();
    await shot(page, "members-invited");
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL(/\/sign-in/);

    const mail = await waitForMail(invitee, /invited to "Invitation trail"/);
    await page.goto(firstLink(mail.text));
    await page.getByLabel("Your name").fill("Ivy Invitee");
    await page.getByLabel("Choose a password").fill("ivy-password-123");
    await shot(page, "invitation-accept");
    await page.getByRole("button", { name: "Create account and join" }).click();
    await page.waitForURL(new RegExp(`/projects/${project.id}$`));
    await expect(page.getByRole("heading", { name: "Invitation trail" }).isVisible()).resolves.toBe(true);
    await expect(page.getByText("You are annotator").isVisible()).resolves.toBe(true);
    await page.close();
  });

  it("a site admin changes a member's role", async () => {
    const admin = await makeUser({ isAdmin: true, name: "Ada Admin" });
    const member = await makeUser({ name: "Rory Role" });
    const { project } = await makeProject({ name: `Admin target ${Date.now()}`, members: [{ userId: member.id, role: "viewer" }] });
    const page = await browser.context.newPage();
    await page.context().clearCookies();
    await signIn(page, appUrl, admin.email, testPassword);
    await page.goto(`${appUrl}/admin`);
    await page.getByLabel("Roles in").selectOption(String(project.id));
    await page.getByLabel("Search users").fill(member.email);
    await page.getByLabel(`Role of ${member.email}`).selectOption("reviewer");
    await page.getByText(`${member.email} is now reviewer`).waitFor();
    await shot(page, "admin-users");
    const [row] = await db.select().from(projectMembers).where(eq(projectMembers.userId, member.id));
    expect(row.role).toBe("reviewer");
    await page.close();
  });
});
