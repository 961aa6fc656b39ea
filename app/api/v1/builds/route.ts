import { apiRoute } from "@/lib/platform/http/api-route";
import { createBuild, listBuilds } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import * as builds from "@/db/builds";
import { auditActor } from "@/lib/platform/auth/actor";
import { AppError } from "@/lib/api/errors";
import { checkSlots } from "@/lib/use-cases/builds/check";
import { listBuildsForPipeline } from "@/lib/use-cases/builds/list";

export const GET = apiRoute(listBuilds, async ({ query }) => listBuildsForPipeline(getDb(), query));

export const POST = apiRoute(createBuild, async ({ actor, body, requestId }) => {
  const db = getDb();
  const { check } = await checkSlots(db, { boardModelId: body.boardModelId, revisionRange: body.revisionRange, profileVersionIds: body.slots });
  if (!check.ok) {
    throw new AppError("validation_failed", `The build does not fit: ${check.issues[0]}`, { issues: check.issues.map((message) => ({ path: "/slots", message })) });
  }
  const build = await builds.createBuild(db, { ...auditActor(actor, requestId), userId: actor.userId }, {
    boardModelId: body.boardModelId,
    version: body.version,
    revisionRange: body.revisionRange,
    firmwareUploadId: body.firmwareUploadId,
    profileVersionIds: body.slots,
    bank: { image: check.image, bankBytes: check.bankBytes, sha256: check.sha256, crc32: check.crc32 },
  });
  return { build };
});
