import { z } from "zod";

export const roleSchema = z.enum(["owner", "reviewer", "annotator", "viewer"]);
export const inviteSchema = z.object({ email: z.string().trim().toLowerCase().email("Enter a valid e-mail address.").max(320), role: roleSchema });
export const changeRoleSchema = z.object({ role: roleSchema });
export type InviteInput = z.infer<typeof inviteSchema>;
