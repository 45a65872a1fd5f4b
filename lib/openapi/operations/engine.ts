import { z } from "zod";
import { agreementSummaryQuerySchema } from "@/app/api/v1/projects/[projectId]/dashboard/agreement/schema";
import { dashboardQuerySchema } from "@/app/api/v1/projects/[projectId]/dashboard/schema";
import { sendToDisputesSchema } from "@/app/api/v1/projects/[projectId]/doubts/[itemId]/dispute/schema";
import { recomputeDoubtsSchema } from "@/app/api/v1/projects/[projectId]/doubts/schema";
import { mapQuerySchema } from "@/app/api/v1/projects/[projectId]/map/schema";
import { startTuningSchema } from "@/app/api/v1/projects/[projectId]/tuning/schema";
import { data, looseData, suggestionSchema } from "../responses";
import type { ApiGroup } from "../types";

const P = "/api/v1/projects/{projectId}";
const report = data(z.looseObject({ report: z.looseObject({ status: z.string() }).meta({ description: "Status, progress and (when succeeded) the result." }) }));

export const engineGroup: ApiGroup = {
  name: "Suggestions",
  description: "The k-nearest-neighbour engine: an item's Suggestion with every class's vote share, Tuning, Doubts and the Map.",
  operations: [
    {
      method: "get",
      path: `${P}/items/{itemId}/suggestion`,
      tag: "Suggestions",
      summary: "Read an item's Suggestion",
      description: "Vote shares of every class among the k nearest labelled neighbours, with the neighbours. Blind-share items show annotators `{ blind: true }` only.",
      need: "annotator",
      responses: [{ status: 200, description: "The suggestion.", schema: data(suggestionSchema) }],
      errors: ["not_found:item"],
    },
    { method: "get", path: `${P}/tuning`, tag: "Suggestions", summary: "Read the Tuning result", description: "The latest leave-one-out run and the settings in force.", need: "owner", responses: [{ status: 200, description: "The latest report.", schema: looseData("report, version, voters, settings { k, distance, weighting }.") }] },
    { method: "post", path: `${P}/tuning`, tag: "Suggestions", summary: "Start Tuning", description: "Inline for small labelled sets (201), otherwise a job (202).", need: "owner", body: startTuningSchema, responses: [{ status: 201, description: "Computed inline.", schema: report }, { status: 202, description: "Queued; poll GET.", schema: report }] },
    { method: "get", path: `${P}/doubts`, tag: "Suggestions", summary: "Read Doubts", description: "Items whose final label most of their neighbours disagree with.", need: "owner", responses: [{ status: 200, description: "The latest list.", schema: looseData("report, version, classes, items, openDisputes.") }] },
    { method: "post", path: `${P}/doubts`, tag: "Suggestions", summary: "Recompute Doubts", need: "owner", body: recomputeDoubtsSchema, responses: [{ status: 201, description: "Computed inline.", schema: report }, { status: 202, description: "Queued.", schema: report }] },
    {
      method: "post",
      path: `${P}/doubts/{itemId}/dispute`,
      tag: "Suggestions",
      summary: "Send a doubted item to Disputes",
      need: "owner",
      body: sendToDisputesSchema,
      responses: [{ status: 201, description: "The new dispute.", schema: data(z.object({ disputeId: z.number().int(), itemId: z.number().int(), status: z.string(), reason: z.string() })) }],
      errors: ["not_found:item", "conflict:dispute_open"],
    },
    { method: "get", path: `${P}/map`, tag: "Suggestions", summary: "Read the Map", description: "A PCA picture of the items with their votes, recomputed when stale.", need: "viewer", query: mapQuerySchema, responses: [{ status: 200, description: "The map.", schema: looseData("report, version, classes.") }] },
  ],
};

export const insightGroup: ApiGroup = {
  name: "Dashboard",
  description: "Where the project stands: progress, class balance, labels per day, suggestion use, agreement.",
  operations: [
    { method: "get", path: `${P}/dashboard`, tag: "Dashboard", summary: "Read the dashboard", description: "Numbers by SQL aggregation. Annotator names only for owners and reviewers.", need: "viewer", query: dashboardQuerySchema, responses: [{ status: 200, description: "The dashboard figures.", schema: looseData("progress, classBalance, perDay, suggestionUse, disputes.") }] },
    { method: "get", path: `${P}/dashboard/agreement`, tag: "Dashboard", summary: "Agreement summary", description: "Headline coefficients with bootstrap 95% intervals and their bands.", need: "viewer", query: agreementSummaryQuerySchema, responses: [{ status: 200, description: "The summary.", schema: looseData("coefficients with value, ci95 and band.") }] },
    { method: "get", path: `${P}/agreement`, tag: "Dashboard", summary: "Agreement report", description: "The full agreement report (cached per k-NN version; `stale: true` while a large project recomputes).", need: "viewer", responses: [{ status: 200, description: "The report.", schema: looseData("percent agreement, Krippendorff's alpha, Fleiss' kappa, per-class and per-annotator figures.") }] },
  ],
};
