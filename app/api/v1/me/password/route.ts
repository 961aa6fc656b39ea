import { apiRoute } from "@/lib/platform/http/api-route";
import { changePassword } from "@/lib/api/operations/account";
import { AppError } from "@/lib/api/errors";
import { getDb } from "@/db/client";
import { getUserById, setPasswordHash } from "@/db/users";
import { hashPassword, verifyPassword } from "@/lib/platform/auth/password";
import { auditActor } from "@/lib/platform/auth/actor";

export const POST = apiRoute(changePassword, async ({ actor, body, requestId }) => {
  const db = getDb();
  const user = await getUserById(db, { id: actor.userId });
  if (!user) throw new AppError("not_found", "Your account no longer exists.");
  if (!(await verifyPassword(body.currentPassword, user.passwordHash))) {
    throw new AppError("validation_failed", "The current password is not right.", { issues: [{ path: "/currentPassword", message: "Not your current password." }] });
  }
  await setPasswordHash(db, auditActor(actor, requestId), { id: actor.userId, passwordHash: await hashPassword(body.newPassword) });
  return undefined;
});
