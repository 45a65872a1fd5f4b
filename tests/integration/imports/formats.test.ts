// Every format through the real import function into real PostgreSQL and the test bucket.
import { and, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { imports, items, projects } from "@/db/schema";
import { unpackVector } from "@/lib/imports/copy-binary";
import { runImport } from "@/lib/imports/run";
import { headObject } from "@/lib/storage/s3";
import { makeProject } from "@/tests/support/fixtures";
import { importFixtures, itemCount, uploadFixture } from "./helpers";

async function item(projectId: number, externalId: string) {
  const [row] = await db.select().from(items).where(and(eq(items.projectId, projectId), eq(items.externalId, externalId)));
  return row;
}
const vec = (row: { vector: Buffer | null }) => Array.from(unpackVector(row.vector!));

describe("table imports", () => {
  it("imports a CSV with detected roles, quoted fields and prior labels, then skips it on re-import", async () => {
    const { project, classes } = await makeProject();
    const first = await importFixtures(project.id, ["samples.csv"]);
    expect(first.status).toBe("succeeded");
    expect([first.itemsCreated, first.itemsSkipped]).toEqual([6, 0]);
    const s2 = await item(project.id, "s-002");
    expect(vec(s2)).toEqual([8.25, Math.fround(34.9)]);
    expect(s2.fields).toEqual({ site: "south", note: "murky, with silt" });
    expect(s2.priorClassId).toBe(classes.find((c) => c.name === "beta")!.id);
    expect((await item(project.id, "s-003")).fields.note).toBe("two\nlines");
    expect((await item(project.id, "s-003")).priorClassId).toBeNull();
    const [p] = await db.select().from(projects).where(eq(projects.id, project.id));
    expect(p.featureSchema).toEqual({
      columns: [
        { name: "depth_m", kind: "numeric", width: 1 },
        { name: "salinity", kind: "numeric", width: 1 },
        { name: "site", kind: "categorical", width: 0, categories: ["east", "north", "south"] },
      ],
      dimension: 2,
      source: "table",
    });
    const again = await importFixtures(project.id, ["samples.csv"]);
    expect(again.status).toBe("succeeded");
    expect([again.itemsCreated, again.itemsSkipped]).toEqual([0, 6]);
    expect(await itemCount(project.id)).toBe(6);
    const seqs = (await db.select({ e: items.externalId, s: items.seq }).from(items).where(eq(items.projectId, project.id)).orderBy(items.seq)).map((r) => r.e);
    expect(seqs).toEqual(["s-001", "s-002", "s-003", "s-004", "s-005", "s-006"]);
  });

  it("holds a later import to the project's feature schema", async () => {
    const { project } = await makeProject();
    await importFixtures(project.id, ["samples.csv"]);
    const other = await importFixtures(project.id, ["plants.parquet"]);
    expect(other.status).toBe("failed");
    expect(other.message).toMatch(/feature schema is fixed by its first import/);
    expect(await itemCount(project.id)).toBe(6);
  });

  it("reads semicolon (with BOM, CRLF and decimal commas), tab and pipe files", async () => {
    for (const [file, first, expected] of [["samples-semicolon.csv", "s-101", [1.5, 2]], ["samples.tsv", "t-1", [1, 2]], ["samples-pipe.csv", "p-1", [1, 2]]] as const) {
      const { project } = await makeProject();
      const imp = await importFixtures(project.id, [file]);
      expect(imp.status, `${file}: ${JSON.stringify(imp.errors)}`).toBe("succeeded");
      expect(vec(await item(project.id, first))).toEqual(expected);
    }
  });

  it("imports Parquet", async () => {
    const { project } = await makeProject();
    const imp = await importFixtures(project.id, ["plants.parquet"]);
    expect(imp.status).toBe("succeeded");
    expect(imp.itemsCreated).toBe(4);
    const q3 = await item(project.id, "q-3");
    expect(vec(q3)).toEqual([3.25, 12.5]);
    expect(q3.fields).toEqual({ kind: "leaf" });
  });

  it("imports JSON Lines with an array vector column", async () => {
    const { project } = await makeProject();
    const imp = await importFixtures(project.id, ["embeddings.jsonl"]);
    expect(imp.status).toBe("succeeded");
    expect(vec(await item(project.id, "e-b"))).toEqual([1, 1.5, 2, 0]);
  });

  it("cancels to zero items", async () => {
    const { project } = await makeProject();
    const up = await uploadFixture(project.id, "samples.csv");
    const [imp] = await db.insert(imports).values({ projectId: project.id, uploadIds: [up.id], format: "csv", options: { columns: [{ name: "sample_id", role: "id" }, { name: "depth_m", role: "numeric" }] }, status: "running", cancelRequested: true }).returning();
    await runImport(imp.id);
    const [done] = await db.select().from(imports).where(eq(imports.id, imp.id));
    expect(done.status).toBe("cancelled");
    expect(await itemCount(project.id)).toBe(0);
  });
});

describe("image imports", () => {
  it("makes an item, a thumbnail and the 192-number pixel vector per image", async () => {
    const { project } = await makeProject();
    const imp = await importFixtures(project.id, ["images/red.png", "images/green.jpg", "images/blue.webp", "images/half.png"], { format: "images" });
    expect(imp.status, JSON.stringify(imp.errors)).toBe("succeeded");
    expect(imp.itemsCreated).toBe(4);
    const red = await item(project.id, "red.png");
    expect(vec(red)).toHaveLength(192);
    expect(vec(red)[0]).toBeCloseTo(220 / 255, 2);
    expect(red.fields).toEqual({ file: "red.png", width: 40, height: 30, format: "png" });
    expect(Number((await headObject(red.thumbKey!)).ContentLength)).toBeGreaterThan(0);
    expect((await headObject(red.imageKey!)).ContentType).toBe("image/png");
    const [p] = await db.select().from(projects).where(eq(projects.id, project.id));
    expect(p.featureSchema?.source).toBe("image");
  });

  it("unpacks a zip", async () => {
    const { project } = await makeProject();
    const imp = await importFixtures(project.id, ["images.zip"], { format: "images" });
    expect(imp.status).toBe("succeeded");
    expect((await db.select({ e: items.externalId }).from(items).where(eq(items.projectId, project.id))).map((r) => r.e).sort()).toEqual(["photos/green.jpg", "photos/red.png"]);
  });

  it("takes vectors from an embeddings file keyed by file name", async () => {
    const { project } = await makeProject();
    const imp = await importFixtures(project.id, ["images/red.png", "images/green.jpg"], {
      format: "images",
      embeddings: "image-embeddings.csv",
      embeddingsColumns: [{ name: "file", role: "id" }, { name: "embedding", role: "vector", width: 3 }],
    });
    expect(imp.status, JSON.stringify(imp.errors)).toBe("succeeded");
    expect(vec(await item(project.id, "red.png"))).toEqual([1, 0, 0]);
    expect(vec(await item(project.id, "green.jpg"))).toEqual([0, 1, 0]);
    const [p] = await db.select().from(projects).where(eq(projects.id, project.id));
    expect(p.featureSchema).toMatchObject({ dimension: 3, source: "embedding" });
  });
});

