// The Agreement page as owners and viewers see it, in headless Chromium.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createRandom } from "@/lib/agreement";
import { launch, shot, signIn } from "../support/browser";
import { makeProject, makeUser, testPassword } from "../support/fixtures";
import { appUrl } from "../support/http";
import { insertItems, insertLabels, seededLabels } from "../integration/agreement-server/world";

let browser: Awaited<ReturnType<typeof launch>>;

beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function demoProject() {
  const owner = await makeUser({ name: "Orla Owner" });
  const viewer = await makeUser({ name: "Vic Viewer" });
  const raters = await Promise.all(["Ada Reyes", "Bo Lindqvist", "Chidi Okafor", "Dana Weiss"].map((name) => makeUser({ name })));
  const { project, classes } = await makeProject({
    name: "Seabird photos",
    classes: ["gull", "tern", "skua", "petrel"],
    members: [{ userId: owner.id, role: "owner" }, { userId: viewer.id, role: "viewer" }, ...raters.map((r) => ({ userId: r.id, role: "annotator" as const }))],
  });
  const classIds = classes.map((c) => c.id);
  const random = createRandom(11);
  const n = 160;
  const truth = Array.from({ length: n }, () => Math.floor(random() * 4));
  const blind = Array.from({ length: n }, (_, i) => i % 5 === 0);
  const control = Array.from({ length: n }, (_, i) => i % 9 === 4);
  const itemIds = await insertItems(
    project.id,
    truth.map((t, i) => ({ externalId: `photo-${i}`, isBlind: blind[i], isControl: control[i], knownClassId: control[i] ? classIds[t] : null, finalClassId: i % 6 ? classIds[t] : null })),
  );
  await insertLabels(project.id, seededLabels({ seed: 11, itemIds, blind, annotators: raters.map((r) => r.id), classIds, truth }));
  return { owner, viewer, raters, project };
}

describe("the Agreement page", () => {
  it("shows coefficients with intervals and bands, the pair matrix, tables and the suggestion caution to the owner", async () => {
    const { owner, raters, project } = await demoProject();
    const page = await browser.context.newPage();
    await page.context().clearCookies();
    await signIn(page, appUrl, owner.email, testPassword);
    await page.goto(`${appUrl}/projects/${project.id}/agreement`);
    await page.getByRole("heading", { name: "Agreement", level: 1 }).waitFor();
    const main = page.locator("main").last();
    const text = (await main.textContent()) ?? "";
    expect(text).toMatch(/Krippendorff's alpha/);
    expect(text).toMatch(/95% CI −?\d\.\d\d(–| to )−?\d\.\d\d/);
    expect(text).toMatch(/(slight|fair|moderate|substantial|almost perfect) agreement \(α = /);
    expect(text).toContain("is not to be read alone");
    expect(text).toContain("Suggestions anchor judgement");
    const matrix = page.getByRole("table", { name: /Cohen's kappa between each pair/ });
    for (const r of raters) await expect(matrix.getByRole("rowheader", { name: r.name! }).count()).resolves.toBe(1);
    await expect(matrix.getByText(/^n = \d+$/).count()).resolves.toBe(12);
    await expect(page.getByRole("table", { name: /Agreement per class/ }).getByRole("rowheader").count()).resolves.toBe(4);
    await expect(page.getByRole("img", { name: /Agreement coefficients with bootstrap 95% intervals/ }).count()).resolves.toBe(1);
    await shot(page, "agreement");

    await page.getByRole("link", { name: /Blind items only/ }).click();
    await page.waitForURL(/scope=blind/);
    await page.getByText("only items labelled with the suggestion hidden").waitFor();
    await shot(page, "agreement-blind");
    await page.close();
  });

  it("numbers the annotators for a viewer", async () => {
    const { viewer, raters, project } = await demoProject();
    const page = await browser.context.newPage();
    await page.context().clearCookies();
    await signIn(page, appUrl, viewer.email, testPassword);
    await page.goto(`${appUrl}/projects/${project.id}/agreement`);
    await page.getByRole("heading", { name: "Agreement", level: 1 }).waitFor();
    const text = (await page.locator("main").last().textContent()) ?? "";
    expect(text).toContain("Annotator 1");
    for (const r of raters) expect(text).not.toContain(r.name!);
    await page.close();
  });

  it("says so when there are too few overlapping labels", async () => {
    const owner = await makeUser();
    const solo = await makeUser({ name: "Solo Rater" });
    const { project, classes } = await makeProject({ members: [{ userId: owner.id, role: "owner" }] });
    const itemIds = await insertItems(project.id, [{ externalId: "a" }, { externalId: "b" }]);
    await insertLabels(project.id, itemIds.map((item) => ({ item, annotator: solo.id, classId: classes[0].id, suggestion: "none" as const, topClassId: null, took: false })));
    const page = await browser.context.newPage();
    await page.context().clearCookies();
    await signIn(page, appUrl, owner.email, testPassword);
    await page.goto(`${appUrl}/projects/${project.id}/agreement`);
    await page.getByText("Too few overlapping labels yet").waitFor();
    await shot(page, "agreement-too-few");
    await page.close();
  });
});
