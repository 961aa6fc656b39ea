import { apiRoute } from "@/lib/platform/http/api-route";
import { lookupSerial as lookupOp } from "@/lib/api/operations/support";
import { getDb, getReadDb } from "@/db/client";
import { recordLookup } from "@/db/lookup";
import { AppError } from "@/lib/api/errors";
import { formatSerial, parseSerial } from "@/lib/serials/serial";
import { lookupSerial } from "@/lib/use-cases/support/lookup";

export const GET = apiRoute(lookupOp, async ({ actor, query }) => {
  const parsed = parseSerial(query.serial);
  if (!parsed.ok) throw new AppError("bad_request", parsed.message);
  // Lots and published versions never change and a stage change may show a moment late: a replica may answer (docs/scale.md).
  const result = await lookupSerial(getReadDb(), parsed.serial);
  const serial = formatSerial(parsed.serial.prefix, parsed.serial.number);
  // The lookup page's history is a person's; factory and script calls with a token stay off it.
  if (actor.via === "session") await recordLookup(getDb(), { userId: actor.userId, serial, found: Boolean(result) });
  if (!result) throw new AppError("not_found", `Serial ${serial} was not found: no production lot covers it. Check the number on the board's label.`);
  return result;
});
