import { z } from "zod";

export const adminUsersQuerySchema = z.object({ q: z.string().trim().max(120).optional() });
