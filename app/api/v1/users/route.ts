import { apiRoute } from "@/lib/platform/http/api-route";
import { createUser, listUsers } from "@/lib/api/operations/admin";
import { getDb } from "@/db/client";
import * as users from "@/db/users";
import { auditActor } from "@/lib/platform/auth/actor";
import { usersList } from "@/lib/use-cases/admin/read";
import { hashPassword } from "@/lib/platform/auth/password";
import { isCommon } from "@/lib/platform/auth/common-passwords";
import { AppError } from "@/lib/api/errors";

export const GET = apiRoute(listUsers, async () => usersList(getDb()));

export const POST = apiRoute(createUser, async ({ actor, body, requestId }) => {
  const { password, ...rest } = body;
  if (isCommon(password)) {
    throw new AppError("validation_failed", "This first password is on a list of common or breached passwords; choose another.", {
      issues: [{ path: "/password", message: "On the list of common or breached passwords." }],
    });
  }
  const user = await users.createUser(getDb(), auditActor(actor, requestId), { ...rest, passwordHash: await hashPassword(password) });
  return { user };
});
