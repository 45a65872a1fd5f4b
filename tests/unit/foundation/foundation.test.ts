import { describe, expect, it } from "vitest";
import { roleAtLeast } from "@/lib/auth/roles";
import { hashSecret, newSecret, sameHash } from "@/lib/auth/tokens";
import { AppError, isDatabaseUnavailable } from "@/lib/errors";
import { decodeCursor, encodeCursor } from "@/lib/http/cursor";
import { defaultProjectSettings, projectSettingsSchema } from "@/lib/projects/settings";
import { mulberry32, packFloat32, unpackFloat32 } from "@/lib/random";

describe("roles nest", () => {
  it("owner ⊇ reviewer ⊇ annotator ⊇ viewer", () => {
    expect(roleAtLeast("owner", "reviewer")).toBe(true);
    expect(roleAtLeast("reviewer", "annotator")).toBe(true);
    expect(roleAtLeast("annotator", "reviewer")).toBe(false);
    expect(roleAtLeast("viewer", "annotator")).toBe(false);
    expect(roleAtLeast(null, "viewer")).toBe(false);
  });
});

describe("secrets", () => {
  it("are random and compared by hash", () => {
    const a = newSecret("vcn_");
    const b = newSecret("vcn_");
    expect(a).not.toBe(b);
    expect(a.startsWith("vcn_")).toBe(true);
    expect(sameHash(hashSecret(a), hashSecret(a))).toBe(true);
    expect(sameHash(hashSecret(a), hashSecret(b))).toBe(false);
  });
});

describe("paging cursors", () => {
  it("round-trip within their scope and reject tampering or another scope", () => {
    const c = encodeCursor("items:1", { id: 42 });
    expect(decodeCursor("items:1", c)).toEqual({ id: 42 });
    expect(() => decodeCursor("items:2", c)).toThrow(AppError);
    const [body, mac] = c.split(".");
    const forged = `${Buffer.from(JSON.stringify({ id: 1 })).toString("base64url")}.${mac}`;
    expect(() => decodeCursor("items:1", forged)).toThrow(/not valid/);
    expect(() => decodeCursor("items:1", body)).toThrow(/malformed/);
  });
});

describe("errors", () => {
  it("map kinds to statuses", () => {
    expect(new AppError("not_found:item", "x").status).toBe(404);
    expect(new AppError("conflict:ruling", "x").status).toBe(409);
    expect(new AppError("rate_limited:auth", "x").status).toBe(429);
  });
  it("recognise a database that is down", () => {
    expect(isDatabaseUnavailable(Object.assign(new Error("connect ECONNREFUSED 127.0.0.1:5432"), { code: "ECONNREFUSED" }))).toBe(true);
    expect(isDatabaseUnavailable({ code: "57P01", message: "terminating connection due to administrator command" })).toBe(true);
    expect(isDatabaseUnavailable(new Error("duplicate key"))).toBe(false);
  });
});

describe("project settings", () => {
  it("defaults are valid and bounds are enforced", () => {
    expect(projectSettingsSchema.parse(defaultProjectSettings)).toEqual(defaultProjectSettings);
    expect(projectSettingsSchema.safeParse({ ...defaultProjectSettings, overlap: 6 }).success).toBe(false);
    expect(projectSettingsSchema.safeParse({ ...defaultProjectSettings, blindShare: 1.5 }).success).toBe(false);
  });
});

describe("packed vectors and the seeded generator", () => {
  it("pack float32 losslessly and repeat draws for a seed", () => {
    const v = [1.5, -2.25, Number.NaN, 1e-3];
    const back = Array.from(unpackFloat32(packFloat32(v)));
    expect(back[0]).toBe(1.5);
    expect(Number.isNaN(back[2])).toBe(true);
    expect(back[3]).toBeCloseTo(1e-3, 6);
    const a = mulberry32(7);
    const b = mulberry32(7);
    expect([a(), a(), a()]).toEqual([b(), b(), b()]);
  });
});
