import { apiRoute } from "@/lib/platform/http/api-route";
import { createComponent, listComponents } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import * as components from "@/db/components";
import { auditActor } from "@/lib/platform/auth/actor";
import { componentsPage } from "@/lib/use-cases/registry/read";

export const GET = apiRoute(listComponents, async ({ query }) => componentsPage(getDb(), query));

export const POST = apiRoute(createComponent, async ({ actor, body, requestId }) => ({
  component: await components.createComponent(getDb(), auditActor(actor, requestId), body),
}));
