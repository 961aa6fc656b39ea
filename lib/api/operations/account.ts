import { z } from "zod";
import { defineOperation } from "../operation";
import { ROLES } from "@/lib/auth/roles";
import { newPasswordSchema } from "@/lib/auth/password-policy";
import { timestamp } from "./timestamp";
import { MAX_TOKEN_DAYS, MAX_LIVE_TOKENS } from "../limits";

export const idParams = z.strictObject({ id: z.uuid("Not a valid id.") });

export const meResponse = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  via: z.enum(["session", "token"]),
});

export const getMe = defineOperation({
  id: "getMe",
  method: "GET",
  path: "/api/v1/me",
  summary: "The signed-in user or the token's user, with role",
  tag: "Account",
  access: "signed_in",
  response: meResponse,
});

export const changePasswordBody = z.strictObject({
  currentPassword: z.string().min(1, "Enter your current password.").max(1024),
  newPassword: newPasswordSchema,
  /** Also revoke every API token of the account (e.g. when the password may have leaked). */
  revokeTokens: z.boolean().default(false),
});
export type ChangePasswordBody = z.input<typeof changePasswordBody>;

export const changePassword = defineOperation({
  id: "changePassword",
  method: "POST",
  path: "/api/v1/me/password",
  summary: "Change your own password (signed-in session only; ends your other sessions)",
  tag: "Account",
  access: "signed_in",
  body: changePasswordBody,
  response: z.object({ otherSessionsEnded: z.number(), tokensRevoked: z.number() }),
});

export const tokenSchema = z.object({
  id: z.string(),
  name: z.string(),
  tokenPrefix: z.string(),
  expiresAt: timestamp,
  revokedAt: timestamp.nullable(),
  lastUsedAt: timestamp.nullable(),
  createdAt: timestamp,
});
export type TokenView = z.infer<typeof tokenSchema>;

export const listTokens = defineOperation({
  id: "listTokens",
  method: "GET",
  path: "/api/v1/tokens",
  summary: "Your API tokens (never their secret)",
  tag: "Account",
  access: "signed_in",
  response: z.object({ items: z.array(tokenSchema) }),
});

export { MAX_TOKEN_DAYS, MAX_LIVE_TOKENS };

export const createTokenBody = z.strictObject({
  name: z.string().trim().min(1, "Name the token, e.g. the station or pipeline that uses it.").max(80),
  // A JSON number only: "30", true or [30] are refused rather than coerced.
  expiresInDays: z
    .number("Give the lifetime as a number of days.")
    .int("Whole days only.")
    .min(1, "At least 1 day.")
    .max(MAX_TOKEN_DAYS, `At most ${MAX_TOKEN_DAYS} days; make a new token when this one runs out.`),
});
export type CreateTokenBody = z.infer<typeof createTokenBody>;

export const createToken = defineOperation({
  id: "createToken",
  method: "POST",
  path: "/api/v1/tokens",
  summary: "Create an API token; the secret is shown in this response only",
  tag: "Account",
  access: "signed_in",
  body: createTokenBody,
  response: z.object({ token: tokenSchema, secret: z.string() }),
  successStatus: 201,
});

export const revokeToken = defineOperation({
  id: "revokeToken",
  method: "DELETE",
  path: "/api/v1/tokens/{id}",
  summary: "Revoke one of your API tokens (an unknown id and someone else's token get the same 404)",
  tag: "Account",
  access: "signed_in",
  params: idParams,
  response: z.object({ token: tokenSchema }),
});
