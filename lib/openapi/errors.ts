import { z } from "zod";
import { statusByKind } from "@/lib/errors";

/** The one error body every route answers with (lib/http/route.ts `errorResponse`). */
export const errorBodySchema = z
  .object({
    error: z.object({
      code: z.string().meta({ description: "Stable `kind:subject` code; branch on this, not on the message.", example: "forbidden:role" }),
      message: z.string().meta({ description: "A human sentence, safe to show.", example: "This needs the owner role in this project." }),
      fields: z
        .array(z.object({ path: z.string().meta({ example: "classes.0.name" }), message: z.string() }))
        .optional()
        .meta({ description: "Validation failures (422 `bad_request:validation`): one entry per field." }),
      details: z.unknown().optional().meta({ description: "Extra facts for some codes, e.g. `retryAfter` seconds, or the ruling that stands." }),
    }),
  })
  .meta({ id: "Error", description: "Every 4xx and 5xx answer has this shape." });

/** HTTP status of each error kind (lib/errors.ts), plus the 500 that route.ts answers for unexpected errors. */
const statusOfKind: Record<string, number> = { ...statusByKind, internal: 500 };

export function statusOfCode(code: string): number {
  if (code === "bad_request:validation") return 422;
  const status = statusOfKind[code.split(":")[0]];
  if (!status) throw new Error(`unknown error kind in ${code}`);
  return status;
}

/** The stable codes and what they mean; the API page lists them. */
export const errorCatalogue: Record<string, string> = {
  "bad_request:validation": "A query parameter or body field failed its schema; see `fields`.",
  "bad_request:json": "The body is not valid JSON (or not the expected JSON shape).",
  "bad_request:cursor": "The paging cursor was tampered with or belongs to another listing.",
  "bad_request:class": "classId is not a label class of this project.",
  "bad_request:take": "via \"take\" was sent with a class other than the suggestion's top class.",
  "bad_request:suggestion_token": "The suggestion token was not issued by this server for this item and caller.",
  "bad_request:items": "The batch is empty or holds something that is not a JSON object.",
  "bad_request:columns": "Columns have no roles yet.",
  "bad_request:uploads": "The uploads do not fit the import (one table file at a time).",
  "bad_request:empty_file": "The announced file is empty.",
  "bad_request:file": "The uploaded file could not be read.",
  "unauthorized:auth": "No session and no API token.",
  "unauthorized:token": "The API token is malformed, unknown or revoked.",
  "forbidden:role": "Your role in this project is below what the operation needs.",
  "forbidden:admin": "Only site admins may do this.",
  "forbidden:token": "Tokens cannot create tokens; sign in to the app for that.",
  "not_found:project": "No such project, or you are not a member (both look the same).",
  "not_found:item": "No such item in this project.",
  "not_found:label": "You have no label on this item to undo.",
  "not_found:dispute": "No such dispute in this project.",
  "not_found:edition": "No such edition in this project.",
  "not_found:edition_file": "The edition has no file in that format.",
  "not_found:import": "No such import in this project.",
  "not_found:upload": "No such upload in this project.",
  "not_found:error_report": "The import has no error report.",
  "not_found:invitation": "No such open invitation.",
  "not_found:member": "No such member of this project.",
  "not_found:token": "No such token of yours.",
  "not_found:user": "No such user.",
  "conflict:already_labelled": "You have already labelled this item.",
  "conflict:item_closed": "The item has a final label or waits in Disputes.",
  "conflict:item_full": "The item already has all the labels it needs.",
  "conflict:submission_reused": "clientSubmissionId was already used for another item.",
  "conflict:undo_window": "The undo window has passed.",
  "conflict:undo_reviewed": "A reviewer is handling the item; it can no longer be undone.",
  "conflict:already_ruled": "Another reviewer ruled first; `details.ruling` holds the ruling that stands.",
  "conflict:dispute_open": "The item already has an open dispute.",
  "conflict:edition_not_ready": "The edition is not published yet (pending, running or failed).",
  "conflict:import": "The import has already finished.",
  "conflict:upload": "The bytes are not in the bucket, or their size differs from the announced one.",
  "conflict:last_owner": "A project keeps at least one owner.",
  "conflict:member": "The person is already a member.",
  "conflict:invitation": "An invitation to that address is already open.",
  "conflict:self": "You cannot do this to yourself.",
  "too_large:body": "The request body is over the size limit.",
  "too_large:batch": "The batch holds more than 10 000 items.",
  "too_large:upload": "The file is over the upload limit.",
  "rate_limited:auth": "Too many requests; wait `Retry-After` seconds.",
  "unavailable:database": "The database is restarting; retry after `Retry-After` seconds.",
  "internal:error": "An unexpected server error.",
};

/** Codes any authenticated route may answer. */
export const authCodes = ["unauthorized:auth", "unauthorized:token", "rate_limited:auth"];
/** Codes any project-scoped route may answer. */
export const projectCodes = [...authCodes, "not_found:project", "forbidden:role"];
