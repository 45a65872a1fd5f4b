// The Editions page in headless Chromium: the owner publishes, downloads the CSV through its presigned link, publishes again after a ruling and opens the diff.
import { and, desc, eq } from "drizzle-orm";
import Papa from "papaparse";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { editions, items } from "@/db/schema";
import { type Page, launch, shot, signIn } from "../support/browser";
import { testPassword } from "../support/fixtures";
import { appUrl } from "../support/http";
import { extId, makeEditionWorld, runEditionJob } from "../integration/editions/world";

let browser: Awaited<ReturnType<typeof launch>>;
let w: Awaited<ReturnType<typeof makeEditionWorld>>;

beforeAll(async () => {
  browser = await launch();
  w = await makeEditionWorld();
});
afterAll(async () => {
  await browser?.close();
});

/** Clicks publish, then builds the new edition (in this process when no worker has taken it) and waits for the page to show it. */
async function publishFromPage(page: Page, number: number) {
  await page.getByRole("button", { name: `Publish edition ${number}` }).click();
  await page.getByRole("button", { name: `Edition ${number}`, exact: true }).waitFor();
  const [row] = await db.select().from(editions).where(eq(editions.projectId, w.project.id)).orderBy(desc(editions.number)).limit(1);
  expect(row.number).toBe(number);
  await runEditionJob(row.id);
  await page.getByRole("heading", { name: `Edition ${number}`, exact: true }).waitFor();
  await page.getByRole("button", { name: "Download CSV" }).waitFor({ timeout: 15_000 });
  return row.id;
}

describe("the Editions page", () => {
  it("lets the owner publish, download, publish again and compare", async () => {
    const page = await browser.context.newPage();
    await page.context().clearCookies();
    await signIn(page, appUrl, w.users.owner.email, testPassword);
    await page.goto(`${appUrl}/projects/${w.project.id}/editions`);
    await page.getByRole("heading", { name: "Editions", level: 1 }).waitFor();
    expect(await page.getByText("Editions record who labelled what").count()).toBe(1);
    await page.getByText("No editions yet").waitFor();
    await page.getByLabel(/Add a train \/ validation \/ test split/).check();
    await shot(page, "editions-1-publish-form");

    await publishFromPage(page, 1);
    const main = page.locator("main").last();
    await expect(main.getByText("published").count()).resolves.toBeGreaterThan(0);
    const text = (await main.textContent()) ?? "";
    expect(text).toContain("Krippendorff's α");
    expect(text).toMatch(/sha256 [0-9a-f]{64}/);
    expect(text).toContain("70/15/15, seed 1");
    await shot(page, "editions-2-published");

    const signed = page.waitForRequest((r) => r.url().includes("X-Amz-Signature") && r.url().includes(".csv"));
    await page.getByRole("button", { name: "Download CSV" }).click();
    const url = (await signed).url();
    const res = await fetch(url);
    expect(res.status).toBe(200);
    const rows = Papa.parse<Record<string, string>>(await res.text(), { header: true, skipEmptyLines: true }).data;
    expect(rows.length).toBe(22);
    expect(rows.find((r) => r.external_id === extId(1))?.final_label).toBe("beta");

    await page.goto(`${appUrl}/projects/${w.project.id}/editions`);
    await db.update(items).set({ finalClassId: w.classes[0].id, finalSource: "ruling", status: "ruled" }).where(and(eq(items.projectId, w.project.id), eq(items.externalId, extId(1))));
    await publishFromPage(page, 2);
    await page.getByRole("button", { name: "Compare", exact: true }).click();
    await page.getByRole("cell", { name: extId(1) }).waitFor();
    const changes = (await page.getByLabel("Changes").textContent()) ?? "";
    expect(changes).toMatch(/0\s*added/);
    expect(changes).toMatch(/0\s*removed/);
    expect(changes).toMatch(/1\s*relabelled/);
    expect(changes).toMatch(/21\s*unchanged/);
    await page.getByRole("button", { name: "Download the list of changes (CSV)" }).scrollIntoViewIfNeeded();
    await shot(page, "editions-3-diff");
    await page.close();
  });

  it("shows viewers the editions without the publish form", async () => {
    const page = await browser.context.newPage();
    await page.context().clearCookies();
    await signIn(page, appUrl, w.users.viewer.email, testPassword);
    await page.goto(`${appUrl}/projects/${w.project.id}/editions`);
    await page.getByRole("button", { name: "Edition 2", exact: true }).waitFor();
    expect(await page.getByRole("button", { name: /Publish edition/ }).count()).toBe(0);
    await page.getByRole("button", { name: "Download Parquet" }).waitFor();
    await shot(page, "editions-4-viewer");
    await page.close();
  });
});
