import type { z } from "zod";

/** Who may call an operation: nobody signed in, any user, site admins, or at least this project role. */
export type Need = "public" | "user" | "admin" | "viewer" | "annotator" | "reviewer" | "owner";

export type Method = "get" | "post" | "put" | "patch" | "delete";

export type ApiResponse = { status: number; description: string; schema?: z.ZodType; contentType?: string };

/** One route handler as documented: the schemas are the routes' own (imported from their schema.ts). */
export type ApiOperation = {
  method: Method;
  /** OpenAPI form, `{param}` for `[param]` on disk. */
  path: string;
  tag: string;
  summary: string;
  description?: string;
  need: Need;
  /** Only through a browser session (the token cannot be used). */
  sessionOnly?: boolean;
  query?: z.ZodObject;
  body?: z.ZodType;
  /** Extra request media types with the same schema (e.g. NDJSON for batches). */
  bodyAlso?: Array<{ contentType: string; schema: z.ZodType; description?: string }>;
  responses: ApiResponse[];
  /** Codes beyond the ones implied by `need`, body and paging. */
  errors?: string[];
  paged?: "cursor" | "since" | "before";
};

/** One tag of the API page. */
export type ApiGroup = { name: string; description: string; operations: ApiOperation[] };
