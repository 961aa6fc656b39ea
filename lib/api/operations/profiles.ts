import { z } from "zod";
import { defineOperation, fileResponse } from "../operation";
import { idParams } from "./account";
import { listQuery, pageOf } from "./registry-schemas";
import {
  createProfileBody,
  MAX_PROFILE_BYTES,
  profileDetailView,
  profileSummaryView,
  publishBody,
  saveDraftBody,
  versionView,
  versionWithDocumentView,
} from "./profile-schemas";

export const profileSorts = ["name", "coolerModel", "updatedAt"] as const;
export const profilesQuery = listQuery(profileSorts).extend({ coolerModelId: z.uuid().optional() });
export type ProfilesQuery = z.infer<typeof profilesQuery>;

export const listProfiles = defineOperation({
  id: "listProfiles",
  method: "GET",
  path: "/api/v1/profiles",
  summary: "Profiles with their latest version, sorted, filtered and paged",
  tag: "Profiles",
  access: "read",
  query: profilesQuery,
  response: pageOf(profileSummaryView),
});

export const createProfile = defineOperation({
  id: "createProfile",
  method: "POST",
  path: "/api/v1/profiles",
  summary: "Start a profile for a cooler model (with a starter draft)",
  tag: "Profiles",
  access: "registry:write",
  body: createProfileBody,
  response: z.object({ profile: z.object({ id: z.string(), name: z.string() }) }),
  successStatus: 201,
});

export const getProfile = defineOperation({
  id: "getProfile",
  method: "GET",
  path: "/api/v1/profiles/{id}",
  summary: "A profile with its draft, hardware and versions",
  tag: "Profiles",
  access: "read",
  params: idParams,
  response: profileDetailView,
});

export const saveDraft = defineOperation({
  id: "saveDraft",
  method: "PUT",
  path: "/api/v1/profiles/{id}/draft",
  summary: "Autosave the working draft (may be unfinished); 409 when someone saved since baseRevision",
  tag: "Profiles",
  access: "registry:write",
  params: idParams,
  body: saveDraftBody,
  maxBodyBytes: MAX_PROFILE_BYTES + 1024,
  response: z.object({ draftUpdatedAt: z.string(), draftRevision: z.number() }),
});

export const importDraft = defineOperation({
  id: "importDraft",
  method: "POST",
  path: "/api/v1/profiles/{id}/import",
  summary: "Replace the draft with an uploaded .json profile (validated, at most 256 KiB)",
  tag: "Profiles",
  access: "registry:write",
  params: idParams,
  rawBody: { contentTypes: ["application/json"], maxBytes: MAX_PROFILE_BYTES },
  response: z.object({ draftUpdatedAt: z.string(), draftRevision: z.number(), warnings: z.number() }),
});

export const listVersions = defineOperation({
  id: "listVersions",
  method: "GET",
  path: "/api/v1/profiles/{id}/versions",
  summary: "Published versions of a profile, newest first",
  tag: "Profiles",
  access: "read",
  params: idParams,
  response: z.object({ items: z.array(versionView) }),
});

export const publishVersion = defineOperation({
  id: "publishVersion",
  method: "POST",
  path: "/api/v1/profiles/{id}/versions",
  summary: "Publish an immutable version (encoded and checksummed on the server)",
  tag: "Profiles",
  access: "registry:write",
  params: idParams,
  body: publishBody,
  maxBodyBytes: MAX_PROFILE_BYTES + 4096,
  response: z.object({ version: versionView }),
  successStatus: 201,
});

export const getVersion = defineOperation({
  id: "getVersion",
  method: "GET",
  path: "/api/v1/profile-versions/{id}",
  summary: "One published version with its document",
  tag: "Profiles",
  access: "read",
  params: idParams,
  response: z.object({ version: versionWithDocumentView }),
});

export const downloadVersion = defineOperation({
  id: "downloadVersion",
  method: "GET",
  path: "/api/v1/profile-versions/{id}/download",
  summary: "A published version's JSON document as a file",
  tag: "Profiles",
  access: "read",
  params: idParams,
  response: fileResponse(["application/json"], "The version's profile document as a .json file"),
});
