import { apiRoute } from "@/lib/platform/http/api-route";
import { downloadBuildVectors } from "@/lib/api/operations/firmware";
import { getDb } from "@/db/client";
import { getBuildImage } from "@/db/builds";
import { AppError } from "@/lib/api/errors";
import { sha256, toHex } from "@/lib/engine";
import { bankVectors, vectorsJson } from "@/lib/firmware";

export const GET = apiRoute(downloadBuildVectors, async ({ params }) => {
  const build = await getBuildImage(getDb(), { id: params.id });
  if (!build?.bankImage) throw new AppError("not_found", "No build with that id, or it has no bank image.");
  // From the stored bytes, so the vectors describe exactly the image the factory flashes.
  const result = bankVectors(new Uint8Array(build.bankImage));
  if (!result.ok) throw new AppError("conflict", `The stored bank image of this build does not decode (${result.errors[0]?.message ?? "unreadable"}); it cannot have vectors.`);
  const bytes = new TextEncoder().encode(vectorsJson(result.vectors));
  return new Response(bytes, {
    headers: { "content-type": "application/json; charset=utf-8", "content-disposition": `attachment; filename="vectors-${build.version}.json"`, "x-content-sha256": toHex(sha256(bytes)) },
  });
});
