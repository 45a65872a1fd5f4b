// Query schemas of routes whose schema.ts sits beside them, re-exported for the document builder.
export { adminAuditQuerySchema } from "@/app/api/v1/admin/audit/schema";
export { adminUsersQuerySchema } from "@/app/api/v1/admin/users/schema";
export { projectAuditQuerySchema } from "@/app/api/v1/projects/[projectId]/audit/schema";
