import { NextResponse } from "next/server";
import { checkDatabase } from "@/db/health";

export const dynamic = "force-dynamic";

/** Liveness and database reachability for load balancers; no sign-in, no secrets. */
export async function GET() {
  const database = await checkDatabase();
  const ok = database.ok;
  return NextResponse.json(
    { status: ok ? "ok" : "degraded", database: database.ok ? "up" : "down", latencyMs: database.latencyMs },
    { status: ok ? 200 : 503, headers: { "cache-control": "no-store" } },
  );
}
