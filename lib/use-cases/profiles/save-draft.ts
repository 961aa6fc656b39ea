import "server-only";
import type { NextRequest } from "next/server";
import type { Database } from "@/db/client";
import { recordAudit, type AuditActor } from "@/db/audit";
import { getProfileRow, lockDraft, writeDraft } from "@/db/profiles";
import { AppError } from "@/lib/api/errors";
import { importDraft } from "@/lib/api/operations/profiles";
import { validateProfileText } from "@/lib/engine";
import { readTextBody } from "@/lib/platform/http/read-text";

type Editor = AuditActor & { userId: string };

/**
 * Saves the working draft as the exact text typed (even when it is not valid JSON yet), so
 * nothing typed is lost or reordered. When the text passes the schema it is also kept as the
 * draft's last plottable document, which the editor plots (greyed) while the text is broken.
 * Optimistic concurrency: the caller says which draft revision its text is based on; if
 * someone saved since, the save is refused (409) naming who, so nobody overwrites another's
 * work unseen. `baseRevision` undefined replaces the draft outright (an explicit import).
 */
export async function saveDraft(db: Database, actor: Editor, { id, text, baseRevision }: { id: string; text: string; baseRevision?: number }) {
  const plottable = validateProfileText(text).value;
  return db.transaction(async (tx) => {
    const current = await lockDraft(tx, { id });
    if (!current) throw new AppError("not_found", "No such profile.");
    if (baseRevision !== undefined && baseRevision !== current.draftRevision) {
      const who = current.savedBy ?? "Someone";
      const when = current.draftUpdatedAt ? ` at ${current.draftUpdatedAt.toISOString().slice(11, 16)} UTC` : "";
      throw new AppError(
        "conflict",
        `${who} saved this draft${when} after you loaded it (draft revision ${current.draftRevision}, yours is based on ${baseRevision}). Compare your text with theirs or reload it before saving again.`,
      );
    }
    const now = new Date();
    const draftRevision = current.draftRevision + 1;
    await writeDraft(tx, { id, text, plottable, draftRevision, savedByUserId: actor.userId, at: now });
    // The draft itself is not repeated in the log: autosave runs on every pause in typing.
    await recordAudit(tx, actor, { action: "profile.draft_save", entityType: "profile", entityId: id, after: { bytes: text.length, draftRevision } });
    return { draftUpdatedAt: now.toISOString(), draftRevision };
  });
}

/**
 * A profile file uploaded into the draft: 404 before the body is read when there is no such
 * profile; the document must pass the schema on its own (422 listing the problems; board
 * limits are checked in the editor against the chosen revision); then it replaces the draft,
 * its text kept as written (key order, spacing), like a typed draft.
 */
export async function importDraftFile(db: Database, actor: Editor, { id, req }: { id: string; req: NextRequest }) {
  if (!(await getProfileRow(db, { id }))) throw new AppError("not_found", "No such profile.");
  const text = await readTextBody(req, importDraft.rawBody!);
  const result = validateProfileText(text);
  if (!result.ok || !result.value) {
    const issues = result.issues.filter((i) => i.severity === "error");
    throw new AppError("validation_failed", "The file is not a valid cooling profile; fix the listed problems and upload it again.", {
      issues: issues.map((i) => ({ path: i.range ? `${i.path} (line ${i.range.start.line})` : i.path, message: i.message })),
    });
  }
  const saved = await saveDraft(db, actor, { id, text });
  return { ...saved, warnings: result.issues.length };
}
