import { apiRoute } from "@/lib/platform/http/api-route";
import { downloadVersion } from "@/lib/api/operations/profiles";
import { AppError } from "@/lib/api/errors";
import { getDb } from "@/db/client";
import * as versions from "@/db/profile-versions";
import { documentText } from "@/lib/registry/starter-profile";

export const GET = apiRoute(downloadVersion, async ({ params }) => {
  const v = await versions.getVersion(getDb(), { id: params.id });
  if (!v) throw new AppError("not_found", "No such profile version.");
  const slug = v.profileName.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "") || "profile";
  return new Response(documentText(v.document), {
    headers: {
      "content-type": "application/json; charset=utf-8",
      "content-disposition": `attachment; filename="${slug}-${v.version}.profile.json"`,
      "cache-control": "private, no-store",
    },
  });
});
