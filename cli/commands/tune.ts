import { z } from "zod";
import { distances, fitPreprocessor, logLossSmoothing, scalings, transformTable, tune, weightings, type Distance } from "@/lib/knn";
import { TableError, planFeatures, toTableInput } from "@/lib/knn/table";
import { readLabelled } from "../csv";
import { CliError, parseFlags } from "../errors";
import { parseOptions } from "./suggest";

const list = <T extends z.ZodType>(item: T) =>
  z.string().transform((s, ctx) => {
    const parts = s.split(",").map((p) => p.trim()).filter((p) => p !== "");
    const out: z.infer<T>[] = [];
    for (const p of parts) {
      const r = item.safeParse(p);
      if (!r.success) {
        ctx.addIssue({ code: "custom", message: `'${p}' is not valid: ${r.error.issues[0].message}` });
        return z.NEVER;
      }
      out.push(r.data);
    }
    if (out.length === 0) ctx.addIssue({ code: "custom", message: "empty list" });
    return out;
  });

const flagsSchema = z.object({
  labelled: z.string().min(1),
  k: list(z.coerce.number().int().positive()).default(Array.from({ length: 26 }, (_, i) => 2 * i + 1)),
  distance: list(z.enum(distances)).default(["euclidean"]),
  scaling: z.enum(scalings).default("zscore"),
  weighting: z.enum(weightings).default("uniform"),
  "id-column": z.string().min(1).default("id"),
  "label-column": z.string().min(1).default("label"),
});

/** Leave-one-out accuracy, log-loss and macro-F1 for every k and distance, as one JSON object. */
export async function runTune(args: string[]): Promise<void> {
  const o = parseOptions(flagsSchema, parseFlags(args, Object.keys(flagsSchema.shape)));
  const labelled = readLabelled(o.labelled, o["id-column"], o["label-column"]);
  const features = planFeatures(labelled.table.columns, labelled.table.rows, [o["id-column"], o["label-column"]]);
  if (features.length === 0) throw new CliError(`${o.labelled} has no feature columns`);
  let x: Float32Array;
  let dim: number;
  try {
    const input = toTableInput(features, labelled.table.rows, o.labelled);
    const state = fitPreprocessor(input, o.scaling);
    x = transformTable(state, input);
    dim = state.width;
  } catch (error) {
    if (error instanceof TableError) throw new CliError(error.message);
    throw error;
  }
  const results = tune(
    { vectors: x, dim, classes: labelled.classIndex, numClasses: labelled.classes.length },
    { ks: o.k, distances: o.distance as Distance[], weighting: o.weighting },
  ).map(({ k, distance, accuracy, correct, n, logLoss, macroF1 }) => ({ k, distance, accuracy, correct, n, logLoss, macroF1 }));
  process.stdout.write(`${JSON.stringify({ results, logLossSmoothing, weighting: o.weighting, scaling: o.scaling })}\n`);
}
