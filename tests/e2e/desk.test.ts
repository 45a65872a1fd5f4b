// Tried as a new user would, in headless Chromium: two annotators label by keyboard with overlap 2, a reviewer rules.
import { mkdirSync } from "node:fs";
import path from "node:path";
import { and, eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { items, labels } from "@/db/schema";
import { launch, type Page, shot, signIn } from "../support/browser";
import { makeUser, testPassword } from "../support/fixtures";
import { appUrl } from "../support/http";
import { makeLabellingWorld } from "../integration/labelling/world";

let world: Awaited<ReturnType<typeof makeLabellingWorld>>;
let ana: Awaited<ReturnType<typeof makeUser>>;
let ben: Awaited<ReturnType<typeof makeUser>>;
let rhea: Awaited<ReturnType<typeof makeUser>>;

beforeAll(async () => {
  mkdirSync(path.join(process.env.VICINAL_TEST_DATA ?? ".data", "screenshots"), { recursive: true });
  ana = await makeUser({ name: "Ana Keys" });
  ben = await makeUser({ name: "Ben Keys" });
  rhea = await makeUser({ name: "Rhea Rules" });
  world = await makeLabellingWorld({
    n: 14,
    settings: { overlap: 2 },
    members: [
      { user: ana, role: "annotator" },
      { user: ben, role: "annotator" },
      { user: rhea, role: "reviewer" },
    ],
  });
  // The first nine items already carry agreed labels (invented), so the Desk has neighbours that vote.
  for (let i = 0; i < 9; i += 1) {
    await db.update(items).set({ status: "agreed", finalClassId: world.classes[i % 3].id, finalSource: "agreed", labelCount: 2 }).where(eq(items.id, world.items[i].id));
  }
});
afterAll(async () => {
  await pool.end();
});

const heading = (page: Page) => page.locator("main h1").first();

async function pressAndAdvance(page: Page, key: string) {
  const before = await heading(page).textContent();
  await page.keyboard.press(key);
  await page.waitForFunction((prev) => document.querySelector("main h1")?.textContent !== prev, before, { timeout: 10_000 });
}

async function labelByKeyboard(email: string, keys: string[], shotName: string) {
  const { context, close } = await launch();
  try {
    const page = await context.newPage();
    await signIn(page, appUrl, email, testPassword);
    await page.goto(`${appUrl}/projects/${world.project.id}/desk`);
    await page.getByText(/^IT-\d{4}$/).first().waitFor({ timeout: 20_000 });
    await page.getByRole("button", { name: /Take/ }).waitFor();
    await shot(page, shotName);
    for (const key of keys) await pressAndAdvance(page, key);
    return { page, close };
  } catch (error) {
    await close();
    throw error;
  }
}

describe("Desk and Disputes in the browser", () => {
  it("two annotators label by keyboard; U undoes; ? shows the keys", async () => {
    const a = await labelByKeyboard(ana.email, ["Enter", "1", "1", "2"], "desk-ana");
    try {
      await a.page.keyboard.press("?");
      await a.page.getByRole("dialog", { name: "Desk keys" }).waitFor();
      await shot(a.page, "desk-keys");
      await a.page.keyboard.press("Escape");
      await a.page.getByRole("dialog").waitFor({ state: "detached" });
      await pressAndAdvance(a.page, "3");
      await pressAndAdvance(a.page, "u");
      await a.page.getByText(/undone; label it again/).waitFor();
      await pressAndAdvance(a.page, "3");
      await a.page.getByText("Done today").waitFor();
      await a.page.waitForFunction(() => document.body.innerText.includes("Nothing to label") || document.body.innerText.includes("IT-"));
      await shot(a.page, "desk-ana-after");
    } finally {
      await a.close();
    }
    const mine = await db.select().from(labels).where(and(eq(labels.projectId, world.project.id), eq(labels.annotatorId, ana.id)));
    const live = mine.filter((l) => !l.undoneAt);
    expect(live).toHaveLength(5);
    expect(mine.filter((l) => l.undoneAt)).toHaveLength(1);
    expect(live.filter((l) => l.tookSuggestion)).toHaveLength(1);
    expect(live.every((l) => l.suggestion === null || typeof l.suggestion.shown === "boolean")).toBe(true);

    const b = await labelByKeyboard(ben.email, ["2", "2", "2", "3", "1"], "desk-ben");
    await b.close();
    const disputed = await db.execute<{ n: number }>(sql`select count(*)::int as n from disputes where project_id = ${world.project.id} and status = 'open'`);
    expect(disputed.rows[0].n).toBeGreaterThan(0);
  }, 90_000);

  it("a reviewer sees who labelled what and rules on a dispute", async () => {
    const { context, close } = await launch();
    try {
      const page = await context.newPage();
      await signIn(page, appUrl, rhea.email, testPassword);
      await page.goto(`${appUrl}/projects/${world.project.id}/disputes`);
      await page.getByRole("button", { name: "Issue ruling" }).waitFor({ timeout: 20_000 });
      await page.getByText("Ana Keys").first().waitFor();
      await shot(page, "disputes");
      const open = await db.execute<{ n: number }>(sql`select count(*)::int as n from disputes where project_id = ${world.project.id} and status = 'open'`);
      await page.getByRole("radio", { name: world.classes[1].name }).check({ force: true });
      await page.getByLabel("Reason").fill("weight and length match the middle cluster");
      await page.getByRole("button", { name: "Issue ruling" }).click();
      await page.getByText(/Ruling on IT-\d{4} saved: /).waitFor();
      await page.getByText(/5 open disputes/).waitFor({ state: "detached" });
      await shot(page, "disputes-ruled");
      const after = await db.execute<{ n: number }>(sql`select count(*)::int as n from disputes where project_id = ${world.project.id} and status = 'open'`);
      expect(after.rows[0].n).toBe(open.rows[0].n - 1);
      const ruled = await db.execute<{ n: number }>(sql`select count(*)::int as n from items where project_id = ${world.project.id} and final_source = 'ruling' and final_class_id = ${world.classes[1].id}`);
      expect(ruled.rows[0].n).toBe(1);
    } finally {
      await close();
    }
  }, 60_000);
});
