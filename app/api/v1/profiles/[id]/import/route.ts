import { apiRoute } from "@/lib/platform/http/api-route";
import { importDraft } from "@/lib/api/operations/profiles";
import { AppError } from "@/lib/api/errors";
import { getDb } from "@/db/client";
import * as profiles from "@/db/profiles";
import { auditActor } from "@/lib/platform/auth/actor";
import { readTextBody } from "@/lib/platform/http/read-text";
import { validateProfileText } from "@/lib/engine";

export const POST = apiRoute(importDraft, async ({ actor, params, req, requestId }) => {
  const db = getDb();
  if (!(await profiles.getProfileRow(db, { id: params.id }))) throw new AppError("not_found", "No such profile.");
  const text = await readTextBody(req, importDraft.rawBody!);
  // Board limits are checked in the editor against the chosen revision; here the document must stand on its own.
  const result = validateProfileText(text);
  if (!result.ok || !result.value) {
    const issues = result.issues.filter((i) => i.severity === "error");
    throw new AppError("validation_failed", "The file is not a valid cooling profile; fix the listed problems and upload it again.", {
      issues: issues.map((i) => ({ path: i.range ? `${i.path} (line ${i.range.start.line})` : i.path, message: i.message })),
    });
  }
  // The file's text is kept as written (key order, spacing), like a typed draft.
  const saved = await profiles.saveDraft(db, { ...auditActor(actor, requestId), userId: actor.userId }, { id: params.id, text });
  return { ...saved, warnings: result.issues.length };
});
