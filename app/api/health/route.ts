import { NextResponse } from "next/server";
import { pool } from "@/db";
import { queueHealthy } from "@/lib/jobs/boss";
import { mailHealthy } from "@/lib/mail/mailer";
import { storageHealthy } from "@/lib/storage/s3";

export const dynamic = "force-dynamic";

async function databaseHealthy() {
  try {
    await pool.query("select 1");
    return true;
  } catch {
    return false;
  }
}

function withTimeout(p: Promise<boolean>, ms = 3000) {
  return Promise.race([p, new Promise<boolean>((resolve) => setTimeout(() => resolve(false), ms))]);
}

/** 200 when the database, object storage, mail and the job queue answer; 503 naming what is down. */
export async function GET() {
  const [database, storage, mail, queue] = await Promise.all([
    withTimeout(databaseHealthy()),
    withTimeout(storageHealthy()),
    withTimeout(mailHealthy()),
    withTimeout(queueHealthy()),
  ]);
  const checks = { database, storage, mail, queue };
  const down = Object.entries(checks).filter(([, ok]) => !ok).map(([name]) => name);
  return NextResponse.json(
    { status: down.length ? "degraded" : "ok", checks: Object.fromEntries(Object.entries(checks).map(([k, ok]) => [k, ok ? "up" : "down"])), down },
    { status: down.length ? 503 : 200, headers: { "cache-control": "no-store" } },
  );
}
