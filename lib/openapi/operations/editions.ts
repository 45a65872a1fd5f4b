import { z } from "zod";
import { diffQuerySchema } from "@/app/api/v1/projects/[projectId]/editions/[editionId]/diff/schema";
import { downloadQuerySchema } from "@/app/api/v1/projects/[projectId]/editions/[editionId]/download/schema";
import { createEditionSchema, listEditionsQuerySchema } from "@/app/api/v1/projects/[projectId]/editions/schema";
import { data, downloadLinkSchema, editionDetailSchema, editionDiffSchema, editionSummarySchema, nextCursorSchema } from "../responses";
import type { ApiGroup } from "../types";

const E = "/api/v1/projects/{projectId}/editions";

export const editionsGroup: ApiGroup = {
  name: "Editions",
  description: "Frozen, versioned exports of the final labels (CSV, JSON Lines, Parquet and a manifest with SHA-256 of each file). Immutable; only site admins delete.",
  operations: [
    {
      method: "get",
      path: E,
      tag: "Editions",
      summary: "List editions",
      description: "Newest first.",
      need: "viewer",
      query: listEditionsQuerySchema,
      paged: "cursor",
      responses: [{ status: 200, description: "A page of editions.", schema: z.object({ data: z.array(editionSummarySchema), nextCursor: nextCursorSchema }) }],
      errors: ["bad_request:cursor"],
    },
    {
      method: "post",
      path: E,
      tag: "Editions",
      summary: "Publish an edition",
      description: "Creates the next edition as `pending`; a background job freezes the labels and writes the files, then e-mails you. Poll the edition until `status` is `succeeded`.",
      need: "owner",
      body: createEditionSchema,
      responses: [{ status: 202, description: "Accepted; the files follow from the job.", schema: data(editionSummarySchema) }],
    },
    { method: "get", path: `${E}/{editionId}`, tag: "Editions", summary: "Read an edition and its manifest", need: "viewer", responses: [{ status: 200, description: "The edition.", schema: data(editionDetailSchema) }], errors: ["not_found:edition"] },
    { method: "delete", path: `${E}/{editionId}`, tag: "Editions", summary: "Delete an edition", description: "Site admins only; audit-logged, its files removed.", need: "admin", responses: [{ status: 204, description: "Deleted." }], errors: ["not_found:edition"] },
    {
      method: "get",
      path: `${E}/{editionId}/download`,
      tag: "Editions",
      summary: "Get a download link",
      description: "A short-lived presigned URL for one file of a published edition; fetch it without the Authorization header.",
      need: "viewer",
      query: downloadQuerySchema,
      responses: [{ status: 200, description: "The link.", schema: downloadLinkSchema }],
      errors: ["not_found:edition", "not_found:edition_file", "conflict:edition_not_ready"],
    },
    {
      method: "get",
      path: `${E}/{editionId}/diff`,
      tag: "Editions",
      summary: "Compare with an earlier edition",
      description: "Items added, removed and relabelled since edition `against`; `format=csv` answers a download link of the full list instead.",
      need: "viewer",
      query: diffQuerySchema,
      responses: [{ status: 200, description: "The diff (JSON), or with `format=csv` a download link.", schema: z.union([data(editionDiffSchema), downloadLinkSchema]) }],
      errors: ["not_found:edition", "conflict:edition_not_ready"],
    },
  ],
};
