// Demo data, invented for the demo only: a fictional water utility grading pipe-inspection readings.
// Deterministic (seeded) and idempotent: a second run changes nothing.
import { eq } from "drizzle-orm";
import { db, pool } from "@/db";
import { disputes, items, knnState, labelClasses, labels, projectMembers, projects, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { defaultProjectSettings, type FeatureSchema } from "@/lib/projects/settings";
import { mulberry32, normal, packFloat32 } from "@/lib/random";

export const demoPassword = "vicinal-demo-2026";
export const demoUsers = [
  { email: "admin@vicinal.test", name: "Ada Admin", isAdmin: true },
  { email: "owner@vicinal.test", name: "Otto Owner", isAdmin: false },
  { email: "reviewer@vicinal.test", name: "Rhea Reviewer", isAdmin: false },
  { email: "ana@vicinal.test", name: "Ana Annotator", isAdmin: false },
  { email: "ben@vicinal.test", name: "Ben Annotator", isAdmin: false },
] as const;

const features = [
  { name: "wall_thickness_mm", unit: "mm" },
  { name: "pit_depth_mm", unit: "mm" },
  { name: "ovality_pct", unit: "%" },
  { name: "joint_offset_mm", unit: "mm" },
  { name: "deposit_cover_pct", unit: "%" },
  { name: "crack_count", unit: "" },
  { name: "flow_velocity_ms", unit: "m/s" },
  { name: "age_years", unit: "years" },
];

// Class centres and spreads per feature; neighbouring grades overlap on purpose so suggestions are sometimes wrong.
const grades = [
  { name: "Sound", colour: "#5f8a3a", centre: [9.5, 0.3, 1.0, 1.0, 5, 0.2, 1.2, 12], spread: [0.6, 0.3, 0.6, 0.8, 4, 0.4, 0.3, 6] },
  { name: "Worn", colour: "#2f7f86", centre: [8.4, 1.1, 2.0, 2.5, 15, 0.8, 1.1, 28], spread: [0.7, 0.5, 0.8, 1.2, 7, 0.8, 0.3, 9] },
  { name: "Corroded", colour: "#c8922a", centre: [6.9, 2.6, 2.6, 3.0, 30, 1.5, 0.9, 41], spread: [0.8, 0.7, 0.9, 1.4, 9, 1.0, 0.3, 10] },
  { name: "Deformed", colour: "#7b5ea7", centre: [8.0, 1.3, 6.5, 7.0, 18, 2.0, 1.0, 35], spread: [0.8, 0.6, 1.5, 2.0, 8, 1.2, 0.3, 11] },
  { name: "Critical", colour: "#b4533c", centre: [5.6, 3.8, 5.0, 6.0, 45, 4.5, 0.7, 55], spread: [0.9, 0.9, 1.6, 2.2, 12, 1.8, 0.3, 12] },
];

const featureSchema: FeatureSchema = {
  source: "table",
  dimension: features.length,
  columns: features.map((f) => ({ name: f.name, kind: "numeric" as const, width: 1, unit: f.unit || undefined })),
};

async function main() {
  const [existing] = await db.select({ id: users.id }).from(users).where(eq(users.email, "owner@vicinal.test"));
  if (existing) {
    console.error("[seed] demo already present; nothing to do");
    return;
  }
  const rand = mulberry32(20261201);
  const passwordHash = await hashPassword(demoPassword);
  const projectId = await db.transaction(async (tx) => {
    const u = await tx
      .insert(users)
      .values(demoUsers.map((d) => ({ email: d.email, name: d.name, isAdmin: d.isAdmin, passwordHash, emailVerified: new Date() })))
      .returning();
    const byEmail = Object.fromEntries(u.map((x) => [x.email, x]));
    const [project] = await tx
      .insert(projects)
      .values({
        name: "Pipe inspection grades",
        description:
          "Readings from an in-pipe inspection robot on a (fictional) municipal water network. Grade each pipe segment from its eight sensor measurements: Sound, Worn, Corroded, Deformed or Critical.",
        settings: { ...defaultProjectSettings, overlap: 2, k: 7, blindShare: 0.1, controlRate: 0.05 },
        featureSchema,
        createdBy: byEmail["owner@vicinal.test"].id,
      })
      .returning();
    await tx.insert(knnState).values({ projectId: project.id });
    await tx.insert(projectMembers).values([
      { projectId: project.id, userId: byEmail["owner@vicinal.test"].id, role: "owner" },
      { projectId: project.id, userId: byEmail["reviewer@vicinal.test"].id, role: "reviewer" },
      { projectId: project.id, userId: byEmail["ana@vicinal.test"].id, role: "annotator" },
      { projectId: project.id, userId: byEmail["ben@vicinal.test"].id, role: "annotator" },
    ]);
    const classes = await tx
      .insert(labelClasses)
      .values(grades.map((g, i) => ({ projectId: project.id, name: g.name, colour: g.colour, keyHint: i + 1, position: i })))
      .returning();

    const n = 640;
    const rows = [];
    const truth: number[] = [];
    for (let i = 0; i < n; i += 1) {
      const g = Math.min(grades.length - 1, Math.floor(rand() ** 1.3 * grades.length));
      truth.push(g);
      const v = grades[g].centre.map((c, j) => {
        const x = c + normal(rand) * grades[g].spread[j];
        return j === 5 ? Math.max(0, Math.round(x)) : Math.max(0, Number(x.toFixed(2)));
      });
      const fields = Object.fromEntries(features.map((f, j) => [f.name, v[j]]));
      const segment = `SEG-${String(1000 + i).padStart(5, "0")}`;
      rows.push({
        projectId: project.id,
        externalId: segment,
        fields: { ...fields, district: ["Northbank", "Millbrook", "Harrow Flats", "Old Quay"][i % 4] },
        vector: packFloat32(v),
        isControl: i % 20 === 7,
        knownClassId: i % 20 === 7 ? classes[g].id : null,
        isBlind: rand() < 0.1,
        status: i % 20 === 7 ? ("control" as const) : ("unlabelled" as const),
      });
    }
    const inserted = await tx.insert(items).values(rows).returning({ id: items.id });

    // A third of the items already carry two labels from the annotators; a noisy copy of the truth makes some disagree.
    const ana = byEmail["ana@vicinal.test"].id;
    const ben = byEmail["ben@vicinal.test"].id;
    const labelRows = [];
    const now = Date.now();
    for (let i = 0; i < 220; i += 1) {
      if (rows[i].isControl) continue;
      const g = truth[i];
      const noisy = (p: number) => (rand() < p ? Math.max(0, Math.min(grades.length - 1, g + (rand() < 0.5 ? -1 : 1))) : g);
      const a = noisy(0.14);
      const b = noisy(0.18);
      const at = new Date(now - 86_400_000 - (220 - i) * 85 * 60 * 1000);
      labelRows.push({ projectId: project.id, itemId: inserted[i].id, annotatorId: ana, classId: classes[a].id, clientSubmissionId: crypto.randomUUID(), createdAt: at });
      labelRows.push({ projectId: project.id, itemId: inserted[i].id, annotatorId: ben, classId: classes[b].id, clientSubmissionId: crypto.randomUUID(), createdAt: new Date(at.getTime() + 90_000) });
      if (a === b) {
        await tx.update(items).set({ status: "agreed", labelCount: 2, finalClassId: classes[a].id, finalSource: "agreed", decidedAt: at }).where(eq(items.id, inserted[i].id));
      } else {
        await tx.update(items).set({ status: "disputed", labelCount: 2 }).where(eq(items.id, inserted[i].id));
        await tx.insert(disputes).values({ projectId: project.id, itemId: inserted[i].id, reason: "disagreement", openedAt: at });
      }
    }
    await tx.insert(labels).values(labelRows);
    return project.id;
  });
  // Vote shares of the unlabelled pool, so the Desk's uncertainty order works from the first item.
  const { runPoolRank } = await import("@/lib/suggest/pool-rank");
  await runPoolRank(projectId);
  console.error("[seed] demo project, users and labels created; pool ranked");
}

main()
  .then(() => pool.end())
  .catch(async (error) => {
    console.error(error);
    await pool.end();
    process.exit(1);
  });
