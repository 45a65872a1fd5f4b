// Tried as a new owner would, in headless Chromium: a CSV, a Parquet file and a folder of images, each imported from the browser.
import { mkdirSync } from "node:fs";
import path from "node:path";
import { count, eq } from "drizzle-orm";
import type PgBoss from "pg-boss";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createWorkerBoss } from "@/lib/jobs/boss";
import { handleImport } from "@/worker/jobs/import";
import { db, pool } from "@/db";
import { items } from "@/db/schema";
import { launch, type Page, signIn } from "../support/browser";
import { makeProject, makeUser, testPassword } from "../support/fixtures";
import { appUrl } from "../support/http";

const shots = path.join(".data", "screenshots");
const fx = (name: string) => path.resolve("tests/fixtures/imports", name);
let owner: Awaited<ReturnType<typeof makeUser>>;
let boss: PgBoss;

async function shot(page: Page, name: string) {
  await page.screenshot({ path: path.join(shots, `imports-${name}.png`), fullPage: true });
}

async function countItems(projectId: number) {
  const [row] = await db.select({ n: count() }).from(items).where(eq(items.projectId, projectId));
  return row.n;
}

beforeAll(async () => {
  mkdirSync(shots, { recursive: true });
  owner = await makeUser({ name: "Olive Owner" });
  // Consumes the `import` queue here too (as worker/index.ts does once the job is registered there).
  boss = await createWorkerBoss();
  await boss.work("import", { batchSize: 1, pollingIntervalSeconds: 0.5 }, async (jobs) => {
    for (const job of jobs) await handleImport(job.data as { importId: string });
  });
});
afterAll(async () => {
  await boss.stop({ graceful: true, timeout: 5_000 });
  await pool.end();
});

async function importThroughBrowser(files: string[] | { folder: string }, name: string, check: (page: Page) => Promise<void> = async () => undefined) {
  const { project } = await makeProject({ name: `E2E ${name}`, members: [{ userId: owner.id, role: "owner" }] });
  const { context, close } = await launch();
  try {
    const page = await context.newPage();
    await signIn(page, appUrl, owner.email, testPassword);
    await page.goto(`${appUrl}/projects/${project.id}/import`);
    await page.getByText("Items may hold personal data").waitFor();
    if (Array.isArray(files)) await page.getByLabel("Choose files").setInputFiles(files);
    else await page.getByLabel("Choose a folder").setInputFiles(files.folder);
    await page.getByText(/^Confirm the (columns|images)$/).waitFor({ timeout: 20_000 });
    await check(page);
    await shot(page, `${name}-confirm`);
    await page.getByRole("button", { name: "Import", exact: true }).click();
    await page.getByTestId("import-status").filter({ hasText: /^Imported$/ }).waitFor({ timeout: 30_000 });
    await shot(page, `${name}-done`);
    return { page, project, close };
  } catch (error) {
    await close();
    throw error;
  }
}

describe("imports from the browser", { timeout: 60_000 }, () => {
  it("imports a CSV with confirmed roles and shows it in the items table and drawer", async () => {
    const { page, project, close } = await importThroughBrowser([fx("samples.csv")], "csv", async (p) => {
      await expect(p.getByLabel("Role of sample_id").inputValue()).resolves.toBe("id");
      await expect(p.getByLabel("Role of label").inputValue()).resolves.toBe("prior_label");
      await p.getByLabel("Role of note").selectOption("text");
    });
    try {
      expect(await countItems(project.id)).toBe(6);
      await page.goto(`${appUrl}/projects/${project.id}/items`);
      await page.getByTestId("items-count").filter({ hasText: "6 items" }).waitFor();
      await shot(page, "items-table");
      await page.getByTestId("item-row").filter({ hasText: "s-002" }).click();
      await page.getByRole("dialog").getByText("murky, with silt").waitFor();
      await shot(page, "item-drawer");
    } finally {
      await close();
    }
  });

  it("imports a Parquet file", async () => {
    const { project, close } = await importThroughBrowser([fx("plants.parquet")], "parquet");
    await close();
    expect(await countItems(project.id)).toBe(4);
  });

  it("imports a folder of images with thumbnails and pixel vectors", async () => {
    const { page, project, close } = await importThroughBrowser({ folder: fx("images") }, "images", async (p) => {
      await p.getByTestId("image-summary").filter({ hasText: "4 image files" }).waitFor();
    });
    try {
      expect(await countItems(project.id)).toBe(4);
      await page.goto(`${appUrl}/projects/${project.id}/items`);
      await page.getByTestId("item-row").first().click();
      await page.getByRole("dialog").locator("img").waitFor();
      await page.waitForFunction(() => ((document.querySelector("[role=dialog] img") as HTMLImageElement | null)?.naturalWidth ?? 0) > 0, undefined, { timeout: 10_000 });
      await shot(page, "image-drawer");
    } finally {
      await close();
    }
  });
});
