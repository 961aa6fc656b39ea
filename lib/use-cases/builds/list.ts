import "server-only";
import type { z } from "zod";
import type { Executor } from "@/db/client";
import { listBuilds } from "@/db/builds";
import type { listBuildsQuery } from "@/lib/api/operations/builds";

/** The builds pipeline: every build (at most 500, newest first), optionally of one stage. Read by the API and the builds page. */
export async function listBuildsForPipeline(db: Executor, query: z.output<typeof listBuildsQuery>) {
  return { items: await listBuilds(db, { stage: query.stage, limit: 500 }) };
}
