// Headless Debian Chromium through playwright-core, with a fresh profile per browser.
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { type Browser, type BrowserContext, chromium, type Page } from "playwright-core";

export const chromiumArgs = ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"];

export async function launch(): Promise<{ context: BrowserContext; close: () => Promise<void> }> {
  const dir = mkdtempSync(path.join(tmpdir(), "vicinal-chromium-"));
  const context = await chromium.launchPersistentContext(dir, {
    executablePath: process.env.VICINAL_CHROMIUM ?? "/usr/bin/chromium",
    headless: true,
    args: chromiumArgs,
    viewport: { width: 1360, height: 900 },
  });
  return { context, close: () => context.close() };
}

export async function signIn(page: Page, baseUrl: string, email: string, password: string) {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"), { timeout: 20_000 });
}

export async function shot(page: Page, name: string) {
  const dir = path.join(process.env.VICINAL_TEST_DATA ?? ".data", "screenshots");
  await page.screenshot({ path: path.join(dir, `${name}.png`), fullPage: true });
}

export type { Browser, Page };
