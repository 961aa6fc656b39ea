import { apiRoute } from "@/lib/platform/http/api-route";
import { changePassword } from "@/lib/api/operations/account";
import { AppError } from "@/lib/api/errors";
import { getDb } from "@/db/client";
import { changePasswordEndingSessions } from "@/db/users";
import { hashPassword } from "@/lib/platform/auth/password";
import { auditActor } from "@/lib/platform/auth/actor";
import { checkCredentials } from "@/lib/platform/auth/sign-in";
import { clientAddress } from "@/lib/platform/http/client-address";
import { isCommon } from "@/lib/platform/auth/common-passwords";

export const POST = apiRoute(changePassword, async ({ actor, body, req, requestId }) => {
  // A password is a person's secret: an API token (a machine's credential) cannot change it.
  if (actor.via !== "session" || !actor.sessionId) throw new AppError("forbidden", "Change your password while signed in to the app; API tokens cannot change it.");
  if (isCommon(body.newPassword)) {
    throw new AppError("validation_failed", "This password is on a list of common or breached passwords; choose another.", {
      issues: [{ path: "/newPassword", message: "On the list of common or breached passwords." }],
    });
  }
  // The current password is checked through the sign-in throttle, so this form cannot be used to guess it.
  const check = await checkCredentials({ email: actor.email, password: body.currentPassword, client: clientAddress(req.headers) });
  if (!check.ok) {
    throw new AppError("validation_failed", check.retryAfterSec ? `Too many wrong passwords from this device; try again in ${check.retryAfterSec} s.` : "The current password is not right.", {
      issues: [{ path: "/currentPassword", message: "Not your current password." }],
    });
  }
  return changePasswordEndingSessions(getDb(), auditActor(actor, requestId), {
    id: actor.userId,
    passwordHash: await hashPassword(body.newPassword),
    keepSessionId: actor.sessionId,
    revokeTokens: body.revokeTokens,
  });
});
