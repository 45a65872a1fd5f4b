import { z } from "zod";
import { adminUserPatchSchema } from "@/app/api/v1/admin/users/[userId]/schema";
import { createTokenSchema } from "@/app/api/v1/tokens/schema";
import { adminAuditQuerySchema, adminUsersQuerySchema } from "../route-local";
import { auditPageSchema, data, meSchema, tokenCreatedSchema, tokenSchema } from "../responses";
import type { ApiGroup } from "../types";

export const accountGroup: ApiGroup = {
  name: "Account",
  description: "Who you are, and your personal API tokens.",
  operations: [
    { method: "get", path: "/api/v1/me", tag: "Account", summary: "Who am I", description: "The caller and how they authenticated (`session` or `token`).", need: "user", responses: [{ status: 200, description: "The caller.", schema: data(meSchema) }] },
    { method: "get", path: "/api/v1/tokens", tag: "Account", summary: "List my API tokens", description: "Your tokens with their prefix and last-used time; secrets are never shown again.", need: "user", responses: [{ status: 200, description: "Your tokens, newest first.", schema: data(z.array(tokenSchema)) }] },
    {
      method: "post",
      path: "/api/v1/tokens",
      tag: "Account",
      summary: "Create an API token",
      description: "Creates a personal token. The secret (`vcn_…`) is in this answer only; it is stored hashed. Tokens cannot create tokens: call this signed in.",
      need: "user",
      sessionOnly: true,
      body: createTokenSchema,
      responses: [{ status: 201, description: "The new token with its secret.", schema: data(tokenCreatedSchema) }],
      errors: ["forbidden:token"],
    },
    { method: "delete", path: "/api/v1/tokens/{tokenId}", tag: "Account", summary: "Revoke an API token", need: "user", responses: [{ status: 204, description: "Revoked; calls with it now answer 401." }], errors: ["not_found:token"] },
  ],
};

export const adminGroup: ApiGroup = {
  name: "Admin",
  description: "Site administration: users, roles in any project, and the whole audit trail.",
  operations: [
    { method: "get", path: "/api/v1/admin/users", tag: "Admin", summary: "List users", need: "admin", query: adminUsersQuerySchema, responses: [{ status: 200, description: "Users matching `q` (name or e-mail).", schema: data(z.array(z.looseObject({ id: z.string(), email: z.string(), isAdmin: z.boolean() }))) }] },
    {
      method: "patch",
      path: "/api/v1/admin/users/{userId}",
      tag: "Admin",
      summary: "Change a user",
      description: "Grant or revoke site admin, deactivate, or set a role in any project (`role: null` removes the membership). Audit-logged.",
      need: "admin",
      body: adminUserPatchSchema,
      responses: [{ status: 200, description: "Done.", schema: data(z.object({ ok: z.literal(true) })) }],
      errors: ["not_found:user", "not_found:project", "conflict:last_owner", "conflict:self"],
    },
    { method: "get", path: "/api/v1/admin/audit", tag: "Admin", summary: "Read the audit trail", description: "Newest first, filtered by project, action and actor.", need: "admin", query: adminAuditQuerySchema, paged: "before", responses: [{ status: 200, description: "A page of audit entries.", schema: auditPageSchema }] },
  ],
};

export const metaGroup: ApiGroup = {
  name: "Meta",
  description: "This description itself.",
  operations: [
    { method: "get", path: "/api/v1/openapi.json", tag: "Meta", summary: "OpenAPI description", description: "This OpenAPI 3.1 document, generated from the routes' zod schemas. Public.", need: "public", responses: [{ status: 200, description: "The OpenAPI document.", schema: z.looseObject({ openapi: z.string() }) }] },
  ],
};
