import { apiRoute } from "@/lib/platform/http/api-route";
import { getVersion } from "@/lib/api/operations/profiles";
import { AppError } from "@/lib/api/errors";
import { getDb } from "@/db/client";
import * as versions from "@/db/profile-versions";

export const GET = apiRoute(getVersion, async ({ params }) => {
  const version = await versions.getVersion(getDb(), { id: params.id });
  if (!version) throw new AppError("not_found", "No such profile version.");
  return { version };
});
