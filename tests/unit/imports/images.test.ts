import fs from "node:fs";
import { zipSync } from "fflate";
import { describe, expect, it } from "vitest";
import { detectColumns } from "@/lib/imports/detect";
import { ImportFailure } from "@/lib/imports/issues";
import { decodeImage, pixelVector, pixelVectorWidth } from "@/lib/imports/pixels";
import { ArrayRow } from "@/lib/imports/row-values";
import { unsafeEntryName, unzipSafely } from "@/lib/imports/zip";

const fx = (name: string) => fs.readFileSync(`tests/fixtures/imports/${name}`);

describe("the default image vector", () => {
  it("is the 8×8 RGB thumbnail divided by 255", async () => {
    const v = await pixelVector(fx("images/red.png"));
    expect(v).toHaveLength(pixelVectorWidth);
    for (let p = 0; p < 64; p += 1) {
      expect(v[p * 3]).toBeCloseTo(220 / 255, 2);
      expect(v[p * 3 + 1]).toBeCloseTo(30 / 255, 2);
      expect(v[p * 3 + 2]).toBeCloseTo(30 / 255, 2);
    }
  });

  it("keeps the left-black, right-white layout of half.png", async () => {
    const v = await pixelVector(fx("images/half.png"));
    for (let y = 0; y < 8; y += 1) {
      for (const x of [0, 1, 2]) expect(v[(y * 8 + x) * 3]).toBeLessThan(0.05);
      for (const x of [5, 6, 7]) expect(v[(y * 8 + x) * 3]).toBeGreaterThan(0.95);
    }
  });

  it("reads PNG, JPEG and WebP and refuses other bytes", async () => {
    for (const [name, format] of [["images/red.png", "png"], ["images/green.jpg", "jpeg"], ["images/blue.webp", "webp"]] as const) {
      const d = await decodeImage(fx(name));
      expect(d.format).toBe(format);
      expect([d.width, d.height]).toEqual([40, 30]);
      expect(d.thumb.subarray(8, 12).toString()).toBe("WEBP");
    }
    await expect(decodeImage(fx("malformed/not-an-image.png"))).rejects.toThrow();
  });
});

describe("zip safety", () => {
  it("flags names that leave the archive", () => {
    for (const n of ["../a.png", "a/../../b.png", "/etc/passwd", "C:/x.png", "a\\..\\b.png"]) expect(unsafeEntryName(n)).toBe(true);
    for (const n of ["a.png", "photos/a.png", "a..b.png"]) expect(unsafeEntryName(n)).toBe(false);
  });

  it("unpacks a normal zip and skips folders and hidden files", () => {
    const bytes = zipSync({ "photos/red.png": fx("images/red.png"), "__MACOSX/._red.png": new Uint8Array(3), ".DS_Store": new Uint8Array(2) });
    const entries = unzipSafely(bytes, "x.zip");
    expect(entries.map((e) => e.name)).toEqual(["photos/red.png"]);
    expect(Buffer.from(entries[0].bytes).equals(fx("images/red.png"))).toBe(true);
  });

  it("stops path traversal and decompression bombs", () => {
    expect(() => unzipSafely(fx("malformed/traversal.zip"), "traversal.zip")).toThrow(/unsafe path \(`\.\.\/\.\.\/etc\/evil\.png`\)/);
    expect(() => unzipSafely(fx("malformed/bomb.zip"), "bomb.zip")).toThrow(/decompression bomb/);
    expect(() => unzipSafely(new Uint8Array([1, 2, 3, 4]), "junk.zip")).toThrow(ImportFailure);
  });
});

describe("column detection", () => {
  it("suggests id, numeric, vector, categorical, text and prior label", () => {
    const cols = ["sample_id", "depth_m", "emb", "site", "note", "label"];
    const rows = Array.from({ length: 12 }, (_, i) => new ArrayRow([`s-${i}`, String(i * 1.5), `[${i}, ${i + 1}]`, ["north", "south"][i % 2], `note number ${i}`, ["alpha", "beta", ""][i % 3]]));
    const got = detectColumns(cols, rows, new Set(["alpha", "beta"]));
    expect(got.map((c) => c.detected)).toEqual(["id", "numeric", "vector", "categorical", "text", "prior_label"]);
    expect(got[2].width).toBe(2);
  });
});
