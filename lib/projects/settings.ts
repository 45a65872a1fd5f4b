import { z } from "zod";

// No runtime code generation: the page CSP forbids eval, and zod would otherwise probe for it in the browser.
z.config({ jitless: true });

export const distanceSchema = z.enum(["euclidean", "manhattan", "cosine"]);
export const scalingSchema = z.enum(["zscore", "minmax", "none"]);
export const weightingSchema = z.enum(["uniform", "inverse"]);
export const queueOrderSchema = z.enum(["least_confident", "smallest_margin", "highest_entropy", "random", "import_order"]);
export const voterSourceSchema = z.enum(["ruling", "agreed", "single", "control"]);
export const missingValuesSchema = z.enum(["reject", "missing"]);

export const projectSettingsSchema = z.object({
  overlap: z.number().int().min(1).max(5),
  blindShare: z.number().min(0).max(1),
  controlRate: z.number().min(0).max(1),
  k: z.number().int().min(1).max(101),
  distance: distanceSchema,
  scaling: scalingSchema,
  weighting: weightingSchema,
  queueOrder: queueOrderSchema,
  voters: z.array(voterSourceSchema).min(1),
  missingValues: missingValuesSchema,
  disputeDigestThreshold: z.number().int().min(1).max(10_000),
  poolRerankEvery: z.number().int().min(1).max(100_000),
});

export type ProjectSettings = z.infer<typeof projectSettingsSchema>;
export type Distance = z.infer<typeof distanceSchema>;
export type QueueOrder = z.infer<typeof queueOrderSchema>;

export const defaultProjectSettings: ProjectSettings = {
  overlap: 2,
  blindShare: 0.1,
  controlRate: 0.05,
  k: 7,
  distance: "euclidean",
  scaling: "zscore",
  weighting: "uniform",
  queueOrder: "least_confident",
  voters: ["ruling", "agreed", "single", "control"],
  missingValues: "reject",
  disputeDigestThreshold: 10,
  poolRerankEvery: 25,
};

export const featureColumnSchema = z.object({
  name: z.string().min(1),
  kind: z.enum(["numeric", "categorical", "vector"]),
  /** Number of float32 slots this column takes in `items.vector` (1 for numeric, the length for vectors, 0 for categorical). */
  width: z.number().int().min(0),
  unit: z.string().optional(),
  categories: z.array(z.string()).optional(),
});

export const featureSchemaSchema = z.object({
  columns: z.array(featureColumnSchema),
  /** Total float32 slots per item vector. */
  dimension: z.number().int().min(0),
  source: z.enum(["table", "embedding", "image"]),
});

export type FeatureColumn = z.infer<typeof featureColumnSchema>;
export type FeatureSchema = z.infer<typeof featureSchemaSchema>;

/** The palette of label colours, Vicinal's own: muted earth and mineral tones that stay distinct for common colour-vision deficiencies. */
export const labelPalette = [
  { name: "Slate teal", value: "#2f7f86" },
  { name: "Ochre", value: "#c8922a" },
  { name: "Brick", value: "#b4533c" },
  { name: "Heather", value: "#7b5ea7" },
  { name: "Moss", value: "#5f8a3a" },
  { name: "Ink", value: "#35506b" },
  { name: "Clay", value: "#a8707e" },
  { name: "Lichen", value: "#8f9a52" },
  { name: "Dusk", value: "#5a6b8c" },
] as const;
