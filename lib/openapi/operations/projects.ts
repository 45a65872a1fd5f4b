import { z } from "zod";
import { updateProjectSchema } from "@/app/api/v1/projects/[projectId]/schema";
import { changeRoleSchema, inviteSchema } from "@/app/api/v1/projects/[projectId]/members/schema";
import { createProjectSchema, listQuerySchema } from "@/app/api/v1/projects/schema";
import { projectAuditQuerySchema } from "../route-local";
import { auditPageSchema, data, looseData, nextCursorSchema, projectDetailSchema, projectSummarySchema } from "../responses";
import type { ApiGroup } from "../types";

const P = "/api/v1/projects/{projectId}";

export const projectsGroup: ApiGroup = {
  name: "Projects",
  description: "Projects you belong to, their settings, members and audit trail.",
  operations: [
    {
      method: "get",
      path: "/api/v1/projects",
      tag: "Projects",
      summary: "List my projects",
      description: "Projects you are a member of (all of them, for site admins), by id.",
      need: "user",
      query: listQuerySchema,
      paged: "cursor",
      responses: [{ status: 200, description: "A page of projects.", schema: z.object({ data: z.array(projectSummarySchema), nextCursor: nextCursorSchema }) }],
      errors: ["bad_request:cursor"],
    },
    {
      method: "post",
      path: "/api/v1/projects",
      tag: "Projects",
      summary: "Create a project",
      description: "Any signed-in user may create a project with its label set (2–9 labels); they become its owner.",
      need: "user",
      body: createProjectSchema,
      responses: [{ status: 201, description: "The new project.", schema: looseData("The project row: id, name, description, settings, createdAt.") }],
    },
    { method: "get", path: P, tag: "Projects", summary: "Read a project", description: "Settings, feature schema, label classes and your role.", need: "viewer", responses: [{ status: 200, description: "The project.", schema: data(projectDetailSchema) }] },
    { method: "patch", path: P, tag: "Projects", summary: "Change a project", description: "Name, description and any subset of the settings (k-NN settings changes are audit-logged).", need: "owner", body: updateProjectSchema, responses: [{ status: 200, description: "The updated project.", schema: looseData("The project row after the change.") }] },
    {
      method: "get",
      path: `${P}/members`,
      tag: "Projects",
      summary: "List members",
      description: "Members with their roles; owners also see e-mails and open invitations.",
      need: "viewer",
      responses: [
        {
          status: 200,
          description: "Members and open invitations.",
          schema: z.object({
            data: z.array(z.looseObject({ userId: z.string(), name: z.string().nullable(), role: z.string(), since: z.string(), email: z.string().optional(), deactivated: z.boolean() })),
            invitations: z.array(z.looseObject({ id: z.number().int(), email: z.string(), role: z.string() })),
          }),
        },
      ],
    },
    { method: "post", path: `${P}/members`, tag: "Projects", summary: "Invite a member", description: "Sends an invitation e-mail (through the job queue) with the given role.", need: "owner", body: inviteSchema, responses: [{ status: 201, description: "The invitation.", schema: looseData("id, email, role, expiresAt.") }], errors: ["conflict:member", "conflict:invitation"] },
    { method: "patch", path: `${P}/members/{userId}`, tag: "Projects", summary: "Change a member's role", need: "owner", body: changeRoleSchema, responses: [{ status: 200, description: "The membership after the change.", schema: looseData("userId, role.") }], errors: ["not_found:member", "conflict:last_owner"] },
    { method: "delete", path: `${P}/members/{userId}`, tag: "Projects", summary: "Remove a member", need: "owner", responses: [{ status: 204, description: "Removed." }], errors: ["not_found:member", "conflict:last_owner"] },
    { method: "delete", path: `${P}/invitations/{invitationId}`, tag: "Projects", summary: "Revoke an invitation", need: "owner", responses: [{ status: 204, description: "Revoked; its link no longer works." }], errors: ["not_found:invitation"] },
    { method: "get", path: `${P}/audit`, tag: "Projects", summary: "Read the project's audit trail", description: "Role changes, rulings, settings changes, edition publishing and deletion, newest first.", need: "owner", query: projectAuditQuerySchema, paged: "before", responses: [{ status: 200, description: "A page of audit entries.", schema: auditPageSchema }] },
  ],
};
