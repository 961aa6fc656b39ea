import { apiRoute } from "@/lib/platform/http/api-route";
import { getProfile } from "@/lib/api/operations/profiles";
import { AppError } from "@/lib/api/errors";
import { getDb } from "@/db/client";
import { getProfileDetail } from "@/db/profiles";

export const GET = apiRoute(getProfile, async ({ params }) => {
  const detail = await getProfileDetail(getDb(), { id: params.id });
  if (!detail) throw new AppError("not_found", "No such profile.");
  return detail;
});
