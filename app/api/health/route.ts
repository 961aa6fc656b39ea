import { NextResponse } from "next/server";
import { checkDatabase } from "@/db/health";

export const dynamic = "force-dynamic";

/** Readiness for load balancers: the database answers (one query with a short deadline); no sign-in, no secrets. Liveness without I/O is /api/health/live. */
export async function GET() {
  const database = await checkDatabase();
  const ok = database.ok;
  return NextResponse.json(
    { status: ok ? "ok" : "degraded", database: database.ok ? "up" : "down", latencyMs: database.latencyMs },
    { status: ok ? 200 : 503, headers: { "cache-control": "no-store" } },
  );
}
