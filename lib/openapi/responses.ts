import { z } from "zod";
import { suggestionNeighbourSchema, suggestionResponseSchema } from "@/app/api/v1/projects/[projectId]/items/[itemId]/suggestion/schema";
import { includeSources, splitNames } from "@/lib/editions/options";
import { projectSettingsSchema } from "@/lib/projects/settings";

// Response shapes the routes build by hand; objects are loose, so new fields never break a client.
const iso = () => z.iso.datetime().meta({ example: "2025-03-04T10:15:00.000Z" });
const role = z.enum(["owner", "reviewer", "annotator", "viewer"]);

export const nextCursorSchema = z.string().nullable().meta({
  description: "Opaque, signed cursor of the next page; pass it back as `cursor`. `null` on the last page.",
});

export const projectSummarySchema = z
  .looseObject({
    id: z.number().int(),
    name: z.string(),
    description: z.string(),
    createdAt: iso(),
    role: role.nullable().meta({ description: "Your role; null for site admins who are not members." }),
    itemCount: z.number().int(),
    decidedCount: z.number().int().meta({ description: "Items with a final label." }),
    memberCount: z.number().int(),
  })
  .meta({ id: "ProjectSummary" });

export const labelClassSchema = z
  .looseObject({ id: z.number().int(), name: z.string(), colour: z.string(), keyHint: z.number().int().nullable(), position: z.number().int() })
  .meta({ id: "LabelClass" });

export const projectDetailSchema = z
  .looseObject({
    id: z.number().int(),
    name: z.string(),
    description: z.string(),
    settings: projectSettingsSchema,
    featureSchema: z.unknown().meta({ description: "Columns and kinds fixed by the first import; null before it." }),
    createdAt: iso(),
    classes: z.array(labelClassSchema),
    role: role.nullable(),
  })
  .meta({ id: "ProjectDetail" });

const itemStatus = z.string().meta({ description: "unlabelled, in_progress, agreed, disputed, ruled, single or control." });

export const itemRowSchema = z
  .looseObject({
    id: z.number().int(),
    externalId: z.string(),
    status: itemStatus,
    isControl: z.boolean(),
    labelCount: z.number().int(),
    finalClassId: z.number().int().nullable(),
    priorClassId: z.number().int().nullable(),
    poolTopClassId: z.number().int().nullable(),
    poolTopShare: z.number().nullable().meta({ description: "The top class's vote share in the pool ranking." }),
    seq: z.number().int(),
    fields: z.record(z.string(), z.unknown()),
  })
  .meta({ id: "ItemRow" });

export const itemDetailSchema = z
  .looseObject({
    item: itemRowSchema.extend({
      finalSource: z.string().nullable(),
      importId: z.string().nullable(),
      createdAt: iso(),
      features: z.unknown(),
      imageUrl: z.string().nullable(),
      thumbUrl: z.string().nullable(),
    }),
    labels: z.array(z.looseObject({ id: z.number().int(), classId: z.number().int(), className: z.string(), annotator: z.string() })),
    disputes: z.array(z.looseObject({ id: z.number().int() })),
  })
  .meta({ id: "ItemDetail" });

export const batchResultSchema = z
  .looseObject({
    importId: z.string().meta({ description: "The import row that records this batch." }),
    received: z.number().int(),
    created: z.number().int(),
    skipped: z.number().int().meta({ description: "Items whose external id already existed (the batch is idempotent)." }),
  })
  .meta({ id: "BatchResult" });

export const syncedLabelSchema = z
  .looseObject({
    id: z.number().int(),
    itemId: z.number().int(),
    externalId: z.string(),
    classId: z.number().int(),
    annotatorKey: z.string().meta({ description: "A stable pseudonym of the annotator in this project." }),
    annotator: z.object({ id: z.string(), name: z.string().nullable() }).optional().meta({ description: "Only for reviewers, owners and site admins." }),
    tookSuggestion: z.boolean(),
    suggestion: z.unknown().meta({ description: "The suggestion snapshot shown when labelling (vote shares), or null." }),
    createdAt: iso(),
    undoneAt: iso().nullable(),
  })
  .meta({ id: "SyncedLabel" });

export const labelViewSchema = z
  .looseObject({
    id: z.number().int(),
    itemId: z.number().int(),
    classId: z.number().int(),
    tookSuggestion: z.boolean(),
    createdAt: iso(),
    undoneAt: iso().nullable(),
    undoUntil: iso(),
  })
  .meta({ id: "Label" });

export const deskItemSchema = z
  .looseObject({
    itemId: z.number().int(),
    externalId: z.string(),
    fields: z.record(z.string(), z.unknown()),
    imageUrl: z.string().nullable(),
    leasedUntil: iso(),
    suggestion: z
      .looseObject({
        topClassId: z.number().int().nullable(),
        shares: z.record(z.string(), z.number()).meta({ description: "Class id → vote share; every class is listed." }),
        k: z.number().int(),
        neighbours: z.array(suggestionNeighbourSchema),
      })
      .nullable(),
    suggestionToken: z.string().nullable().meta({ description: "Send it back with the label so the shown vote shares are stored with it." }),
  })
  .meta({ id: "DeskItem" });

export const suggestionSchema = suggestionResponseSchema.meta({ id: "Suggestion" });

const fileInfo = z.object({ bytes: z.number().int(), sha256: z.string() });
const sourceCounts = z.object(Object.fromEntries(includeSources.map((s) => [s, z.number().int()])) as Record<(typeof includeSources)[number], z.ZodNumber>);

export const editionSummarySchema = z
  .looseObject({
    id: z.number().int(),
    number: z.number().int(),
    status: z.enum(["pending", "running", "succeeded", "failed", "cancelled"]).meta({ description: "`succeeded` means published: the files can be downloaded." }),
    options: z.looseObject({ include: z.array(z.enum(includeSources)), split: z.unknown(), annotatorIdentity: z.enum(["id", "email"]) }),
    message: z.string().nullable(),
    createdAt: iso(),
    publishedAt: iso().nullable(),
    createdBy: z.object({ id: z.string(), name: z.string().nullable() }).nullable(),
    rows: z.number().int().nullable(),
    counts: z.object({ byClass: z.record(z.string(), z.number().int()), bySource: sourceCounts }).nullable(),
    files: z.object({ csv: fileInfo, jsonl: fileInfo, parquet: fileInfo }).nullable(),
  })
  .meta({ id: "EditionSummary" });

export const editionDetailSchema = editionSummarySchema
  .extend({
    manifest: z
      .looseObject({
        format: z.literal("vicinal-edition/1"),
        edition: z.number().int(),
        counts: z.looseObject({ rows: z.number().int() }),
        split: z.looseObject({ seed: z.number().int(), fractions: z.record(z.enum(splitNames), z.number()) }).nullable(),
      })
      .nullable()
      .meta({ description: "Project, edition, creator, counts per class and label source, k-NN settings, agreement, feature schema, SHA-256 of each file." }),
  })
  .meta({ id: "EditionDetail" });

export const downloadLinkSchema = z
  .object({ url: z.string().meta({ description: "Presigned GET URL; no Authorization header needed." }), expiresAt: iso() })
  .meta({ id: "DownloadLink" });

const indexEntry = z.object({ id: z.string(), label: z.string().nullable(), source: z.string() }).nullable();
export const editionDiffSchema = z
  .object({
    from: z.object({ id: z.number().int(), number: z.number().int() }),
    to: z.object({ id: z.number().int(), number: z.number().int() }),
    counts: z.object({ before: z.number().int(), after: z.number().int(), added: z.number().int(), removed: z.number().int(), relabelled: z.number().int(), unchanged: z.number().int() }),
    changes: z.array(z.object({ externalId: z.string(), change: z.enum(["added", "removed", "relabelled"]), before: indexEntry, after: indexEntry })),
    truncated: z.boolean().meta({ description: "True when more changes exist than `limit`; get them all with `format=csv`." }),
  })
  .meta({ id: "EditionDiff" });

export const tokenSchema = z
  .looseObject({ id: z.number().int(), name: z.string(), prefix: z.string(), createdAt: iso(), lastUsedAt: iso().nullable(), revokedAt: iso().nullable() })
  .meta({ id: "ApiToken" });

export const tokenCreatedSchema = z
  .looseObject({ id: z.number().int(), name: z.string(), prefix: z.string(), createdAt: iso(), secret: z.string().meta({ description: "`vcn_…`: shown in this answer only.", example: "vcn_…" }) })
  .meta({ id: "ApiTokenCreated" });

export const meSchema = z
  .object({ id: z.string(), email: z.string(), name: z.string().nullable(), isAdmin: z.boolean(), via: z.enum(["session", "token"]) })
  .meta({ id: "Me" });

/** `{ data: … }` — the envelope of most answers. */
export const data = <T extends z.ZodType>(schema: T) => z.object({ data: schema });

/** For answers described in words only: an object whose fields the route's own documentation lists. */
export const looseData = (description: string) => z.object({ data: z.looseObject({}).meta({ description }) });

export const auditPageSchema = z.object({
  data: z.array(z.looseObject({ id: z.number().int(), action: z.string(), createdAt: iso() }).meta({ description: "Who, what, when, before and after." })),
  nextBefore: z.number().int().nullable().meta({ description: "Pass as `before` for the next (older) page; null on the last page." }),
});
