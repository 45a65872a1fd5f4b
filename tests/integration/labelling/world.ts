// Test worlds for the labelling loop: real rows through the project's own fixtures, items with feature vectors.
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { items, labelClasses, projects, type ProjectRole } from "@/db/schema";
import { type FeatureSchema, labelPalette, type ProjectSettings } from "@/lib/projects/settings";
import { mulberry32, packFloat32 } from "@/lib/random";
import { makeProject, makeToken, makeUser } from "../../support/fixtures";

const schema: FeatureSchema = {
  source: "table",
  dimension: 3,
  columns: [
    { name: "length_mm", kind: "numeric", width: 1, unit: "mm" },
    { name: "weight_g", kind: "numeric", width: 1, unit: "g" },
    { name: "hue", kind: "numeric", width: 1 },
  ],
};

export type Member = { id: string; name: string | null; token: string };

export async function member(role: ProjectRole, name?: string) {
  const user = await makeUser({ name });
  const { secret } = await makeToken(user.id);
  return { user, role, token: secret };
}

/** A project with `n` items in three loose clusters (invented data); every `controlEvery`-th item is a control item. */
export async function makeLabellingWorld(opts: { n: number; settings?: Partial<ProjectSettings>; members: Array<{ user: { id: string }; role: ProjectRole }>; controlEvery?: number; blind?: number[]; seed?: number }) {
  const { project, classes } = await makeProject({ settings: { queueOrder: "import_order", controlRate: 0, blindShare: 0, ...opts.settings }, members: opts.members.map((m) => ({ userId: m.user.id, role: m.role })) });
  await db.update(projects).set({ featureSchema: schema }).where(eq(projects.id, project.id));
  for (const [i, c] of classes.entries()) {
    c.colour = labelPalette[i % labelPalette.length].value;
    await db.update(labelClasses).set({ colour: c.colour }).where(eq(labelClasses.id, c.id));
  }
  const rand = mulberry32(opts.seed ?? 7);
  const rows = Array.from({ length: opts.n }, (_, i) => {
    const g = i % 3;
    const v = [10 + g * 5 + rand() * 3, 100 + g * 40 + rand() * 20, g + rand()];
    const control = opts.controlEvery ? i % opts.controlEvery === opts.controlEvery - 1 : false;
    return {
      projectId: project.id,
      externalId: `IT-${String(i).padStart(4, "0")}`,
      fields: { length_mm: v[0], weight_g: v[1], hue: v[2], batch: `B${i % 4}` },
      vector: packFloat32(v),
      isControl: control,
      knownClassId: control ? classes[g].id : null,
      isBlind: opts.blind?.includes(i) ?? false,
      status: control ? ("control" as const) : ("unlabelled" as const),
    };
  });
  const inserted = await db.insert(items).values(rows).returning();
  return { project, classes, items: inserted.sort((a, b) => a.seq - b.seq) };
}
