import { z } from "zod";
import { defineOperation } from "../operation";
import { ROLES } from "@/lib/auth/roles";
import { idParams } from "./account";
import { timestamp } from "./timestamp";

export const userSchema = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  disabledAt: timestamp.nullable(),
  createdAt: timestamp,
});
export type UserView = z.infer<typeof userSchema>;

export const listUsers = defineOperation({
  id: "listUsers",
  method: "GET",
  path: "/api/v1/users",
  summary: "All users with their roles",
  tag: "Admin",
  access: "admin",
  response: z.object({ items: z.array(userSchema) }),
});

export const createUserBody = z.strictObject({
  email: z.email("Enter a valid e-mail address.").max(320),
  name: z.string().trim().min(1, "Enter a name.").max(120),
  role: z.enum(ROLES, "Pick one of the five roles."),
  password: z.string().min(12, "Use at least 12 characters.").max(256),
});
export type CreateUserBody = z.infer<typeof createUserBody>;

export const createUser = defineOperation({
  id: "createUser",
  method: "POST",
  path: "/api/v1/users",
  summary: "Create a user",
  tag: "Admin",
  access: "admin",
  body: createUserBody,
  response: z.object({ user: userSchema }),
  successStatus: 201,
});

export const updateUserBody = z
  .strictObject({ role: z.enum(ROLES).optional(), disabled: z.boolean().optional() })
  .refine((b) => b.role !== undefined || b.disabled !== undefined, "Give a role, disabled, or both.");
export type UpdateUserBody = z.infer<typeof updateUserBody>;

export const updateUser = defineOperation({
  id: "updateUser",
  method: "PATCH",
  path: "/api/v1/users/{id}",
  summary: "Change a user's role or disable / re-enable them",
  tag: "Admin",
  access: "admin",
  params: idParams,
  body: updateUserBody,
  response: z.object({ user: userSchema }),
});

export const auditQuery = z.strictObject({
  action: z.string().max(80).optional(),
  entityType: z.string().max(80).optional(),
  entityId: z.string().max(120).optional(),
  actor: z.string().max(120).optional(),
  /** A day (YYYY-MM-DD, whole day in UTC, both ends included) or an instant with its offset. */
  from: z.union([z.iso.date(), z.iso.datetime({ offset: true })], "Give the first day as YYYY-MM-DD.").optional(),
  to: z.union([z.iso.date(), z.iso.datetime({ offset: true })], "Give the last day as YYYY-MM-DD.").optional(),
  page: z.coerce.number().int().min(1).max(100000).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
});
export type AuditQuery = z.infer<typeof auditQuery>;

export const auditEventSchema = z.object({
  id: z.number(),
  actorUserId: z.string().nullable(),
  actorLabel: z.string(),
  action: z.string(),
  entityType: z.string(),
  entityId: z.string(),
  before: z.unknown(),
  after: z.unknown(),
  requestId: z.string().nullable(),
  createdAt: timestamp,
  /** The acting person's current name (the label when the account is gone). */
  actorName: z.string(),
  /** What the event changed, named with its version and linked; null when it no longer exists. */
  subject: z.object({ label: z.string(), href: z.string().nullable() }).nullable(),
  /** The event as one sentence, e.g. "Erin Example published Quiet 1.1.0". */
  sentence: z.string(),
});
export type AuditEventView = z.infer<typeof auditEventSchema>;

export const listAudit = defineOperation({
  id: "listAudit",
  method: "GET",
  path: "/api/v1/audit",
  summary: "Audit events, newest first, filtered",
  tag: "Admin",
  access: "admin",
  query: auditQuery,
  response: z.object({ items: z.array(auditEventSchema), page: z.number(), pageSize: z.number(), hasMore: z.boolean() }),
});
