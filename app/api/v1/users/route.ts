import { apiRoute } from "@/lib/platform/http/api-route";
import { createUser, listUsers } from "@/lib/api/operations/admin";
import { getDb } from "@/db/client";
import * as users from "@/db/users";
import { auditActor } from "@/lib/platform/auth/actor";
import { usersList } from "@/lib/use-cases/admin/read";
import { hashPassword } from "@/lib/platform/auth/password";

export const GET = apiRoute(listUsers, async () => usersList(getDb()));

export const POST = apiRoute(createUser, async ({ actor, body, requestId }) => {
  const { password, ...rest } = body;
  const user = await users.createUser(getDb(), auditActor(actor, requestId), { ...rest, passwordHash: await hashPassword(password) });
  return { user };
});
