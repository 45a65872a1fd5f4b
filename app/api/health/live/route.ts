import { NextResponse } from "next/server";

export const dynamic = "force-dynamic";

/**
 * Liveness: 200 as long as this process serves requests, touching no dependency (for an orchestrator's liveness probe;
 * /api/health is the readiness check that asks the database, storage, mail and the queue). The load benchmark also
 * uses it as its same-run floor: what the server costs per request before any of Vicinal's work.
 */
export function GET() {
  return NextResponse.json({ status: "live" }, { headers: { "cache-control": "no-store" } });
}
