import { afterAll, describe, expect, it } from "vitest";
import { closeDb } from "./support/db";
import { callRoute, tokenFor } from "./support/http";
import { withRequestStats } from "@/db/request-stats";
import { actorCaches } from "@/lib/platform/auth/actor-cache";
import { forgetBuildSlots } from "@/lib/use-cases/support/build-slots";
import { GET as lookup } from "@/app/api/v1/lookup/route";

afterAll(closeDb);

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

// The statements an API request costs are kept at these numbers: a change that adds a
// round trip to the hot path has to change this file too.
const LOOKUP_QUERIES = 1; // lot, revision and the builds' stages in one prepared statement
const SLOTS_FIRST_READ_QUERIES = 1; // the builds' slots, then kept in process by build id (lib/use-cases/support/build-slots.ts)
const TOKEN_FIRST_USE_QUERIES = 2; // the token's actor, and its last-use stamp (once a minute)

describe("statements per API request", () => {
  it("serial lookup with a token: one statement once the token and the build's slots are known, plus three on first use", async () => {
    for (let i = 0; i < 200 && !actorCaches().tokens.listening; i++) await sleep(25);
    const token = await tokenFor("support@tarnwell.example");
    forgetBuildSlots();
    const url = "/api/v1/lookup?serial=TC1-00010000";
    const first = await withRequestStats(() => callRoute(lookup, { url, token }));
    expect(first.result.status).toBe(200);
    expect(first.stats).toEqual({ queries: LOOKUP_QUERIES + SLOTS_FIRST_READ_QUERIES + TOKEN_FIRST_USE_QUERIES, sessionLookups: 0, actorQueries: TOKEN_FIRST_USE_QUERIES });
    const again = await withRequestStats(() => callRoute(lookup, { url, token }));
    expect(again.result.status).toBe(200);
    expect(again.stats).toEqual({ queries: LOOKUP_QUERIES, sessionLookups: 0, actorQueries: 0 });
    const body = (await again.result.json()) as { lot: { lotCode: string }; slots: unknown[] };
    expect(body.lot.lotCode).toBe("TW-2501");
    expect(body.slots.length).toBeGreaterThan(0);
  });
});
