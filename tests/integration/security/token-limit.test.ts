// The API-token rate limit through the app's own limiter, with a low limit for this process only.
import { beforeAll, describe, expect, it } from "vitest";

process.env.TOKEN_LIMIT_PER_MINUTE = "5";

describe("API token rate limit", () => {
  let limitToken: (id: number) => Promise<void>;
  let AppError: typeof import("@/lib/errors").AppError;
  beforeAll(async () => {
    ({ limitToken } = await import("@/lib/auth/rate-limit"));
    ({ AppError } = await import("@/lib/errors"));
  });

  it("answers rate_limited:auth with Retry-After seconds after the limit within a minute", async () => {
    const id = 1_000_000 + Math.floor(Math.random() * 1_000_000);
    for (let i = 0; i < 5; i += 1) await limitToken(id);
    const err = await limitToken(id).then(() => null, (e: unknown) => e);
    expect(err).toBeInstanceOf(AppError);
    const e = err as InstanceType<typeof AppError>;
    expect(e.code).toBe("rate_limited:auth");
    expect(e.status).toBe(429);
    const retry = (e.details as { retryAfter: number }).retryAfter;
    expect(retry).toBeGreaterThan(0);
    expect(retry).toBeLessThanOrEqual(60);
    await limitToken(id + 1);
  });
});
