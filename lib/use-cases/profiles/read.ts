import "server-only";
import type { z } from "zod";
import type { Executor } from "@/db/client";
import { getProfileDetail, getProfileRow, listProfiles, listVersionsOfProfile } from "@/db/profiles";
import { getVersion } from "@/db/profile-versions";
import { AppError } from "@/lib/api/errors";
import type { DownloadFile } from "@/lib/platform/http/download";
import { documentText } from "@/lib/registry/starter-profile";
import type { profilesQuery } from "@/lib/api/operations/profiles";

/** One page of the profile list with each profile's latest version. Read by the API and the profiles page. */
export async function profilesPage(db: Executor, query: z.output<typeof profilesQuery>) {
  const page = await listProfiles(db, query);
  return { ...page, items: page.items.map((p) => ({ ...p, updatedAt: p.updatedAt.toISOString() })) };
}

/** A profile with its draft, hardware and published versions. Read by the API and the profile editor page. */
export async function profileDetail(db: Executor, { id }: { id: string }) {
  const detail = await getProfileDetail(db, { id });
  if (!detail) throw new AppError("not_found", "No such profile.");
  return detail;
}

/** A profile's published versions, newest first; 404 when there is no such profile. */
export async function profileVersions(db: Executor, { profileId }: { profileId: string }) {
  if (!(await getProfileRow(db, { id: profileId }))) throw new AppError("not_found", "No such profile.");
  return { items: await listVersionsOfProfile(db, { profileId }) };
}

/** One published version with its document. */
export async function profileVersion(db: Executor, { id }: { id: string }) {
  const version = await getVersion(db, { id });
  if (!version) throw new AppError("not_found", "No such profile version.");
  return { version };
}

/** A published version's document as a .json file named after its profile and version. */
export async function profileVersionFile(db: Executor, { id }: { id: string }): Promise<DownloadFile> {
  const { version: v } = await profileVersion(db, { id });
  const slug = v.profileName.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "") || "profile";
  return { bytes: documentText(v.document), contentType: "application/json; charset=utf-8", fileName: `${slug}-${v.version}.profile.json`, cacheControl: "private, no-store" };
}
