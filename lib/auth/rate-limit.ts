import "server-only";
import { RateLimiterMemory, RateLimiterPostgres, RateLimiterRes, type RateLimiterAbstract } from "rate-limiter-flexible";
import { pool } from "@/db";
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";

const globalForLimits = globalThis as unknown as { vicinalLimiters?: Record<string, RateLimiterAbstract> };

/**
 * Limits that guard accounts and mail (sign-in, links) are shared by every app process through PostgreSQL. The API-token
 * limit is a fairness limit on hot traffic: it is counted in each process's memory (with N app replicas a token gets up to
 * N times the limit), which spares every API request a database write.
 */
const inMemory = new Set(["api_token"]);

function limiter(name: string, points: number, duration: number, blockDuration = 0) {
  globalForLimits.vicinalLimiters ??= {};
  globalForLimits.vicinalLimiters[name] ??= inMemory.has(name)
    ? new RateLimiterMemory({ keyPrefix: name, points, duration, blockDuration })
    : new RateLimiterPostgres({
        storeClient: pool,
        tableName: "rate_limits",
        keyPrefix: name,
        points,
        duration,
        blockDuration,
        clearExpiredByTimeout: true,
        tableCreated: true,
      });
  return globalForLimits.vicinalLimiters[name];
}

async function consume(name: string, points: number, duration: number, key: string, blockDuration = 0) {
  try {
    await limiter(name, points, duration, blockDuration).consume(key);
  } catch (error) {
    if (error instanceof RateLimiterRes) {
      const seconds = Math.ceil(error.msBeforeNext / 1000);
      throw new AppError("rate_limited:auth", `Too many attempts. Try again in ${seconds} s.`, { retryAfter: seconds });
    }
    throw error;
  }
}

/** Sign-in attempts: per account (15 min window) and per client address. */
export async function limitSignIn(email: string, ip: string) {
  await consume("signin_ip", env.SIGNIN_LIMIT_PER_IP, 15 * 60, ip);
  await consume("signin_account", env.SIGNIN_LIMIT_PER_ACCOUNT, 15 * 60, email.toLowerCase(), 15 * 60);
}

export async function resetSignInLimit(email: string) {
  await limiter("signin_account", env.SIGNIN_LIMIT_PER_ACCOUNT, 15 * 60, 15 * 60).delete(email.toLowerCase());
}

/** API token requests per token per minute (per app process, see above). */
export async function limitToken(tokenId: number) {
  await consume("api_token", env.TOKEN_LIMIT_PER_MINUTE, 60, String(tokenId));
}

/** E-mails sent on request (links, resets) per address per hour. */
export async function limitMailRequest(email: string) {
  await consume("mail_request", 5, 60 * 60, email.toLowerCase());
}
