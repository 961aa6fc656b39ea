import { apiRoute } from "@/lib/platform/http/api-route";
import { createUser, listUsers } from "@/lib/api/operations/admin";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { usersList } from "@/lib/use-cases/admin/read";
import { addUser } from "@/lib/use-cases/admin/users";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(listUsers, async () => usersList(getDb()));

export const POST = apiRoute(createUser, async ({ actor, body, requestId }) => addUser(getDb(), auditActor(actor, requestId), body));
