import "server-only";
import type { Tx } from "@/db/client";
import { lockBuild } from "@/db/build-stages";
import type { Build } from "@/db/schema";
import { AppError } from "@/lib/api/errors";

/** The build, row-locked until the transaction ends, for a use case that judges and then changes it; 404 when there is none. */
export async function lockedBuild(tx: Tx, id: string): Promise<Build> {
  const build = await lockBuild(tx, { id });
  if (!build) throw new AppError("not_found", "No build with that id.");
  return build;
}
