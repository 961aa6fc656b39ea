export const dynamic = "force-dynamic";

/**
 * Liveness: the process is up and its request path answers. No database, no sign-in, no
 * I/O at all, so a load balancer restarting on failure never restarts every instance when
 * PostgreSQL is down (that is what the readiness check at /api/health reports).
 */
export function GET(): Response {
  return Response.json({ status: "ok" }, { headers: { "cache-control": "no-store" } });
}
