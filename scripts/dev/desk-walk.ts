// Developer aid: label a few items at the Desk by keyboard as a demo annotator, screenshot each step.
import { launch, signIn } from "../../tests/support/browser";

async function main() {
  const [base, email, steps = "3"] = process.argv.slice(2);
  const { context, close } = await launch();
  const page = await context.newPage();
  await signIn(page, base, email, "vicinal-demo-2026");
  await page.goto(`${base}/projects/1/desk`);
  await page.waitForTimeout(1500);
  for (let i = 0; i < Number(steps); i += 1) {
    await page.screenshot({ path: `.data/screenshots/desk-walk-${i}.png`, fullPage: true });
    const hasSuggestion = await page.getByText("No suggestion for this item").count() === 0;
    await page.keyboard.press(hasSuggestion ? "Enter" : "2");
    await page.waitForTimeout(1200);
  }
  await page.screenshot({ path: `.data/screenshots/desk-walk-end.png`, fullPage: true });
  await close();
}
void main();
