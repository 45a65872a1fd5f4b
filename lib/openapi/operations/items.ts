import { z } from "zod";
import { createImportSchema, previewSchema } from "@/app/api/v1/projects/[projectId]/imports/schema";
import { listItemsQuerySchema } from "@/app/api/v1/projects/[projectId]/items/schema";
import { completeUploadSchema } from "@/app/api/v1/projects/[projectId]/uploads/[uploadId]/complete/schema";
import { createUploadSchema } from "@/app/api/v1/projects/[projectId]/uploads/schema";
import { roleMappingSchema } from "@/lib/imports/types";
import { batchResultSchema, itemDetailSchema, itemRowSchema, nextCursorSchema } from "../responses";
import type { ApiGroup } from "../types";

const P = "/api/v1/projects/{projectId}";

// POST …/items parses its body by hand (lib/imports/batch.ts parseBatchBody); this is that contract.
const batchItem = z
  .looseObject({
    id: z.string().optional().meta({ description: "Your external id (also `externalId` or `external_id`); the batch is idempotent by it." }),
    priorLabel: z.string().optional().meta({ description: "A label name the item already carries, if any." }),
  })
  .meta({ description: "One item: its id and its feature fields (numbers, strings, or arrays for vectors).", example: { id: "sensor-0001", temperature: 21.4, humidity: 0.52 } });
const batchBody = z.object({
  items: z.array(batchItem).min(1).max(10_000),
  columns: roleMappingSchema.optional().meta({ description: "Column roles; without them the project's feature schema (or detection) decides." }),
});

const importView = z.looseObject({ id: z.string(), status: z.string(), format: z.string(), rowsTotal: z.number().int().nullable(), createdAt: z.string() });

export const itemsGroup: ApiGroup = {
  name: "Items",
  description: "Items in: batches from a pipeline, or file uploads and imports. Items out: filtered, sorted listing by cursor.",
  operations: [
    {
      method: "get",
      path: `${P}/items`,
      tag: "Items",
      summary: "List items",
      description: "Filter by status, label, vote share range or id search; sort by sequence, external id or top share.",
      need: "viewer",
      query: listItemsQuerySchema,
      paged: "cursor",
      responses: [{ status: 200, description: "A page of items and the filtered total.", schema: z.object({ items: z.array(itemRowSchema), nextCursor: nextCursorSchema, total: z.number().int().nullable() }) }],
      errors: ["bad_request:cursor"],
    },
    {
      method: "post",
      path: `${P}/items`,
      tag: "Items",
      summary: "Create items (batch)",
      description: "Up to 10 000 items per request, as JSON (`{ items, columns? }` or a bare array) or NDJSON (one item per line). All or nothing; items whose external id exists are skipped, so a retry is safe.",
      need: "owner",
      body: batchBody,
      bodyAlso: [{ contentType: "application/x-ndjson", schema: z.string(), description: "One JSON item per line." }],
      responses: [
        { status: 201, description: "At least one item was created.", schema: batchResultSchema },
        { status: 200, description: "Every item already existed; nothing was created.", schema: batchResultSchema },
      ],
      errors: ["bad_request:json", "bad_request:items", "too_large:batch", "too_large:body"],
    },
    { method: "get", path: `${P}/items/{itemId}`, tag: "Items", summary: "Read an item", description: "Fields, features, image links, labels and disputes.", need: "viewer", responses: [{ status: 200, description: "The item.", schema: itemDetailSchema }], errors: ["not_found:item"] },
    {
      method: "post",
      path: `${P}/uploads`,
      tag: "Items",
      summary: "Start a file upload",
      description: "Registers a file and answers where to PUT it: one presigned URL (`mode: single`) or one per part (`mode: multipart`).",
      need: "owner",
      body: createUploadSchema,
      responses: [{ status: 201, description: "Where to PUT the bytes.", schema: z.looseObject({ upload: z.object({ id: z.string(), fileName: z.string(), size: z.number().int() }), mode: z.enum(["single", "multipart"]), url: z.string().optional() }) }],
      errors: ["bad_request:empty_file", "too_large:upload"],
    },
    {
      method: "post",
      path: `${P}/uploads/{uploadId}/complete`,
      tag: "Items",
      summary: "Complete a file upload",
      description: "After the PUT: joins multipart parts and checks the stored size.",
      need: "owner",
      body: completeUploadSchema,
      responses: [{ status: 200, description: "The upload, now `uploaded`.", schema: z.object({ upload: z.looseObject({ id: z.string(), fileName: z.string(), size: z.number().int(), status: z.string() }) }) }],
      errors: ["not_found:upload", "conflict:upload", "too_large:upload"],
    },
    { method: "post", path: `${P}/imports/preview`, tag: "Items", summary: "Preview uploads", description: "Detects format and column roles and returns the first rows.", need: "owner", body: previewSchema, responses: [{ status: 200, description: "The preview.", schema: z.object({ preview: z.looseObject({}) }) }], errors: ["not_found:upload", "bad_request:file"] },
    { method: "get", path: `${P}/imports`, tag: "Items", summary: "List imports", need: "owner", responses: [{ status: 200, description: "The project's imports, newest first.", schema: z.object({ imports: z.array(importView) }) }] },
    {
      method: "post",
      path: `${P}/imports`,
      tag: "Items",
      summary: "Start an import",
      description: "Queues an import of uploaded files with the column roles; poll the import for progress.",
      need: "owner",
      body: createImportSchema,
      responses: [{ status: 202, description: "Queued.", schema: z.object({ import: importView }) }],
      errors: ["not_found:upload", "bad_request:uploads", "bad_request:columns"],
    },
    { method: "get", path: `${P}/imports/{importId}`, tag: "Items", summary: "Read an import", description: "Status, progress and the first problems found.", need: "owner", responses: [{ status: 200, description: "The import.", schema: z.object({ import: importView }) }], errors: ["not_found:import"] },
    { method: "post", path: `${P}/imports/{importId}/cancel`, tag: "Items", summary: "Cancel an import", need: "owner", responses: [{ status: 200, description: "The import, cancelling.", schema: z.object({ import: importView }) }], errors: ["not_found:import", "conflict:import"] },
    {
      method: "get",
      path: `${P}/imports/{importId}/errors`,
      tag: "Items",
      summary: "Download an import's error list",
      description: "A 302 redirect to a short-lived CSV link; with `format=json` the link as JSON.",
      need: "owner",
      query: z.object({ format: z.enum(["json"]).optional().meta({ description: "`json` answers `{ url }` instead of redirecting." }) }),
      responses: [
        { status: 200, description: "With `format=json`: the link.", schema: z.object({ url: z.string() }) },
        { status: 302, description: "Redirect to the CSV (Location header)." },
      ],
      errors: ["not_found:import", "not_found:error_report"],
    },
  ],
};
