import { z } from "zod";
import { nextBodySchema, nextQuerySchema } from "@/app/api/v1/projects/[projectId]/desk/next/schema";
import { statsQuerySchema } from "@/app/api/v1/projects/[projectId]/desk/stats/schema";
import { rulingSchema } from "@/app/api/v1/projects/[projectId]/disputes/[disputeId]/ruling/schema";
import { disputesQuerySchema } from "@/app/api/v1/projects/[projectId]/disputes/schema";
import { flagSchema } from "@/app/api/v1/projects/[projectId]/items/[itemId]/flags/schema";
import { labelSchema } from "@/app/api/v1/projects/[projectId]/items/[itemId]/labels/schema";
import { labelsQuerySchema } from "@/app/api/v1/projects/[projectId]/labels/schema";
import { SYNC_SETTLE_SECONDS, UNDO_WINDOW_SECONDS } from "@/lib/labelling/constants";
import { data, deskItemSchema, labelViewSchema, looseData, nextCursorSchema, syncedLabelSchema } from "../responses";
import type { ApiGroup } from "../types";

const P = "/api/v1/projects/{projectId}";
const labelAnswer = data(z.object({ label: labelViewSchema, replayed: z.boolean() }));
const deskAnswer = z.object({ data: deskItemSchema.nullable().meta({ description: "null when nothing is left for you." }) });

export const labellingGroup: ApiGroup = {
  name: "Labelling",
  description: "The Desk loop (lease the next item, label it, undo within the window) and incremental sync of settled labels.",
  operations: [
    { method: "get", path: `${P}/desk/next`, tag: "Labelling", summary: "Lease my next item", description: "An item you already hold first, else a new lease, with its Suggestion (none on blind items).", need: "annotator", query: nextQuerySchema, responses: [{ status: 200, description: "The item, or null.", schema: deskAnswer }] },
    { method: "post", path: `${P}/desk/next`, tag: "Labelling", summary: "Lease my next item (body form)", description: "As GET, with `exclude` in a JSON body.", need: "annotator", body: nextBodySchema, responses: [{ status: 200, description: "The item, or null.", schema: deskAnswer }] },
    {
      method: "get",
      path: `${P}/desk/stats`,
      tag: "Labelling",
      summary: "Desk counters",
      need: "annotator",
      query: statsQuerySchema,
      responses: [{ status: 200, description: "Done today, remaining for you and in the project.", schema: data(z.looseObject({ overlap: z.number().int(), undoWindowSeconds: z.number().int() })) }],
    },
    {
      method: "post",
      path: `${P}/items/{itemId}/labels`,
      tag: "Labelling",
      summary: "Label an item",
      description: "Stores your label with the suggestion token you were shown. Retrying with the same `clientSubmissionId` answers 200 with the same label.",
      need: "annotator",
      body: labelSchema,
      responses: [
        { status: 201, description: "Stored.", schema: labelAnswer },
        { status: 200, description: "A replay of an earlier submission.", schema: labelAnswer },
      ],
      errors: ["not_found:item", "bad_request:class", "bad_request:take", "bad_request:suggestion_token", "conflict:already_labelled", "conflict:item_closed", "conflict:item_full", "conflict:submission_reused"],
    },
    {
      method: "delete",
      path: `${P}/items/{itemId}/labels`,
      tag: "Labelling",
      summary: "Undo my label",
      description: `Within ${UNDO_WINDOW_SECONDS} s of labelling; the item is leased back to you.`,
      need: "annotator",
      responses: [{ status: 200, description: "The undone label.", schema: data(z.object({ label: labelViewSchema })) }],
      errors: ["not_found:label", "conflict:undo_window", "conflict:undo_reviewed"],
    },
    {
      method: "post",
      path: `${P}/items/{itemId}/flags`,
      tag: "Labelling",
      summary: "Skip or flag an item",
      description: "The item leaves your queue; a flag needs a comment saying what is unclear.",
      need: "annotator",
      body: flagSchema,
      responses: [{ status: 201, description: "The flag.", schema: data(z.object({ id: z.number().int(), itemId: z.number().int(), kind: z.enum(["skip", "flag"]), comment: z.string().nullable(), createdAt: z.string() })) }],
      errors: ["not_found:item"],
    },
    {
      method: "get",
      path: `${P}/labels`,
      tag: "Labelling",
      summary: "Sync labels since a cursor",
      description: `Labels in id order, only those older than ${SYNC_SETTLE_SECONDS} s (settled: past the undo window), so a sync never misses or repeats one. Keep \`next\` and pass it as \`since\`; \`more\` says whether to ask again now.`,
      need: "viewer",
      query: labelsQuerySchema,
      paged: "since",
      responses: [
        {
          status: 200,
          description: "A page of settled labels.",
          schema: z.object({
            data: z.array(syncedLabelSchema),
            next: z.string().meta({ description: "Always present: the cursor to pass as `since` next time." }),
            more: z.boolean(),
            settleSeconds: z.number().int(),
          }),
        },
      ],
      errors: ["bad_request:cursor"],
    },
  ],
};

export const disputesGroup: ApiGroup = {
  name: "Disputes",
  description: "Items whose annotators disagreed (or that the owner doubted), and the reviewers' Rulings.",
  operations: [
    {
      method: "get",
      path: `${P}/disputes`,
      tag: "Disputes",
      summary: "List disputes",
      description: "Oldest first, by status, reason, class pair and age; each with its labels.",
      need: "reviewer",
      query: disputesQuerySchema,
      paged: "cursor",
      responses: [{ status: 200, description: "A page of disputes.", schema: z.object({ data: z.array(z.looseObject({ id: z.number().int(), itemId: z.number().int(), openedAt: z.string() })), total: z.number().int(), pairs: z.array(z.looseObject({})), next: nextCursorSchema }) }],
      errors: ["bad_request:cursor"],
    },
    { method: "get", path: `${P}/disputes/{disputeId}`, tag: "Disputes", summary: "Read a dispute", description: "The item, every label with its annotator, flags, the live suggestion and any ruling.", need: "reviewer", responses: [{ status: 200, description: "The dispute.", schema: looseData("dispute, item, flags, suggestion, ruling.") }], errors: ["not_found:dispute", "not_found:item"] },
    {
      method: "post",
      path: `${P}/disputes/{disputeId}/ruling`,
      tag: "Disputes",
      summary: "Issue a ruling",
      description: "Of two reviewers at once exactly one gets 201; the other 409 with the ruling that stands.",
      need: "reviewer",
      body: rulingSchema,
      responses: [{ status: 201, description: "The ruling.", schema: looseData("id, disputeId, classId, reason, reviewer, createdAt.") }],
      errors: ["not_found:dispute", "bad_request:class", "conflict:already_ruled"],
    },
  ],
};
