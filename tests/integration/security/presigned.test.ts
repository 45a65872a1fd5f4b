// Presigned URLs: short-lived (X-Amz-Expires ≤ PRESIGN_SECONDS), bound to one object key and one method.
import { describe, expect, it } from "vitest";
import { env } from "@/lib/env";
import { presignGet, putObject } from "@/lib/storage/s3";
import { makeProject, makeToken, makeUser } from "@/tests/support/fixtures";
import { api } from "@/tests/support/http";
import { sigv4Signature } from "./sigv4";

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe("presigned URLs", () => {
  it("an upload URL expires within PRESIGN_SECONDS, names one key, and is refused for any other key or method", async () => {
    const owner = await makeUser();
    const token = (await makeToken(owner.id)).secret;
    const { project } = await makeProject({ members: [{ userId: owner.id, role: "owner" }] });
    const res = await api(`/api/v1/projects/${project.id}/uploads`, { token, body: { fileName: "scoped.csv", size: 12, contentType: "text/csv" } });
    expect(res.status).toBe(201);
    const url = new URL(res.json.url);
    const expires = Number(url.searchParams.get("X-Amz-Expires"));
    expect(expires).toBeGreaterThan(0);
    expect(expires).toBeLessThanOrEqual(env.PRESIGN_SECONDS);
    expect(url.searchParams.get("X-Amz-Algorithm")).toBe("AWS4-HMAC-SHA256");
    expect(decodeURIComponent(url.pathname)).toBe(`/${env.S3_BUCKET}/projects/${project.id}/uploads/${res.json.upload.id}/scoped.csv`);

    // The signature covers method, bucket and key: recomputed for another key or another method it no longer matches.
    const given = url.searchParams.get("X-Amz-Signature");
    const headers = { "content-type": "text/csv" };
    expect(sigv4Signature(url, "PUT", headers, env.S3_SECRET_ACCESS_KEY)).toBe(given);
    const other = new URL(url);
    other.pathname = url.pathname.replace("scoped.csv", "other.csv");
    expect(sigv4Signature(other, "PUT", headers, env.S3_SECRET_ACCESS_KEY)).not.toBe(given);
    expect(sigv4Signature(url, "GET", headers, env.S3_SECRET_ACCESS_KEY)).not.toBe(given);
    // Only the host header is signed: the content type is not bound (real S3 stores whatever type the PUT sends).
    expect(url.searchParams.get("X-Amz-SignedHeaders")).toBe("host");
    const right = await fetch(url, { method: "PUT", body: "id,a\nx-1,1\n", headers: { "content-type": "text/csv" } });
    expect(right.status).toBe(200);
  });

  it("a download URL stops working once it has expired", async () => {
    const key = `tests/security/${crypto.randomUUID()}.txt`;
    await putObject(key, "short-lived", "text/plain");
    const url = await presignGet(key, 1);
    expect(await (await fetch(url)).text()).toBe("short-lived");
    await sleep(2_100);
    const late = await fetch(url);
    expect(late.status).toBe(403);
    expect(await late.text()).toMatch(/expired/i);
  });
});
