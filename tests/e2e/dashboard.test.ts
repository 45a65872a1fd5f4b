// The project dashboard (the Overview) as an owner and a viewer see it, in headless Chromium. Invented demo data.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { type ItemStatus, labelClasses } from "@/db/schema";
import { createRandom } from "@/lib/agreement";
import { launch, shot, signIn } from "../support/browser";
import { makeProject, makeUser, testPassword } from "../support/fixtures";
import { appUrl } from "../support/http";
import { type ItemSpec, type LabelSpec, insertDisputes, insertItems, insertLabels, insertLeases } from "../integration/dashboard/world";

let browser: Awaited<ReturnType<typeof launch>>;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const DAY = 86_400_000;

/** Street-tree photos: four classes, one of them rare; four annotators who mostly agree; a few weeks of work. */
async function demoProject() {
  const owner = await makeUser({ name: "Orla Owner" });
  const viewer = await makeUser({ name: "Vic Viewer" });
  const raters = await Promise.all(["Ada Reyes", "Bo Lindqvist", "Chidi Okafor", "Dana Weiss"].map((name) => makeUser({ name })));
  const { project, classes } = await makeProject({
    name: "Street trees",
    classes: ["plane", "lime", "oak", "ginkgo"],
    settings: { overlap: 2, blindShare: 0.2, controlRate: 0.05 },
    members: [{ userId: owner.id, role: "owner" }, { userId: viewer.id, role: "viewer" }, ...raters.map((r) => ({ userId: r.id, role: "annotator" as const }))],
  });
  const colours = ["#2b7a73", "#d9a441", "#8a5a9e", "#c4553a"];
  for (const [i, c] of classes.entries()) await db.update(labelClasses).set({ colour: colours[i] }).where(eq(labelClasses.id, c.id));
  const ids = classes.map((c) => c.id);
  const random = createRandom(21);
  const n = 420;
  const truth = Array.from({ length: n }, () => {
    const r = random();
    return r < 0.46 ? 0 : r < 0.78 ? 1 : r < 0.975 ? 2 : 3;
  });
  const status: ItemStatus[] = truth.map((_, i) => (i % 20 === 7 ? "control" : i < 250 ? (i % 13 === 5 ? "disputed" : i % 17 === 3 ? "ruled" : "agreed") : i < 300 ? "in_progress" : "unlabelled"));
  const specs: ItemSpec[] = status.map((s, i) => ({
    status: s,
    finalClassId: s === "agreed" || s === "ruled" || s === "control" ? ids[truth[i]] : null,
    finalSource: s === "agreed" ? "agreed" : s === "ruled" ? "ruling" : s === "control" ? "control" : null,
    leasedFor: s === "unlabelled" && i % 9 === 0 ? 1 : null,
  }));
  const itemIds = await insertItems(project.id, specs);
  await insertLeases(project.id, itemIds, specs, raters.map((r) => r.id));
  const labels: LabelSpec[] = [];
  itemIds.forEach((item, i) => {
    if (status[i] === "unlabelled") return;
    const count = status[i] === "in_progress" ? 1 : 2;
    const start = Math.floor(random() * raters.length);
    const age = (i / n) * 26 + random() * 3;
    for (let j = 0; j < count; j += 1) {
      const rater = raters[(start + j) % raters.length];
      const blind = i % 5 === 0;
      const top = random() < 0.8 ? truth[i] : Math.floor(random() * 4);
      const took = !blind && top === truth[i] && random() < 0.75;
      const disagree = status[i] === "disputed" && j === 1;
      const cls = took ? top : disagree ? (truth[i] + 1) % 4 : random() < 0.9 ? truth[i] : Math.floor(random() * 4);
      labels.push({ item, annotator: rater.id, classId: ids[cls], suggestion: blind ? "hidden" : "shown", topClassId: ids[top], took, undone: false, createdAt: new Date(Date.now() - (26 - age) * DAY - random() * DAY * 0.5 - j * 3600_000) });
    }
  });
  await insertLabels(project.id, labels);
  const open = itemIds.filter((_, i) => status[i] === "disputed");
  await insertDisputes(project.id, open.map((item, i) => ({ item, reason: i % 4 === 0 ? "doubt" : "disagreement", status: "open", ageHours: [3, 20, 40, 90, 130, 300, 800][i % 7] })));
  return { owner, viewer, raters, project };
}

describe("the project dashboard", () => {
  it("shows the owner progress, agreement with band and interval, disputes, balance, suggestion use and daily work", async () => {
    const { owner, raters, project } = await demoProject();
    const page = await browser.context.newPage();
    await page.context().clearCookies();
    await signIn(page, appUrl, owner.email, testPassword);
    await page.goto(`${appUrl}/projects/${project.id}`);
    await page.getByRole("heading", { name: "Street trees", level: 1 }).waitFor();
    await page.getByRole("heading", { name: "Agreement beyond chance" }).waitFor({ timeout: 20_000 });
    await page.locator(".recharts-errorBar").first().waitFor();
    const main = page.locator("main").last();
    const text = (await main.textContent()) ?? "";
    expect(text).toMatch(/of \d+ items to label have a final label/);
    expect(text).toMatch(/α = \d\.\d\d ?95% CI \d\.\d\d–\d\.\d\d/);
    expect(text).toMatch(/(slight|fair|moderate|substantial|almost perfect) agreement \(α = /);
    expect(text).toContain("Rare: ginkgo.");
    expect(text).toContain("common practice, not a standard");
    expect(text).toMatch(/Took \d+% of shown suggestions, overrode \d+%/);
    expect(text).toMatch(/\d+ open; the oldest has waited/);
    for (const r of raters) expect(text).toContain(r.name!);
    await expect(page.getByText("Show as table").count()).resolves.toBe(6);
    await expect(page.getByRole("img", { name: /Agreement coefficients with bootstrap 95% intervals.*Krippendorff.s alpha, all items: \d\.\d\d, 95% CI/ }).count()).resolves.toBe(1);
    await expect(page.getByText("Overlap", { exact: true }).count()).resolves.toBe(1);

    const balance = page.locator("section", { has: page.getByRole("heading", { name: "Class balance of final labels" }) });
    await balance.getByText("Show as table").click();
    const table = balance.getByRole("table", { name: /Final labels per class/ });
    const heads = await table.getByRole("rowheader").allTextContents();
    expect(heads.map((h) => h.replace(/rare$/, ""))).toEqual(["plane", "lime", "oak", "ginkgo"]);
    expect(heads.map((h) => h.endsWith("rare"))).toEqual([false, false, false, true]);
    await shot(page, "dashboard");
    await page.close();
  });

  it("numbers the annotators for a viewer and keeps the denied notice", async () => {
    const { viewer, raters, project } = await demoProject();
    const page = await browser.context.newPage();
    await page.context().clearCookies();
    await signIn(page, appUrl, viewer.email, testPassword);
    await page.goto(`${appUrl}/projects/${project.id}?denied=owner`);
    await page.getByText("That screen needs the owner role in this project.").waitFor();
    await page.getByRole("heading", { name: /Labels per annotator per day/ }).waitFor({ timeout: 20_000 });
    await page.getByRole("heading", { name: "Agreement beyond chance" }).waitFor({ timeout: 20_000 });
    await page.locator(".recharts-errorBar").first().waitFor();
    const text = (await page.locator("main").last().textContent()) ?? "";
    expect(text).toContain("Annotator 1");
    for (const r of raters) expect(text).not.toContain(r.name!);
    await shot(page, "dashboard-viewer");
    await page.close();
  });
});
