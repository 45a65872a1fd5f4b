// The API page as a signed-in user reads it, in headless Chromium.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launch, shot, signIn } from "../support/browser";
import { makeUser, testPassword } from "../support/fixtures";
import { appUrl } from "../support/http";

let browser: Awaited<ReturnType<typeof launch>>;

beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

describe("the API page", () => {
  it("is reached from the top bar and shows each operation with role, fields, errors and a curl example", async () => {
    const user = await makeUser({ name: "Robin Reader" });
    const page = await browser.context.newPage();
    await signIn(page, appUrl, user.email, testPassword);
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "API" }).click();
    await page.waitForURL(/\/api-docs$/);
    await page.getByRole("heading", { name: "REST API v1" }).waitFor();
    await page.screenshot({ path: `${process.env.VICINAL_TEST_DATA ?? ".data"}/screenshots/api-docs-top.png` });
    for (const tag of ["Projects", "Items", "Labelling", "Editions"]) await expect(page.getByRole("heading", { name: tag, exact: true }).isVisible()).resolves.toBe(true);

    const batch = page.locator("details#postCreateItems");
    await batch.locator("summary").click();
    await expect(batch.getByText("owner", { exact: true }).isVisible()).resolves.toBe(true);
    await expect(batch.getByText("items[].id").isVisible()).resolves.toBe(true);
    await expect(batch.getByText("too_large:batch").isVisible()).resolves.toBe(true);
    const curl = await batch.locator("pre code").innerText();
    expect(curl).toContain('-H "Authorization: Bearer $VICINAL_TOKEN"');
    expect(curl).toContain("/api/v1/projects/$PROJECT_ID/items");

    const sync = page.locator("details#getSyncLabelsSinceACursor");
    await sync.locator("summary").click();
    await expect(sync.getByText("settled", { exact: false }).first().isVisible()).resolves.toBe(true);
    await batch.scrollIntoViewIfNeeded();
    await page.screenshot({ path: `${process.env.VICINAL_TEST_DATA ?? ".data"}/screenshots/api-docs-items.png` });
    await shot(page, "api-docs");
    await page.close();
  });

  it("sends a signed-out visitor to sign-in", async () => {
    const page = await browser.context.newPage();
    await page.context().clearCookies();
    await page.goto(`${appUrl}/api-docs`);
    await page.waitForURL(/\/sign-in/);
    await page.close();
  });
});
