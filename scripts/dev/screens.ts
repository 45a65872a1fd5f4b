// Developer aid: screenshots of the given paths as a given demo user, into .data/screenshots/.
import { launch, signIn } from "../../tests/support/browser";

async function main() {
  const [base, email, ...paths] = process.argv.slice(2);
  const { context, close } = await launch();
  const page = await context.newPage();
  if (email !== "-") await signIn(page, base, email, "vicinal-demo-2026");
  for (const p of paths) {
    await page.goto(`${base}${p}`);
    await page.waitForLoadState("load");
    await page.waitForTimeout(Number(process.env.SHOT_WAIT ?? 1200));
    const name = `${email.split("@")[0]}${p.replace(/[^a-z0-9]+/gi, "_")}`;
    await page.screenshot({ path: `.data/screenshots/${name}.png`, fullPage: true });
    console.log(name);
  }
  await close();
}

void main();
