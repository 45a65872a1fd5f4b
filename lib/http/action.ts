import { unstable_rethrow } from "next/navigation";
import type { z } from "zod";
import { AppError, isDatabaseUnavailable } from "@/lib/errors";

export type ActionState = { error?: string; fieldErrors?: Record<string, string>; ok?: string; values?: Record<string, string> };

/** Server actions go through one wrapper: zod-validated form data, `{ error }` or `{ ok }` for useActionState. */
export function validatedAction<S extends z.ZodType>(schema: S, fn: (data: z.infer<S>, formData: FormData) => Promise<ActionState | void>) {
  return async (_prev: ActionState, formData: FormData): Promise<ActionState> => {
    const values: Record<string, string> = {};
    for (const [k, v] of formData.entries()) if (typeof v === "string" && !/password/i.test(k)) values[k] = v;
    const parsed = schema.safeParse(Object.fromEntries(formData));
    if (!parsed.success) {
      const fieldErrors: Record<string, string> = {};
      for (const issue of parsed.error.issues) fieldErrors[String(issue.path[0] ?? "form")] ??= issue.message;
      return { error: "Please correct the marked fields.", fieldErrors, values };
    }
    try {
      return (await fn(parsed.data, formData)) ?? { ok: "Done." };
    } catch (error) {
      unstable_rethrow(error);
      if (error instanceof AppError) return { error: error.message, values };
      if (isDatabaseUnavailable(error)) return { error: "The database is unavailable; try again in a few seconds.", values };
      const pgCode = (error as { code?: string })?.code;
      if (pgCode === "22021" || pgCode === "22P05") return { error: "Text may not contain a NUL character (byte 0).", values };
      console.error("[action]", error);
      return { error: "Something went wrong on the server.", values };
    }
  };
}
