// Tuning, Doubts and Map in headless Chromium, on a project seeded here with a few hundred labelled items.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { auditLog, disputes, labelClasses, projects } from "@/db/schema";
import { launch, shot, signIn, type Page } from "@/tests/support/browser";
import { testPassword } from "@/tests/support/fixtures";
import { appUrl } from "@/tests/support/http";
import { buildWorld, type World } from "@/tests/integration/suggest/world";

let w: World;
let page: Page;
let close: () => Promise<void>;
beforeAll(async () => {
  w = await buildWorld({ n: 520, seed: 5, agreedTail: 300 });
  const palette = ["#5f8a3a", "#c8922a", "#7b5ea7"];
  for (const [i, c] of w.classes.entries()) await db.update(labelClasses).set({ colour: palette[i], name: ["Calm", "Brisk", "Gusty"][i] }).where(eq(labelClasses.id, c.id));
  await db.update(projects).set({ name: "Engine pages (e2e)" }).where(eq(projects.id, w.project.id));
  const b = await launch();
  close = b.close;
  page = await b.context.newPage();
  await signIn(page, appUrl, w.users.owner.email, testPassword);
}, 60_000);
afterAll(async () => {
  await close?.();
  await pool.end();
});

const base = () => `${appUrl}/projects/${w.project.id}`;

describe("engine pages", () => {
  it("Tuning: runs leave-one-out, draws curves and the numbers, applies a k and distance", async () => {
    await page.goto(`${base()}/tuning`);
    await page.getByRole("button", { name: "Run Tuning" }).click();
    await page.getByRole("table", { name: /Leave-one-out results/ }).waitFor({ timeout: 20_000 });
    expect(await page.locator("tbody tr").count()).toBeGreaterThanOrEqual(78);
    await expect(page.getByText(/ECE =/).first().isVisible()).resolves.toBe(true);
    await shot(page, "engine-tuning");
    const row = page.locator("tr", { hasText: "Manhattan" }).filter({ has: page.locator("td", { hasText: /^9$/ }) });
    await row.getByRole("button", { name: "Select" }).click();
    await page.getByRole("button", { name: "Apply k = 9, Manhattan" }).click();
    await page.getByText(/Suggestions now use k = 9 and Manhattan distance/).waitFor({ timeout: 10_000 });
    const [p] = await db.select().from(projects).where(eq(projects.id, w.project.id));
    expect(p.settings.k).toBe(9);
    expect(p.settings.distance).toBe("manhattan");
    const audit = await db.select().from(auditLog).where(eq(auditLog.projectId, w.project.id));
    expect(audit.some((a) => a.action === "project.knn_settings")).toBe(true);
  }, 60_000);

  it("Doubts: lists doubted labels with their neighbours and sends one to Disputes", async () => {
    await page.goto(`${base()}/doubts`);
    const first = page.getByRole("listitem", { name: /^Doubt 1:/ });
    await first.waitFor({ timeout: 20_000 });
    await expect(first.getByText("Neighbours, nearest first").isVisible()).resolves.toBe(true);
    await shot(page, "engine-doubts");
    await first.getByRole("button", { name: "Send to Disputes" }).click();
    await first.getByText("In Disputes").waitFor({ timeout: 10_000 });
    const open = await db.select().from(disputes).where(eq(disputes.projectId, w.project.id));
    expect(open.some((d) => d.reason === "doubt" && d.status === "open")).toBe(true);
  }, 60_000);

  it("Map: canvas with regions, a k slider, method and sampling stated", async () => {
    await page.goto(`${base()}/map`);
    const canvas = page.getByRole("img", { name: /Map of 520 items/ });
    await canvas.waitFor({ timeout: 30_000 });
    await expect(page.getByText(/computed in the projected plane/).isVisible()).resolves.toBe(true);
    await expect(page.getByText(/PCA fitted on 520 of 520 rows/).isVisible()).resolves.toBe(true);
    await shot(page, "engine-map-k9");
    const slider = page.getByLabel(/Regions at/);
    await slider.focus();
    await page.keyboard.press("Home");
    await page.getByText("k = 1", { exact: true }).waitFor();
    await shot(page, "engine-map-k1");
    await page.keyboard.press("End");
    await page.getByText("k = 51", { exact: true }).waitFor();
    await shot(page, "engine-map-k51");
  }, 60_000);
});
